/**
 * profileTable: what a mathematician checks first in a new table — rows, per-column kind,
 * missing and non-finite counts, min/max/mean/sample standard deviation (over finite values;
 * complex columns per part), distinct counts, duplicate rows, and the strongest Spearman rank
 * correlations between numeric columns.
 */
import { kahanSum } from '../util/sum.ts';
import { Rng, deriveSeed } from '../util/rng.ts';
import type { Column, ColumnKind, Table } from './types.ts';
import { checkOptions, optionOf } from '../util/option-table.ts';
import { INSPECT_OPTIONS } from './options.ts';

export interface Stats {
  /** finite, non-missing values used */
  n: number;
  min: number | null;
  max: number | null;
  mean: number | null;
  /** sample standard deviation (divides by n − 1); null when n < 2 */
  std: number | null;
}

export interface ColumnProfile {
  name: string;
  kind: ColumnKind;
  missing: number;
  /** nan / inf / -inf cells (complex: a cell with either part non-finite, counted once) */
  nonFinite: number;
  min: number | { re: number | null; im: number | null } | null;
  max: number | { re: number | null; im: number | null } | null;
  mean: number | { re: number | null; im: number | null } | null;
  std: number | { re: number | null; im: number | null } | null;
  /** distinct non-missing values, for integer and label columns */
  distinct?: number;
}

export interface Correlation {
  a: string;
  b: string;
  /** Spearman's rank correlation (Pearson correlation of average ranks) */
  rho: number;
  /** rows with both values finite */
  n: number;
}

export interface TableProfile {
  source: string;
  rows: number;
  /** rows equal in every column to an earlier row (NaN equals NaN, missing equals missing) */
  duplicates: number;
  columns: ColumnProfile[];
  /** top 10 by |rho| */
  correlations: Correlation[];
  /** rows used for the correlations (all rows, or a seeded sample) */
  correlationRows: number;
  correlationSampled: boolean;
  /** numeric series (a complex column gives two) compared pairwise, of those in the table, and the pairs computed */
  correlationSeries: { compared: number; numeric: number; pairs: number };
  notes: string[];
}

/** The rows rank correlations are computed on by default (INSPECT_OPTIONS.sampleRows). */
export const CORRELATION_SAMPLE = optionOf(INSPECT_OPTIONS, 'sampleRows').default as number;
export const TOP_CORRELATIONS = 10;
/** Most pairs of numeric series correlated (10,000 columns would make 50 million). */
export const MAX_CORRELATION_PAIRS = 500_000;
/** Most pairs × rows of correlation work, about a second or two of arithmetic. */
export const MAX_CORRELATION_WORK = 1e9;

/**
 * How many numeric series (in table order) are compared pairwise on `rows` rows: all of them
 * unless the pairs or the work (pairs × rows) would pass their ceilings.
 */
export function correlationSeriesLimit(rows: number): number {
  const pairs = Math.min(MAX_CORRELATION_PAIRS, MAX_CORRELATION_WORK / Math.max(1, rows));
  // largest s with s(s − 1)/2 ≤ pairs
  return Math.max(2, Math.floor((1 + Math.sqrt(1 + 8 * pairs)) / 2));
}

/**
 * Mean and sample standard deviation by two passes with compensated sums
 * (s² = Σ(x − x̄)² / (n − 1); the two-pass form, e.g. Chan, Golub & LeVeque, Am. Stat. 37, 1983).
 * Missing and non-finite values are skipped.
 * @example numericStats(new Float64Array([1, 2, 3]), new Uint8Array(3)) // { n: 3, min: 1, max: 3, mean: 2, std: 1 }
 */
export function numericStats(values: Float64Array, missing: Uint8Array): Stats {
  const n0 = values.length;
  const idx = new Int32Array(n0);
  let n = 0;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < n0; i++) {
    const x = values[i]!;
    if (missing[i] || x - x !== 0) continue;
    idx[n++] = i;
    if (x < min) min = x;
    if (x > max) max = x;
  }
  if (n === 0) return { n: 0, min: null, max: null, mean: null, std: null };
  const rows = idx.subarray(0, n);
  const mean = kahanSum(values, rows) / n;
  let std: number | null = null;
  if (n > 1) {
    const d = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      const e = values[rows[k]!]! - mean;
      d[k] = e * e;
    }
    std = Math.sqrt(kahanSum(d) / (n - 1));
  }
  return { n, min, max, mean, std };
}

