/**
 * Ridge regression in closed form, in float64: minimise ‖y − b₀ − Xβ‖² + λ‖β‖² (intercept b₀ not
 * penalised; Hoerl & Kennard, Technometrics 12, 1970). Centering removes b₀: (XcᵀXc + λI)β = Xcᵀyc,
 * b₀ = ȳ − x̄ᵀβ. The Gram matrix is scaled to unit diagonal (Jacobi scaling) before its Cholesky
 * factorisation, which leaves the solution unchanged and keeps λ = 0 accurate on columns of very
 * different units. Classification: one ridge fit per class on the 0/1 indicator, class = argmax.
 */
import { SurmiseError } from '../errors.ts';
import { kahanSum } from '../util/sum.ts';
import { checkMatrix } from './data.ts';
import { accuracy, r2, rmse } from './metrics.ts';
import { chooseTask, type Task } from './options.ts';

export interface RidgeModel {
  kind: 'ridge';
  task: Task;
  p: number;
  lambda: number;
  /** classification: sorted distinct training values; regression: null */
  classes: number[] | null;
  /** regression: the intercept and coefficients; classification: those of each class's indicator fit */
  intercept: number[];
  coefficients: number[][];
  predict(x: Float64Array | Float32Array, n: number): Float64Array;
  predictClass(x: Float64Array | Float32Array, n: number): Float64Array;
  toJSON(): { kind: 'ridge'; task: Task; p: number; lambda: number; classes: number[] | null; intercept: number[]; coefficients: number[][] };
}

/** Column means (compensated) of a row-major n×p matrix. */
function columnMeans(x: ArrayLike<number>, n: number, p: number): Float64Array {
  const m = new Float64Array(p);
  const col = new Float64Array(n);
  for (let j = 0; j < p; j++) {
    for (let i = 0; i < n; i++) col[i] = x[i * p + j]!;
    m[j] = kahanSum(col) / n;
  }
  return m;
}

/** Cholesky factor (lower, row-major) of a symmetric p×p matrix, or null when not positive definite. */
function cholesky(a: Float64Array, p: number): Float64Array | null {
  const L = new Float64Array(p * p);
  for (let i = 0; i < p; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i * p + j]!;
      for (let k = 0; k < j; k++) s -= L[i * p + k]! * L[j * p + k]!;
      if (i === j) {
        if (!(s > 1e-13 * Math.max(1, Math.abs(a[i * p + i]!)))) return null;
        L[i * p + i] = Math.sqrt(s);
      } else L[i * p + j] = s / L[j * p + j]!;
    }
  }
  return L;
}

function cholSolve(L: Float64Array, p: number, b: Float64Array): Float64Array {
  const z = new Float64Array(p);
  for (let i = 0; i < p; i++) {
    let s = b[i]!;
    for (let k = 0; k < i; k++) s -= L[i * p + k]! * z[k]!;
    z[i] = s / L[i * p + i]!;
  }
  for (let i = p - 1; i >= 0; i--) {
    let s = z[i]!;
    for (let k = i + 1; k < p; k++) s -= L[k * p + i]! * z[k]!;
    z[i] = s / L[i * p + i]!;
  }
  return z;
}

/** Sufficient statistics of the centred problem: Gram matrix XcᵀXc, means, and Xcᵀ(t − t̄) for each target column. */
interface Normal {
  n: number;
  p: number;
  xMean: Float64Array;
  gram: Float64Array;
  rhs: Float64Array[];
  tMean: number[];
}

