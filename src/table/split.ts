import { SurmiseError } from '../errors.ts';
import { Rng, deriveSeed } from '../util/rng.ts';
import type { Column, Table } from './types.ts';
import type { Dataset } from './dataset-types.ts';
import { evaluateExpression, expressionColumns, formatExpression, parseExpression } from './expr/index.ts';

/** Indices into the dataset's kept rows. */
export interface Split {
  train: Int32Array;
  validation: Int32Array;
  test: Int32Array;
  description: string;
  /** Rows on neither side: a `where` condition that could not be decided (a missing value). */
  unassigned?: Int32Array;
}

export type SplitSpec =
  | { kind: 'random'; train: number; validation: number; test: number }
  | { kind: 'kfold'; k: number }
  | { kind: 'where'; condition: string };

/** Share of the training side held out for validation in k-fold and `where` splits. */
export const DEFAULT_VALIDATION_SHARE = 0.15;

const sorted = (a: Int32Array): Int32Array => a.sort();

function badSpec(spec: string, why: string): never {
  throw new SurmiseError(
    'split.badSpec',
    `cannot read \`split\` '${spec}': ${why}; expected random, random:TRAIN,VALIDATION,TEST (e.g. random:0.8,0.1,0.1), kfold:K (e.g. kfold:5) or where:CONDITION (e.g. where:xings <= 12)`,
    { option: 'split', spec },
  );
}

/** Read the `split` option. Default (empty or `random`): 70/15/15. */
export function parseSplitSpec(spec: string): SplitSpec {
  const s = spec.trim();
  if (s === '' || s === 'random') return { kind: 'random', train: 0.7, validation: 0.15, test: 0.15 };
  const colon = s.indexOf(':');
  const head = (colon < 0 ? s : s.slice(0, colon)).trim();
  const rest = colon < 0 ? '' : s.slice(colon + 1).trim();
  if (head === 'random') {
    const parts = rest.split(',').map((t) => t.trim());
    if (parts.length !== 3) badSpec(spec, `random needs three fractions, got ${parts.length}`);
    const f = parts.map((t) => (t === '' ? NaN : Number(t)));
    if (f.some((v) => !Number.isFinite(v) || v < 0 || v > 1)) badSpec(spec, 'each fraction must be a number between 0 and 1');
    if (Math.abs(f[0]! + f[1]! + f[2]! - 1) > 1e-9) badSpec(spec, `the fractions must add up to 1, they add up to ${f[0]! + f[1]! + f[2]!}`);
    if (f[0] === 0 || f[2] === 0) badSpec(spec, 'the train and test fractions must be positive');
    return { kind: 'random', train: f[0]!, validation: f[1]!, test: f[2]! };
  }
  if (head === 'kfold') {
    const k = rest === '' ? NaN : Number(rest);
    if (!Number.isInteger(k) || k < 2) badSpec(spec, `kfold needs a whole number of folds >= 2, got '${rest}'`);
    return { kind: 'kfold', k };
  }
  if (head === 'where') {
    if (rest === '') badSpec(spec, 'where needs a condition');
    try {
      parseExpression(rest);
    } catch (e) {
      if (e instanceof SurmiseError) {
        throw new SurmiseError('split.badSpec', `in \`split\` 'where:…': ${e.message}`, { option: 'split', spec, cause: e.code });
      }
      throw e;
    }
    return { kind: 'where', condition: rest };
  }
  return badSpec(spec, `unknown kind '${head}'`);
}

function checkN(n: number): void {
  if (!Number.isInteger(n) || n < 0) throw new SurmiseError('split.badInput', `expected a row count >= 0, got ${n}`);
}

/**
 * Shuffle 0..n−1 with the seed and cut it: test = round(n·test), validation = round(n·validation),
 * train = the rest. Each part is returned in ascending order.
 */