/** Average ranks (1-based; ties share the mean of their positions) of values at `rows`. */
export function averageRanks(values: Float64Array, rows: Int32Array): Float64Array {
  const n = rows.length;
  const v = new Float64Array(n);
  for (let k = 0; k < n; k++) v[k] = values[rows[k]!]!;
  const order = new Int32Array(n);
  for (let k = 0; k < n; k++) order[k] = k;
  order.sort((a, b) => v[a]! - v[b]!);
  const r = new Float64Array(n);
  for (let k = 0; k < n; ) {
    let m = k + 1;
    while (m < n && v[order[m]!] === v[order[k]!]) m++;
    const avg = (k + 1 + m) / 2;
    for (let t = k; t < m; t++) r[order[t]!] = avg;
    k = m;
  }
  return r;
}

/** Pearson correlation of two equally long arrays (compensated sums); NaN when either is constant. */
export function pearson(x: Float64Array, y: Float64Array): number {
  const n = x.length;
  const mx = kahanSum(x) / n;
  const my = kahanSum(y) / n;
  const sxy = new Float64Array(n);
  const sxx = new Float64Array(n);
  const syy = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const a = x[i]! - mx;
    const b = y[i]! - my;
    sxy[i] = a * b;
    sxx[i] = a * a;
    syy[i] = b * b;
  }
  const d = Math.sqrt(kahanSum(sxx) * kahanSum(syy));
  return d === 0 ? NaN : kahanSum(sxy) / d;
}

interface Series {
  name: string;
  values: Float64Array;
  missing: Uint8Array;
}

/**
 * A complex cell is one value: finite only when both parts are. The mask of cells to leave out of
 * a complex column's statistics and correlations: missing, or a non-finite part (either).
 */
export function complexSkipMask(c: Extract<Column, { kind: 'complex' }>): Uint8Array {
  const n = c.re.length;
  const skip = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const a = c.re[i]!;
    const b = c.im[i]!;
    skip[i] = c.missing[i] || a - a !== 0 || b - b !== 0 ? 1 : 0;
  }
  return skip;
}

function numericSeries(columns: Column[]): Series[] {
  const out: Series[] = [];
  for (const c of columns) {
    if (c.kind === 'real' || c.kind === 'integer') out.push({ name: c.name, values: c.values, missing: c.missing });
    else if (c.kind === 'complex') {
      const skip = complexSkipMask(c);
      out.push({ name: `${c.name}.re`, values: c.re, missing: skip });
      out.push({ name: `${c.name}.im`, values: c.im, missing: skip });
    }
  }
  return out;
}

/**
 * Spearman rank correlations between all pairs of numeric series (complex parts separately) on
 * `rows`, pairwise-complete (rows where both values are finite; a complex cell counts as finite
 * only when both its parts are), strongest first.
 */
