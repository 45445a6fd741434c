import type { DropCount, RowDrops } from './dataset-types.ts';

/** A numeric column as the row policy sees it: values plus the table's missing mask. */
export interface UsedColumn {
  /** Name reported in the drop counts (a complex column reports once, under its own name). */
  name: string;
  parts: Float64Array[];
  missing: Uint8Array;
}

/** Why a row is left out, first reason first: 0 kept, 1 a missing cell, 2 a value that is not finite. */
export const ROW_KEPT = 0;
export const ROW_MISSING = 1;
export const ROW_NON_FINITE = 2;

/**
 * The row policy every stage applies: rows whose every used cell is present and finite. Each
 * offending cell is counted under its column and reason ('missing': empty/NA in the file, 'nan',
 * 'infinite'); each row once under its first reason in `reason` (ROW_MISSING before
 * ROW_NON_FINITE) and in the totals `rows`. Stages add their own later reasons (rhs ≤ 0, …).
 */
export function validRows(
  n: number,
  used: readonly UsedColumn[],
): { keep: Uint8Array; dropped: DropCount[]; invalidRows: number; reason: Uint8Array; rows: RowDrops } {
  const reason = new Uint8Array(n);
  const keep = new Uint8Array(n).fill(1);
  const dropped: DropCount[] = [];
  for (const col of used) {
    let miss = 0;
    let nan = 0;
    let inf = 0;
    for (let i = 0; i < n; i++) {
      if (col.missing[i]) {
        miss++;
        keep[i] = 0;
        reason[i] = ROW_MISSING;
        continue;
      }
      let bad: 0 | 1 | 2 = 0;
      for (let q = 0; q < col.parts.length; q++) {
        const v = col.parts[q]![i]!;
        if (v - v !== 0) {
          // NaN or ±Infinity (v − v is NaN for both)
          if (Number.isNaN(v)) {
            bad = 1;
            break;
          }
          bad = 2;
        }
      }
      if (bad === 1) nan++;
      else if (bad === 2) inf++;
      if (bad) {
        keep[i] = 0;
        if (reason[i] === ROW_KEPT) reason[i] = ROW_NON_FINITE;
      }
    }
    if (miss) dropped.push({ column: col.name, reason: 'missing', rows: miss });
    if (nan) dropped.push({ column: col.name, reason: 'nan', rows: nan });
    if (inf) dropped.push({ column: col.name, reason: 'infinite', rows: inf });
  }
  const rows: RowDrops = { total: 0, missing: 0, nonFinite: 0 };
  for (let i = 0; i < n; i++) {
    if (reason[i] === ROW_MISSING) rows.missing++;
    else if (reason[i] === ROW_NON_FINITE) rows.nonFinite++;
  }
  rows.total = rows.missing + rows.nonFinite;
  return { keep, dropped, invalidRows: rows.total, reason, rows };
}

/** Mix one 32-bit word into a running hash (the 32-bit finalizer steps of MurmurHash3, A. Appleby). */
function mix(h: number, w: number): number {
  h = Math.imul(h ^ w, 0xcc9e2d51);
  h = (h << 15) | (h >>> 17);
  return Math.imul(h, 0x1b873593);
}

function mixString(h: number, s: string): number {
  for (let k = 0; k < s.length; k++) h = Math.imul(h ^ s.charCodeAt(k), 0x01000193);
  return mix(h, s.length);
}

/** One key column for duplicate detection: numbers (values compared with ===) or strings. */
export type KeyColumn = ({ numbers: Float64Array } | { strings: string[] }) & { missing?: Uint8Array };

/**
 * Among the rows with keep[i] = 1, mark later repeats (equal in every key column) as not kept.
 * Hash buckets with exact comparison on collision, so equal rows are never missed and unequal rows
 * are never merged. A row with a missing key cell is never a duplicate. Returns the number of rows
 * dropped as duplicates.
 */
export function dropDuplicates(keep: Uint8Array, keys: KeyColumn[]): number {
  const n = keep.length;
  const nums = keys.filter((k): k is { numbers: Float64Array } & { missing?: Uint8Array } => 'numbers' in k).map((k) => k.numbers);
  const strs = keys.filter((k): k is { strings: string[] } & { missing?: Uint8Array } => 'strings' in k).map((k) => k.strings);
  const masks = keys.map((k) => k.missing).filter((m): m is Uint8Array => m !== undefined);
  // rows taking part: kept, with every key cell present
  const active = keep.slice();
  for (const m of masks) for (let i = 0; i < n; i++) if (m[i]) active[i] = 0;
  // hash column by column over the bit patterns (0 and -0 hash alike, as they compare equal)
  const hash = new Int32Array(n).fill(0x2f1b3c4d);
  for (const col of nums) {
    const words = new Uint32Array(col.buffer, col.byteOffset, col.length * 2);
    for (let i = 0; i < n; i++) {
      if (!active[i]) continue;
      const zero = col[i] === 0;
      hash[i] = mix(mix(hash[i]!, zero ? 0 : words[2 * i]!), zero ? 0 : words[2 * i + 1]!);
    }
  }
  for (const col of strs) for (let i = 0; i < n; i++) if (active[i]) hash[i] = mixString(hash[i]!, col[i] ?? '');
  const same = (a: number, b: number): boolean => {
    for (let c = 0; c < nums.length; c++) if (nums[c]![a] !== nums[c]![b]) return false;
    for (let c = 0; c < strs.length; c++) if (strs[c]![a] !== strs[c]![b]) return false;
    return true;
  };
  // open addressing with linear probing; slot holds the first row of each distinct key
  let count = 0;
  for (let i = 0; i < n; i++) count += active[i]!;
  let cap = 16;
  while (cap < 2 * count) cap *= 2;
  const mask = cap - 1;
  const slot = new Int32Array(cap).fill(-1);
  const slotHash = new Int32Array(cap);
  let dups = 0;
  for (let i = 0; i < n; i++) {
    if (!active[i]) continue;
    const h = hash[i]!;
    let s = (h ^ (h >>> 16)) & mask;
    for (;;) {
      const j = slot[s]!;
      if (j < 0) {
        slot[s] = i;
        slotHash[s] = h;
        break;
      }
      if (slotHash[s] === h && same(i, j)) {
        keep[i] = 0;
        dups++;
        break;
      }
      s = (s + 1) & mask;
    }
  }
  return dups;
}
