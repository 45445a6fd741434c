/**
 * The repeats of a ranking (seed × fold) with their row sets, and standardization fitted on a
 * repeat's training rows only. Row indices are into the dataset's kept rows.
 */
import type { Table } from '../table/types.ts';
import type { Dataset } from '../table/dataset.ts';
import { evaluateExpression } from '../table/expr/index.ts';
import { SurmiseError } from '../errors.ts';
import { Rng, deriveSeed } from '../util/rng.ts';
import { kahanSum } from '../util/sum.ts';

export interface RepeatPlan {
  /** Network seed of this repeat (derived from the user's seed). */
  seed: number;
  /** 0-based fold (0 for a single split). */
  fold: number;
  /** "seed 2/3" or "seed 1/3, fold 4/5" */
  label: string;
  /** Canonical split spec, e.g. "random:0.7,0.1,0.2". */
  spec: string;
  train: Int32Array;
  validation: Int32Array;
  test: Int32Array;
}

/** Share of the non-test rows kept for early stopping and ridge's λ in k-fold and where: splits. */
export const VALIDATION_SHARE = 0.125;
export const DEFAULT_FRACTIONS: readonly [number, number, number] = [0.7, 0.1, 0.2];

type Split = { kind: 'random'; fractions: [number, number, number] } | { kind: 'kfold'; k: number } | { kind: 'where'; expr: string };

/** Parse `random`, `random:a,b,c` (train, validation, test shares), `kfold:K`, `where:EXPR` (EXPR true → held out). */
export function parseRankSplit(spec: string): Split {
  const bad = (why: string): never => {
    throw new SurmiseError('split.badSpec', `--split ${spec}: ${why}; expected random, random:TRAIN,VALIDATION,TEST, kfold:K or where:EXPR`, { option: 'split' });
  };
  const colon = spec.indexOf(':');
  const head = (colon < 0 ? spec : spec.slice(0, colon)).trim();
  const rest = colon < 0 ? undefined : spec.slice(colon + 1);
  if (head === 'random') {
    if (rest === undefined) return { kind: 'random', fractions: [...DEFAULT_FRACTIONS] };
    const parts = rest.split(',').map((s) => s.trim());
    if (parts.length !== 3) bad(`expected three shares, got ${parts.length}`);
    const f = parts.map((s) => (s === '' ? NaN : Number(s)));
    f.forEach((v, i) => {
      if (!(Number.isFinite(v) && v > 0)) bad(`share ${i + 1} ('${parts[i]}') is not a positive number`);
    });
    const tot = f[0]! + f[1]! + f[2]!;
    return { kind: 'random', fractions: [f[0]! / tot, f[1]! / tot, f[2]! / tot] };
  }
  if (head === 'kfold') {
    const k = rest === undefined || rest.trim() === '' ? NaN : Number(rest);
    if (!(Number.isInteger(k) && k >= 2)) bad(`the number of folds must be an integer ≥ 2, got '${rest ?? ''}'`);
    return { kind: 'kfold', k };
  }
  if (head === 'where') {
    if (rest === undefined || rest.trim() === '') bad('the condition is empty');
    return { kind: 'where', expr: rest! };
  }
  return bad(`unknown split '${head}'`);
}

function splitSpecText(s: Split): string {
  if (s.kind === 'random') return `random:${s.fractions.map((v) => +v.toFixed(6)).join(',')}`;
  if (s.kind === 'kfold') return `kfold:${s.k}`;
  return `where:${s.expr}`;
}

/** Carve a seeded validation share off `rows`; returns [train, validation], each in row order. */
function carveValidation(rows: Int32Array, seed: number): [Int32Array, Int32Array] {
  const perm = new Rng(seed).permutation(rows.length);
  const nVal = Math.max(1, Math.round(rows.length * VALIDATION_SHARE));
  const val = Int32Array.from(perm.subarray(0, nVal), (i) => rows[i]!).sort();
  const train = Int32Array.from(perm.subarray(nVal), (i) => rows[i]!).sort();
  return [train, val];
}

/**
 * The repeats: for each of `seeds` seeds, one random split (folds = 0) or K folds. Seeds of the
 * network, the split and the validation carve are derived from `seed` (deriveSeed). A where: split
 * holds out the rows where the condition is true (non-zero) for every seed.
 */
