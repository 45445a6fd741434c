import type { DropCount } from './dataset-types.ts';

/** A numeric column as the row policy sees it: values plus the table's missing mask. */
export interface UsedColumn {
  /** Name reported in the drop counts (a complex column reports once, under its own name). */
  name: string;
  parts: Float64Array[];
  missing: Uint8Array;
}

/**
 * Rows whose every used cell is present and finite. Each offending cell is counted under its
 * column and reason: 'missing' (empty/NA in the file), 'nan', or 'infinite'.
 */
export function validRows(n: number, used: UsedColumn[]): { keep: Uint8Array; dropped: DropCount[]; invalidRows: number } {
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
      if (bad) keep[i] = 0;
    }
    if (miss) dropped.push({ column: col.name, reason: 'missing', rows: miss });
    if (nan) dropped.push({ column: col.name, reason: 'nan', rows: nan });
    if (inf) dropped.push({ column: col.name, reason: 'infinite', rows: inf });
  }
  let invalidRows = 0;
  for (let i = 0; i < n; i++) if (!keep[i]) invalidRows++;
  return { keep, dropped, invalidRows };
}

const f64 = new Float64Array(1);
const u32 = new Uint32Array(f64.buffer);

function mixNumber(h: number, v: number): number {
  f64[0] = v + 0; // -0 and 0 hash alike, as they compare equal
  h = Math.imul(h ^ u32[0]!, 0x85ebca6b);
  h = Math.imul(h ^ (h >>> 13) ^ u32[1]!, 0xc2b2ae35);
  return h ^ (h >>> 16);
}

function mixString(h: number, s: string): number {
  for (let k = 0; k < s.length; k++) h = Math.imul(h ^ s.charCodeAt(k), 0x01000193);
  return Math.imul(h ^ 0xff, 0x27d4eb2d);
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
  // first row seen per hash; rows with the same hash but different values go to `more`
  const first = new Map<number, number>();
  const more = new Map<number, number[]>();
  let dups = 0;
  const nums = keys.filter((k): k is { numbers: Float64Array } & { missing?: Uint8Array } => 'numbers' in k).map((k) => k.numbers);
  const strs = keys.filter((k): k is { strings: string[] } & { missing?: Uint8Array } => 'strings' in k).map((k) => k.strings);
  const masks = keys.map((k) => k.missing).filter((m): m is Uint8Array => m !== undefined);
  const same = (a: number, b: number): boolean => {
    for (let c = 0; c < nums.length; c++) if (nums[c]![a] !== nums[c]![b]) return false;
    for (let c = 0; c < strs.length; c++) if (strs[c]![a] !== strs[c]![b]) return false;
    return true;
  };
  rows: for (let i = 0; i < n; i++) {
    if (!keep[i]) continue;
    for (let c = 0; c < masks.length; c++) if (masks[c]![i]) continue rows;
    let h = 0x9e3779b9;
    for (let c = 0; c < nums.length; c++) h = mixNumber(h, nums[c]![i]!);
    for (let c = 0; c < strs.length; c++) h = mixString(h, strs[c]![i] ?? '');
    const j = first.get(h);
    if (j === undefined) {
      first.set(h, i);
      continue;
    }
    if (same(i, j)) {
      keep[i] = 0;
      dups++;
      continue;
    }
    const list = more.get(h);
    if (list === undefined) more.set(h, [i]);
    else if (list.some((m) => same(i, m))) {
      keep[i] = 0;
      dups++;
    } else list.push(i);
  }
  return dups;
}