function normalEquations(x: Float32Array | Float64Array, targets: Float64Array[], n: number, p: number): Normal {
  const xMean = columnMeans(x, n, p);
  const gram = new Float64Array(p * p);
  const rhs = targets.map(() => new Float64Array(p));
  const tMean = targets.map((t) => kahanSum(t) / n);
  const row = new Float64Array(p);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < p; j++) row[j] = x[i * p + j]! - xMean[j]!;
    for (let j = 0; j < p; j++) {
      const rj = row[j]!;
      if (rj === 0) continue;
      for (let k = 0; k <= j; k++) gram[j * p + k] += rj * row[k]!;
    }
    for (let c = 0; c < targets.length; c++) {
      const tc = targets[c]![i]! - tMean[c]!;
      const r = rhs[c]!;
      for (let j = 0; j < p; j++) r[j] += row[j]! * tc;
    }
  }
  for (let j = 0; j < p; j++) for (let k = 0; k < j; k++) gram[k * p + j] = gram[j * p + k]!;
  return { n, p, xMean, gram, rhs, tMean };
}

/** Solve the centred ridge system for every target column at penalty λ; null when singular. */
function solveRidge(ne: Normal, lambda: number): { intercept: number[]; coefficients: number[][] } | null {
  const { p, gram } = ne;
  // Jacobi scaling s_j = 1/√G_jj (a zero column keeps s_j = 1 and relies on λ > 0)
  const s = new Float64Array(p);
  for (let j = 0; j < p; j++) s[j] = gram[j * p + j]! > 0 ? 1 / Math.sqrt(gram[j * p + j]!) : 1;
  const a = new Float64Array(p * p);
  for (let j = 0; j < p; j++) {
    for (let k = 0; k < p; k++) a[j * p + k] = s[j]! * gram[j * p + k]! * s[k]!;
    a[j * p + j] += lambda * s[j]! * s[j]!;
  }
  const L = cholesky(a, p);
  if (!L) return null;
  const intercept: number[] = [];
  const coefficients: number[][] = [];
  for (let c = 0; c < ne.rhs.length; c++) {
    const b = ne.rhs[c]!.map((v, j) => v * s[j]!);
    const g = cholSolve(L, p, b);
    const beta = Array.from(g, (v, j) => v * s[j]!);
    let b0 = ne.tMean[c]!;
    for (let j = 0; j < p; j++) b0 -= ne.xMean[j]! * beta[j]!;
    intercept.push(b0);
    coefficients.push(beta);
  }
  return { intercept, coefficients };
}

function makeModel(task: Task, p: number, lambda: number, classes: number[] | null, sol: { intercept: number[]; coefficients: number[][] }): RidgeModel {
  const { intercept, coefficients } = sol;
  const K = coefficients.length;
  const scores = (x: Float64Array | Float32Array, n: number): Float64Array => {
    checkMatrix(x, n, p, 'ridge input');
    const out = new Float64Array(n * K);
    for (let i = 0; i < n; i++) {
      for (let c = 0; c < K; c++) {
        const w = coefficients[c]!;
        let s = intercept[c]!;
        for (let j = 0; j < p; j++) s += w[j]! * x[i * p + j]!;
        out[i * K + c] = s;
      }
    }
    return out;
  };
  const predictClass = (x: Float64Array | Float32Array, n: number): Float64Array => {
    const sc = scores(x, n);
    if (task === 'regression') return sc;
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      let best = 0;
      for (let c = 1; c < K; c++) if (sc[i * K + c]! > sc[i * K + best]!) best = c;
      out[i] = classes![best]!;
    }
    return out;
  };
  return {
    kind: 'ridge',
    task,
    p,
    lambda,
    classes,
    intercept,
    coefficients,
    // classification: the predicted class (the indicator scores are not probabilities)
    predict: task === 'regression' ? scores : predictClass,
    predictClass,
    toJSON: () => ({ kind: 'ridge', task, p, lambda, classes, intercept: [...intercept], coefficients: coefficients.map((r) => [...r]) }),
  };
}

function targetsFor(y: Float64Array, task: Task): { targets: Float64Array[]; classes: number[] | null } {
  if (task === 'regression') return { targets: [y], classes: null };
  const classes = [...new Set(y)].sort((a, b) => a - b);
  return { targets: classes.map((c) => Float64Array.from(y, (v) => (v === c ? 1 : 0))), classes };
}

