/** Analytic test models with exact gradients (helpers for the attribution tests; not a test file). */
import type { ScalarModel } from '../../src/attribute/types.ts';
import { Rng } from '../../src/util/rng.ts';

/** Build a ScalarModel from a per-row function and gradient. */
export function analyticModel(
  p: number,
  f: (r: Float64Array) => number,
  grad: (r: Float64Array, out: Float64Array) => void,
): ScalarModel {
  return {
    p,
    predict(x, n) {
      const out = new Float64Array(n);
      for (let i = 0; i < n; i++) out[i] = f(x.subarray(i * p, (i + 1) * p));
      return out;
    },
    inputGradients(x, n) {
      const out = new Float64Array(n * p);
      for (let i = 0; i < n; i++) grad(x.subarray(i * p, (i + 1) * p), out.subarray(i * p, (i + 1) * p));
      return out;
    },
  };
}

/** Friedman #1 (Friedman 1991, Ann. Statist. 19): 10 sin(π x1 x2) + 20 (x3 − ½)² + 10 x4 + 5 x5; x6..x10 inert. */
export const friedman1 = analyticModel(
  10,
  (r) => 10 * Math.sin(Math.PI * r[0]! * r[1]!) + 20 * (r[2]! - 0.5) ** 2 + 10 * r[3]! + 5 * r[4]!,
  (r, g) => {
    const c = 10 * Math.PI * Math.cos(Math.PI * r[0]! * r[1]!);
    g.fill(0);
    g[0] = c * r[1]!;
    g[1] = c * r[0]!;
    g[2] = 40 * (r[2]! - 0.5);
    g[3] = 10;
    g[4] = 5;
  },
);

/** Ishigami (Ishigami & Homma 1990) with a = 7, b = 0.1: sin x1 + a sin² x2 + b x3⁴ sin x1. */
export const ISHIGAMI_A = 7;
export const ISHIGAMI_B = 0.1;
export const ishigami = analyticModel(
  3,
  (r) => Math.sin(r[0]!) + ISHIGAMI_A * Math.sin(r[1]!) ** 2 + ISHIGAMI_B * r[2]! ** 4 * Math.sin(r[0]!),
  (r, g) => {
    g[0] = Math.cos(r[0]!) * (1 + ISHIGAMI_B * r[2]! ** 4);
    g[1] = 2 * ISHIGAMI_A * Math.sin(r[1]!) * Math.cos(r[1]!);
    g[2] = 4 * ISHIGAMI_B * r[2]! ** 3 * Math.sin(r[0]!);
  },
);

/** A linear model w·x + b. */
export function linearModel(w: number[], b = 0): ScalarModel {
  return analyticModel(
    w.length,
    (r) => w.reduce((s, wj, j) => s + wj * r[j]!, b),
    (_r, g) => g.set(w),
  );
}

/** n×p rows, each entry uniform on [lo, hi). */
export function uniformRows(n: number, p: number, lo: number, hi: number, seed: number): Float64Array {
  const rng = new Rng(seed);
  const x = new Float64Array(n * p);
  for (let k = 0; k < n * p; k++) x[k] = rng.uniform(lo, hi);
  return x;
}

/** n×p rows of independent standard normals. */
export function normalRows(n: number, p: number, seed: number): Float64Array {
  const rng = new Rng(seed);
  const x = new Float64Array(n * p);
  for (let k = 0; k < n * p; k++) x[k] = rng.normal();
  return x;
}

/** Indices sorted by score, best first. */
export function orderOf(scores: ArrayLike<number>): number[] {
  return Array.from({ length: scores.length }, (_, k) => k).sort((i, j) => scores[j]! - scores[i]!);
}
