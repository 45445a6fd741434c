import type { TrainData } from '../../src/learn/data.ts';
import { Rng } from '../../src/util/rng.ts';

/** Friedman #1 (Friedman 1991, Ann. Statist. 19): y = 10 sin(π x1 x2) + 20 (x3 − 0.5)² + 10 x4 + 5 x5 + ε, x ~ U[0,1]^10, ε ~ N(0,1); inputs standardized (U[0,1] has mean ½, SD 1/√12). */
export function friedman(n: number, seed: number): TrainData {
  const r = new Rng(seed);
  const x = new Float64Array(n * 10);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < 10; j++) x[i * 10 + j] = r.next();
    const a = x.subarray(i * 10, i * 10 + 10);
    y[i] = 10 * Math.sin(Math.PI * a[0]! * a[1]!) + 20 * (a[2]! - 0.5) ** 2 + 10 * a[3]! + 5 * a[4]! + r.normal();
  }
  for (let k = 0; k < x.length; k++) x[k] = (x[k]! - 0.5) * Math.sqrt(12);
  return { x, y, n, p: 10 };
}