export function spearmanPairs(columns: Column[], rows: Int32Array, top = TOP_CORRELATIONS, maxSeries = Infinity): Correlation[] {
  const series = numericSeries(columns).slice(0, maxSeries);
  const m = rows.length;
  // per series: finite flags over the sampled rows, and centred ranks with their norm when complete
  const finite = series.map((s) => {
    const f = new Uint8Array(m);
    for (let k = 0; k < m; k++) {
      const i = rows[k]!;
      const x = s.values[i]!;
      f[k] = !s.missing[i] && x - x === 0 ? 1 : 0;
    }
    return f;
  });
  const centred = series.map((s, j) => (finite[j]!.every((v) => v === 1) ? centredRanks(averageRanks(s.values, rows)) : null));
  // only the strongest pairs are kept: the list is cut back to `top` whenever it grows past 4·top
  let out: Correlation[] = [];
  const strongestFirst = (p: Correlation, q: Correlation) => Math.abs(q.rho) - Math.abs(p.rho) || (p.a + p.b < q.a + q.b ? -1 : 1);
  for (let a = 0; a < series.length; a++)
    for (let b = a + 1; b < series.length; b++) {
      let rho: number;
      let n = m;
      const ca = centred[a];
      const cb = centred[b];
      if (ca && cb) {
        rho = ca.norm === 0 || cb.norm === 0 ? NaN : dot(ca.values, cb.values) / (ca.norm * cb.norm);
      } else {
        const sub: number[] = [];
        for (let k = 0; k < m; k++) if (finite[a]![k] && finite[b]![k]) sub.push(rows[k]!);
        n = sub.length;
        if (n < 3) continue;
        const r = Int32Array.from(sub);
        rho = pearson(averageRanks(series[a]!.values, r), averageRanks(series[b]!.values, r));
      }
      if (Number.isFinite(rho)) out.push({ a: series[a]!.name, b: series[b]!.name, rho, n });
      if (out.length > 4 * top) out = out.sort(strongestFirst).slice(0, top);
    }
  return out.sort(strongestFirst).slice(0, top);
}

/** Ranks minus their mean, and the Euclidean norm of that (compensated sums). */
function centredRanks(r: Float64Array): { values: Float64Array; norm: number } {
  const mean = kahanSum(r) / r.length;
  const values = r.map((x) => x - mean);
  return { values, norm: Math.sqrt(kahanSum(values.map((x) => x * x))) };
}

/** Σ x_i y_i with Neumaier's compensated summation (Neumaier 1974). */
function dot(x: Float64Array, y: Float64Array): number {
  let s = 0;
  let c = 0;
  for (let i = 0; i < x.length; i++) {
    const t = x[i]! * y[i]!;
    const u = s + t;
    c += Math.abs(s) >= Math.abs(t) ? s - u + t : t - u + s;
    s = u;
  }
  return s + c;
}

const F64 = new Float64Array(1);
const U32 = new Uint32Array(F64.buffer);

function hashRow(cols: Column[], i: number): number {
  let h = 0x811c9dc5;
  for (const c of cols) {
    if (c.missing[i]) {
      h = Math.imul(h ^ 0x55, 0x01000193);
      continue;
    }
    if (c.kind === 'label') {
      const s = c.values[i]!;
      for (let k = 0; k < s.length; k++) h = Math.imul(h ^ s.charCodeAt(k), 0x01000193);
      h = Math.imul(h ^ 0xff, 0x01000193);
      continue;
    }
    const parts = c.kind === 'complex' ? [c.re[i]!, c.im[i]!] : [c.values[i]!];
    for (const x of parts) {
      F64[0] = x === 0 ? 0 : x !== x ? NaN : x;
      h = Math.imul(h ^ U32[0]!, 0x01000193);
      h = Math.imul(h ^ U32[1]!, 0x01000193);
    }
  }
  return h >>> 0;
}

function same(x: number, y: number): boolean {
  return x === y || (x !== x && y !== y);
}

function rowsEqual(cols: Column[], i: number, j: number): boolean {
  for (const c of cols) {
    if (c.missing[i] !== c.missing[j]) return false;
    if (c.missing[i]) continue;
    if (c.kind === 'label') {
      if (c.values[i] !== c.values[j]) return false;
    } else if (c.kind === 'complex') {
      if (!same(c.re[i]!, c.re[j]!) || !same(c.im[i]!, c.im[j]!)) return false;
    } else if (!same(c.values[i]!, c.values[j]!)) return false;
  }
  return true;
}

/** Rows equal in every column to an earlier row (hash, then exact comparison). */
export function countDuplicateRows(table: Table): number {
  const cols = table.columns;
  const seen = new Map<number, number | number[]>();
  let dup = 0;
  for (let i = 0; i < table.nRows; i++) {
    const h = hashRow(cols, i);
    const prev = seen.get(h);
    if (prev === undefined) {
      seen.set(h, i);
      continue;
    }
    const list = typeof prev === 'number' ? [prev] : prev;
    if (list.some((j) => rowsEqual(cols, i, j))) dup++;
    else {
      list.push(i);
      if (typeof prev === 'number') seen.set(h, list);
    }
  }
  return dup;
}