export function randomSplit(n: number, opts: { train: number; validation: number; test: number; seed: number }): Split {
  checkN(n);
  const { train, validation, test, seed } = opts;
  if (![train, validation, test].every((f) => Number.isFinite(f) && f >= 0) || Math.abs(train + validation + test - 1) > 1e-9) {
    throw new SurmiseError('split.badSpec', `split fractions must be >= 0 and add up to 1, got ${train}, ${validation}, ${test}`);
  }
  const perm = new Rng(deriveSeed(seed, 'split', 'random')).permutation(n);
  const nTest = Math.round(n * test);
  const nVal = Math.round(n * validation);
  const nTrain = n - nTest - nVal;
  const pct = (f: number): string => `${Math.round(f * 1000) / 10}`;
  const description = `random ${pct(train)}/${pct(validation)}/${pct(test)} split of ${n} rows (seed ${seed}): ${nTrain} train, ${nVal} validation, ${nTest} test`;
  if (nTrain <= 0 || nTest <= 0) {
    throw new SurmiseError('split.empty', `the ${description} leaves the ${nTrain <= 0 ? 'training' : 'test'} side empty; more rows are needed`);
  }
  return {
    train: sorted(perm.slice(0, nTrain)),
    validation: sorted(perm.slice(nTrain, nTrain + nVal)),
    test: sorted(perm.slice(nTrain + nVal)),
    description,
  };
}

/** k folds of a seeded permutation, sizes differing by at most one; every row is tested exactly once. */
export function kFold(n: number, k: number, seed: number): Array<{ train: Int32Array; test: Int32Array }> {
  checkN(n);
  if (!Number.isInteger(k) || k < 2) throw new SurmiseError('split.badSpec', `k-fold needs a whole number of folds >= 2, got ${k}`);
  if (k > n) throw new SurmiseError('split.empty', `${k}-fold cross-validation needs at least ${k} rows, got ${n}`);
  const perm = new Rng(deriveSeed(seed, 'split', 'kfold', k)).permutation(n);
  const folds: Array<{ train: Int32Array; test: Int32Array }> = [];
  for (let f = 0; f < k; f++) {
    const lo = Math.floor((f * n) / k);
    const hi = Math.floor(((f + 1) * n) / k);
    const test = sorted(perm.slice(lo, hi));
    const train = new Int32Array(n - (hi - lo));
    train.set(perm.subarray(0, lo), 0);
    train.set(perm.subarray(hi), lo);
    folds.push({ train: sorted(train), test });
  }
  return folds;
}

/** Hold out round(share·|train|) of `train` (seeded) for validation. */
function carveValidation(train: Int32Array, share: number, seed: number): { train: Int32Array; validation: Int32Array } {
  const perm = new Rng(seed).shuffle(train.slice());
  const nVal = Math.min(Math.round(train.length * share), Math.max(0, train.length - 1));
  return { validation: sorted(perm.slice(0, nVal)), train: sorted(perm.slice(nVal)) };
}

/**
 * Extrapolation split: train where `condition[i]` is non-zero (true), test where it is 0.
 * A NaN condition (undecidable, e.g. a missing value) puts the row in `unassigned`, never silently
 * on a side. `validation` (default 0.15) of the training side is held out, seeded.
 */
export function thresholdSplit(
  condition: Float64Array,
  opts: { seed: number; label: string; validation?: number },
): Split {
  const share = opts.validation ?? DEFAULT_VALIDATION_SHARE;
  let nTr = 0;
  let nTe = 0;
  let nUn = 0;
  for (let i = 0; i < condition.length; i++) {
    const c = condition[i]!;
    if (Number.isNaN(c)) nUn++;
    else if (c !== 0) nTr++;
    else nTe++;
  }
  const tr = new Int32Array(nTr);
  const te = new Int32Array(nTe);
  const un = new Int32Array(nUn);
  for (let i = 0, a = 0, b = 0, u = 0; i < condition.length; i++) {
    const c = condition[i]!;
    if (Number.isNaN(c)) un[u++] = i;
    else if (c !== 0) tr[a++] = i;
    else te[b++] = i;
  }
  if (tr.length === 0 || te.length === 0) {
    throw new SurmiseError(
      'split.empty',
      `the split 'where:${opts.label}' leaves the ${tr.length === 0 ? 'training' : 'test'} side empty: ${tr.length} rows satisfy the condition, ${te.length} do not${un.length ? `, ${un.length} undecided` : ''}`,
      { condition: opts.label, train: tr.length, test: te.length, unassigned: un.length },
    );
  }
  const { train, validation } = carveValidation(tr, share, deriveSeed(opts.seed, 'split', 'where'));
  const description =
    `train where ${opts.label} (${tr.length} rows: ${train.length} train, ${validation.length} validation), test on the other ${te.length} rows` +
    (un.length ? `; ${un.length} rows left out because the condition could not be decided (missing values)` : '');
  return { train, validation, test: te, description, ...(un.length ? { unassigned: un } : {}) };
}

