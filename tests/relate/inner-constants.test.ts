import { describe, it, expect } from 'vitest';
import { fitInnerConstants } from '../../src/relate/inner-constants.ts';
import { type Tree } from '../../src/relate/tree.ts';
import { Rng } from '../../src/util/rng.ts';

const a: Tree = { op: 'base', id: 0, text: 'a', cost: 1 };
const rows = Int32Array.from({ length: 1500 }, (_, i) => i);

describe('fitInnerConstants (Levenberg–Marquardt on the variable-projection residual)', () => {
  it('the standard normal density exp(−a²/2)/√(2π) (Abramowitz & Stegun 26.2.1, from memory): from exp(−a²) the inner constant goes to −1/2', () => {
    const rng = new Rng(3);
    const av = Float64Array.from(rows, () => rng.uniform(-2.5, 2.5));
    const y = av.map((x) => Math.exp(-x * x / 2) / Math.sqrt(2 * Math.PI) + 0.001 * rng.normal());
    const start: Tree = { op: 'fn', f: 'exp', a: { op: 'scale', c: -1, a: { op: 'pow', num: 2, den: 1, a } } };
    const fit = fitInnerConstants([start], [av], rows, y)!;
    expect(fit.estimates[0]).toBeCloseTo(-0.5, 2);
    expect(fit.used).toEqual([-0.5]);
    expect(fit.se[0]).toBeGreaterThan(0);
    expect(fit.se[0]).toBeLessThan(0.01);
  });
  it('log(1 + a) from log(a + 0.7): the shift constant moves to 1 (known answer by construction)', () => {
    const rng = new Rng(4);
    const av = Float64Array.from(rows, () => rng.uniform(0.1, 4));
    const y = av.map((x) => 3 * Math.log(1 + x) + 0.002 * rng.normal());
    const start: Tree = { op: 'fn', f: 'log', a: { op: 'shift', c: 0.7, s: 1, a } };
    const fit = fitInnerConstants([start], [av], rows, y)!;
    expect(fit.used).toEqual([1]);
  });
  it('refuses steps that leave a factor 4 of the start (no cos(εx) Taylor imitation of x²)', () => {
    const rng = new Rng(6);
    const av = Float64Array.from(rows, () => rng.uniform(0.5, 2));
    const y = av.map((x) => x * x + 0.01 * rng.normal());
    const start: Tree = { op: 'fn', f: 'cos', a: { op: 'scale', c: 0.5, a } };
    const fit = fitInnerConstants([start], [av], rows, y)!;
    expect(Math.abs(fit.estimates[0]!)).toBeGreaterThanOrEqual(0.125);
  });
});