function distinctCount(c: Column): number {
  const s = new Set<number | string>();
  if (c.kind === 'label') {
    for (let i = 0; i < c.values.length; i++) if (!c.missing[i]) s.add(c.values[i]!);
  } else if (c.kind !== 'complex') {
    for (let i = 0; i < c.values.length; i++) if (!c.missing[i]) s.add(c.values[i]! === 0 ? 0 : c.values[i]!);
  }
  return s.size;
}

function countMissing(m: Uint8Array): number {
  let k = 0;
  for (let i = 0; i < m.length; i++) k += m[i]!;
  return k;
}

/** The profile of a table; correlations on at most 200,000 rows drawn with a fixed seed. */
export function profileTable(table: Table, options: { sampleRows?: number; seed?: number } = {}): TableProfile {
  const opts = checkOptions<{ sampleRows: number; seed: number }>(INSPECT_OPTIONS, options);
  const notes: string[] = [];
  const columns: ColumnProfile[] = table.columns.map((c) => {
    const missing = countMissing(c.missing);
    if (c.kind === 'label')
      return { name: c.name, kind: c.kind, missing, nonFinite: 0, min: null, max: null, mean: null, std: null, distinct: distinctCount(c) };
    if (c.kind === 'complex') {
      // one value per cell: a cell with a non-finite part is left out of both parts' statistics
      const skip = complexSkipMask(c);
      const r = numericStats(c.re, skip);
      const m = numericStats(c.im, skip);
      const nonFinite = c.re.length - missing - r.n;
      return {
        name: c.name,
        kind: c.kind,
        missing,
        nonFinite,
        min: { re: r.min, im: m.min },
        max: { re: r.max, im: m.max },
        mean: { re: r.mean, im: m.mean },
        std: { re: r.std, im: m.std },
      };
    }
    const s = numericStats(c.values, c.missing);
    const p: ColumnProfile = {
      name: c.name,
      kind: c.kind,
      missing,
      nonFinite: c.values.length - missing - s.n,
      min: s.min,
      max: s.max,
      mean: s.mean,
      std: s.std,
    };
    if (c.kind === 'integer') p.distinct = distinctCount(c);
    return p;
  });
  const limit = opts.sampleRows;
  const sampled = table.nRows > limit;
  let rows: Int32Array;
  if (sampled) {
    const perm = new Rng(deriveSeed(opts.seed, 'profile', 'correlation-sample')).permutation(table.nRows);
    rows = perm.subarray(0, limit).sort();
    notes.push(`correlations on ${limit.toLocaleString('en-US')} of ${table.nRows.toLocaleString('en-US')} rows, drawn at random with a fixed seed`);
  } else {
    rows = new Int32Array(table.nRows);
    for (let i = 0; i < table.nRows; i++) rows[i] = i;
  }
  const numeric = numericSeries(table.columns).length;
  const limit2 = correlationSeriesLimit(rows.length);
  const compared = Math.min(numeric, limit2);
  if (compared < numeric) {
    notes.push(
      `rank correlations compared the first ${compared.toLocaleString('en-US')} of ${numeric.toLocaleString('en-US')} numeric series ` +
        `(at most ${MAX_CORRELATION_PAIRS.toLocaleString('en-US')} pairs, and pairs × rows at most ${MAX_CORRELATION_WORK.toExponential(0)}); the rest were not compared`,
    );
  }
  const correlations = spearmanPairs(table.columns, rows, TOP_CORRELATIONS, compared);
  return {
    source: table.source,
    rows: table.nRows,
    duplicates: countDuplicateRows(table),
    columns,
    correlations,
    correlationRows: rows.length,
    correlationSampled: sampled,
    correlationSeries: { compared, numeric, pairs: (compared * (compared - 1)) / 2 },
    notes: [...(table.notes ?? []), ...notes],
  };
}