function checkInputs(x: Float32Array | Float64Array, y: Float64Array, n: number, p: number): void {
  if (!Number.isInteger(p) || p < 1) throw new SurmiseError('learn.badData', `ridge: expected p to be a positive integer, got ${p}`);
  checkMatrix(x, n, p, 'ridge training rows');
  if (y.length !== n) throw new SurmiseError('learn.shapeMismatch', `ridge: ${n} rows of x but ${y.length} targets`);
  if (n < 2) throw new SurmiseError('learn.noRows', `ridge: needs at least 2 training rows, got ${n}`);
}

/** Fit ridge at one λ ≥ 0. Throws `learn.ridgeSingular` when λ = 0 and the columns are collinear. */
export function fitRidge(x: Float32Array | Float64Array, y: Float64Array, n: number, p: number, lambda: number, task: Task = 'regression'): RidgeModel {
  checkInputs(x, y, n, p);
  if (!(Number.isFinite(lambda) && lambda >= 0)) throw new SurmiseError('learn.badOption', `expected lambda to be a number ≥ 0, got ${lambda}`, { option: 'lambda' });
  const { targets, classes } = targetsFor(y, task);
  const sol = solveRidge(normalEquations(x, targets, n, p), lambda);
  if (!sol) {
    throw new SurmiseError('learn.ridgeSingular', `ridge: the input columns are linearly dependent on the training rows, so λ = ${lambda} has no unique solution; use λ > 0`);
  }
  return makeModel(task, p, lambda, classes, sol);
}

/** λ/n values tried by selectRidge: the penalty relative to the number of training rows. */
export const RIDGE_GRID = [0, 1e-4, 1e-3, 1e-2, 1e-1, 1];

export interface RidgeSelection {
  model: RidgeModel;
  /** every λ tried with its validation score (R² or accuracy); NaN when singular */
  tried: Array<{ lambda: number; score: number }>;
}

/**
 * Choose λ = n·g over g in `grid` (default RIDGE_GRID) by the validation score (R² for regression,
 * accuracy for classification); ties go to the larger λ. One Gram matrix serves every λ.
 */
export function selectRidge(
  train: { x: Float32Array | Float64Array; y: Float64Array; n: number; p: number },
  validation: { x: Float32Array | Float64Array; y: Float64Array; n: number; p: number },
  task: Task = chooseTask(train.y),
  grid: number[] = RIDGE_GRID,
): RidgeSelection {
  checkInputs(train.x, train.y, train.n, train.p);
  checkMatrix(validation.x, validation.n, train.p, 'ridge validation rows');
  if (validation.n < 1) throw new SurmiseError('learn.noRows', 'ridge: no validation rows to choose λ');
  const { targets, classes } = targetsFor(train.y, task);
  const ne = normalEquations(train.x, targets, train.n, train.p);
  const tried: Array<{ lambda: number; score: number }> = [];
  let best: RidgeModel | null = null;
  let bestScore = -Infinity;
  for (const g of grid) {
    const lambda = g * train.n;
    const sol = solveRidge(ne, lambda);
    if (!sol) {
      tried.push({ lambda, score: NaN });
      continue;
    }
    const m = makeModel(task, train.p, lambda, classes, sol);
    const score = validationScore(m, validation);
    tried.push({ lambda, score });
    if (score >= bestScore) {
      bestScore = score;
      best = m;
    }
  }
  if (!best) throw new SurmiseError('learn.ridgeSingular', 'ridge: every λ in the grid gave a singular system');
  return { model: best, tried };
}

function validationScore(m: RidgeModel, v: { x: Float32Array | Float64Array; y: Float64Array; n: number }): number {
  const yhat = m.predictClass(v.x, v.n);
  if (m.task === 'classification') return accuracy(v.y, yhat);
  const s = r2(v.y, yhat);
  return Number.isNaN(s) ? -rmse(v.y, yhat) : s; // constant validation target: fall back to −RMSE
}
