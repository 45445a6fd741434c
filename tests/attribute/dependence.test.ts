import { describe, it, expect } from 'vitest';
import { dependenceGrid, partialDependence } from '../../src/attribute/dependence.ts';
import { Rng } from '../../src/util/rng.ts';

// Known answers from the definition (Friedman 2001, §8.2): for an additive f(x) = g(x₀) + h(x₁),
// PD₀(v) = g(v) + mean h(x₁); for a product f = x₀·x₁, PD₀(v) = v·mean(x₁).
describe('partial dependence', () => {
  const rng = new Rng(3);
  const n = 400;
  const p = 2;
  const x = Float64Array.from({ length: n * p }, () => rng.uniform(-2, 2));
  const mean1 = Array.from({ length: n }, (_, i) => x[i * p + 1]!).reduce((a, b) => a + b, 0) / n;

  it('additive model: PD₀(v) = 2v + mean(x₁²), exactly', () => {
    const f = (z: Float64Array, m: number) => Float64Array.from({ length: m }, (_, i) => 2 * z[i * p]! + z[i * p + 1]! ** 2);
    const meanSq = Array.from({ length: n }, (_, i) => x[i * p + 1]! ** 2).reduce((a, b) => a + b, 0) / n;
    const c = partialDependence(f, x, n, p, 0, [-1, 0, 1.5]);
    expect(c.grid).toEqual([-1, 0, 1.5]);
    c.mean.forEach((m, k) => expect(m).toBeCloseTo(2 * c.grid[k]! + meanSq, 12));
  });

  it('product model: PD₀(v) = v·mean(x₁); the input rows are left unchanged', () => {
    const before = Float64Array.from(x);
    const f = (z: Float64Array, m: number) => Float64Array.from({ length: m }, (_, i) => z[i * p]! * z[i * p + 1]!);
    const c = partialDependence(f, x, n, p, 0, [-2, 2]);
    expect(c.mean[0]).toBeCloseTo(-2 * mean1, 12);
    expect(c.mean[1]).toBeCloseTo(2 * mean1, 12);
    expect(x).toEqual(before);
  });

  it('grid: the distinct values of a column with few of them, else equal steps from the 5% to the 95% order statistic', () => {
    const ints = Float64Array.from([3, 1, 2, 1, 3, 2, 2, 1], (v) => v);
    expect(dependenceGrid(ints, 8, 1, 0, 25)).toEqual([1, 2, 3]);
    const g = dependenceGrid(x, n, p, 0, 5);
    expect(g).toHaveLength(5);
    const sorted = Array.from({ length: n }, (_, i) => x[i * p]!).sort((a, b) => a - b);
    expect(g[0]).toBe(sorted[Math.floor(0.05 * (n - 1))]);
    expect(g[4]).toBeCloseTo(sorted[Math.floor(0.95 * (n - 1))]!, 12);
  });
});