/**
 * The condition of a `where` split evaluated on the dataset's kept rows. Names resolve first to the
 * table's columns (or X.re / X.im), then to the dataset's features and target (so derived columns work).
 */
export function evaluateCondition(dataset: Dataset, table: Table, condition: string): Float64Array {
  const expr = parseExpression(condition);
  const m = dataset.rows.length;
  const cols: Column[] = [];
  for (const name of expressionColumns(expr)) {
    const tc = table.columns.find((c) => c.name === name);
    const base = /^(.*)\.(re|im)$/.exec(name);
    const complexBase = base ? table.columns.find((c) => c.name === base[1] && c.kind === 'complex') : undefined;
    const pick = (v: Float64Array): Float64Array => {
      const o = new Float64Array(m);
      for (let k = 0; k < m; k++) o[k] = v[dataset.rows[k]!]!;
      return o;
    };
    const pickMask = (v: Uint8Array): Uint8Array => {
      const o = new Uint8Array(m);
      for (let k = 0; k < m; k++) o[k] = v[dataset.rows[k]!]!;
      return o;
    };
    if (tc) {
      if (tc.kind === 'label') cols.push({ ...tc, values: Array.from(dataset.rows, (i) => tc.values[i]!), missing: pickMask(tc.missing) });
      else if (tc.kind === 'complex') cols.push({ ...tc, re: pick(tc.re), im: pick(tc.im), missing: pickMask(tc.missing) });
      else cols.push({ ...tc, values: pick(tc.values), missing: pickMask(tc.missing) });
      continue;
    }
    if (complexBase && complexBase.kind === 'complex') {
      cols.push({ ...complexBase, re: pick(complexBase.re), im: pick(complexBase.im), missing: pickMask(complexBase.missing) });
      continue;
    }
    const f = dataset.featureNames.indexOf(name);
    if (f >= 0) {
      cols.push({ name, kind: 'real', values: dataset.x[f]!, missing: new Uint8Array(m) });
      continue;
    }
    if (name === dataset.targetName) {
      cols.push({ name, kind: dataset.targetKind, values: dataset.y, missing: new Uint8Array(m) });
      continue;
    }
    // unknown: let the evaluator report it with a caret and the nearest table column
  }
  const names = new Set(cols.map((c) => c.name));
  const rest = table.columns.filter((c) => !names.has(c.name)).map((c) => ({ ...c, missing: new Uint8Array(0) }) as Column);
  // `rest` only serves "did you mean" suggestions; it is never read because the names above resolved
  const view: Table = { source: table.source, nRows: m, columns: [...cols, ...rest] };
  const r = evaluateExpression(view, expr);
  if (r.im) {
    throw new SurmiseError('split.badSpec', `the split condition '${condition}' has complex values; compare a real quantity such as re(…) or abs(…)`, {
      option: 'split',
    });
  }
  return r.re;
}

/** The concrete splits of `spec` for a dataset: one Split, or one per fold (validation carved from each fold's training part). */
export function makeSplits(dataset: Dataset, table: Table, spec: SplitSpec, seed: number): Split[] {
  const n = dataset.rows.length;
  switch (spec.kind) {
    case 'random':
      return [randomSplit(n, { ...spec, seed })];
    case 'kfold':
      return kFold(n, spec.k, seed).map((f, idx) => {
        const { train, validation } = carveValidation(f.train, DEFAULT_VALIDATION_SHARE, deriveSeed(seed, 'split', 'kfold', spec.k, 'fold', idx));
        return {
          train,
          validation,
          test: f.test,
          description: `fold ${idx + 1} of ${spec.k} (seed ${seed}): ${train.length} train, ${validation.length} validation, ${f.test.length} test`,
        };
      });
    case 'where': {
      const cond = evaluateCondition(dataset, table, spec.condition);
      return [thresholdSplit(cond, { seed, label: formatExpression(parseExpression(spec.condition)) })];
    }
  }
}