export function planRepeats(
  table: Table,
  ds: Dataset,
  o: { seed: number; seeds: number; folds: number; split?: string },
): RepeatPlan[] {
  const n = ds.y.length;
  let split = parseRankSplit(o.split ?? (o.folds >= 2 ? `kfold:${o.folds}` : 'random'));
  if (o.folds >= 2 && split.kind !== 'kfold') {
    throw new SurmiseError('split.conflict', `--folds ${o.folds} asks for k-fold, but --split ${o.split} asks for another split; give one of them`, { option: 'split' });
  }
  if (split.kind === 'kfold' && o.folds >= 2 && split.k !== o.folds) {
    throw new SurmiseError('split.conflict', `--folds ${o.folds} and --split ${o.split} disagree on the number of folds`, { option: 'split' });
  }
  const spec = splitSpecText(split);
  const plans: RepeatPlan[] = [];
  const tooFew = (what: string) => {
    throw new SurmiseError('split.tooFewRows', `--split ${spec}: ${what} (${n} rows kept after the row policy)`, { option: 'split' });
  };
  for (let s = 0; s < o.seeds; s++) {
    const netSeed = deriveSeed(o.seed, 'rank', 'seed', s);
    const sl = `seed ${s + 1}/${o.seeds}`;
    if (split.kind === 'random') {
      const perm = new Rng(deriveSeed(o.seed, 'rank', 'split', s)).permutation(n);
      const nTest = Math.round(n * split.fractions[2]);
      const nVal = Math.round(n * split.fractions[1]);
      if (nTest < 1 || nVal < 1 || n - nTest - nVal < 2) tooFew('too few rows for training, validation and held-out sets');
      const test = perm.slice(0, nTest).sort();
      const validation = perm.slice(nTest, nTest + nVal).sort();
      const train = perm.slice(nTest + nVal).sort();
      plans.push({ seed: netSeed, fold: 0, label: sl, spec, train, validation, test });
    } else if (split.kind === 'kfold') {
      const k = split.k;
      if (n < 3 * k) tooFew(`too few rows for ${k} folds`);
      const perm = new Rng(deriveSeed(o.seed, 'rank', 'split', s)).permutation(n);
      for (let f = 0; f < k; f++) {
        const lo = Math.floor((f * n) / k);
        const hi = Math.floor(((f + 1) * n) / k);
        const test = perm.slice(lo, hi).sort();
        const restRows = Int32Array.from([...perm.subarray(0, lo), ...perm.subarray(hi)]);
        const [train, validation] = carveValidation(restRows, deriveSeed(o.seed, 'rank', 'validation', s, f));
        plans.push({ seed: deriveSeed(netSeed, 'fold', f), fold: f, label: `${sl}, fold ${f + 1}/${k}`, spec, train, validation, test });
      }
    } else {
      const ev = evaluateExpression(table, split.expr);
      const held: number[] = [];
      const rest: number[] = [];
      for (let i = 0; i < n; i++) {
        const r = ds.rows[i]!;
        const v = ev.re[r]!;
        if (!ev.missing[r] && Number.isFinite(v) && v !== 0) held.push(i);
        else rest.push(i);
      }
      if (held.length < 1) tooFew('the condition holds on no row, so nothing is held out');
      if (rest.length < 3) tooFew('the condition holds on nearly every row, so too few are left to train on');
      const [train, validation] = carveValidation(Int32Array.from(rest), deriveSeed(o.seed, 'rank', 'validation', s));
      plans.push({ seed: netSeed, fold: 0, label: sl, spec, train, validation, test: Int32Array.from(held) });
    }
  }
  return plans;
}

/**
 * z-scores fitted on the training rows only: z = (x − mean) / sd with the population SD (divide by
 * n) of those rows; a column constant on them gets sd 1 (it becomes 0 there). Returns a function
 * gathering any rows as a row-major matrix of the chosen columns.
 * @example columns [[1, 2, 3]], train rows [0, 1, 2] → row 2 maps to (3 − 2)/√(2/3) ≈ 1.2247
 */
export function standardizeRows(
  cols: readonly Float64Array[],
  trainRows: Int32Array,
  which: readonly number[],
): (rows: Int32Array) => Float64Array {
  const p = which.length;
  const mean = new Float64Array(p);
  const scale = new Float64Array(p);
  const buf = new Float64Array(trainRows.length);
  which.forEach((c, j) => {
    const col = cols[c]!;
    mean[j] = kahanSum(col, trainRows) / trainRows.length;
    for (let i = 0; i < trainRows.length; i++) buf[i] = (col[trainRows[i]!]! - mean[j]!) ** 2;
    const sd = Math.sqrt(kahanSum(buf) / trainRows.length);
    scale[j] = sd > 0 && Number.isFinite(sd) ? sd : 1;
  });
  return (rows) => {
    const out = new Float64Array(rows.length * p);
    for (let i = 0; i < rows.length; i++) {
      const r = rows[i]!;
      for (let j = 0; j < p; j++) out[i * p + j] = (cols[which[j]!]![r]! - mean[j]!) / scale[j]!;
    }
    return out;
  };
}
