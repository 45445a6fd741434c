import { describe, it, expect } from 'vitest';
import { mean } from 'simple-statistics';
import { sampleIndices, largestIndices, bin2d } from '../../src/report/sample.ts';
import { Rng } from '../../src/util/rng.ts';

describe('sampleIndices', () => {
  it('is deterministic for a seed, sorted, distinct, of the requested size', () => {
    const a = sampleIndices(100_000, 3000, 42);
    const b = sampleIndices(100_000, 3000, 42);
    const c = sampleIndices(100_000, 3000, 43);
    expect(Array.from(a)).toEqual(Array.from(b));
    expect(Array.from(a)).not.toEqual(Array.from(c));
    expect(a.length).toBe(3000);
    for (let i = 1; i < a.length; i++) expect(a[i]!).toBeGreaterThan(a[i - 1]!);
    expect(a[0]!).toBeGreaterThanOrEqual(0);
    expect(a[a.length - 1]!).toBeLessThan(100_000);
  });

  it('always keeps the rows asked for', () => {
    const s = new Set(sampleIndices(50_000, 100, 1, [7, 49_999, 12_345]));
    for (const k of [7, 49_999, 12_345]) expect(s.has(k)).toBe(true);
    expect(s.size).toBe(100);
  });

  it('returns every index when there are few rows', () => {
    expect(Array.from(sampleIndices(5, 10, 0))).toEqual([0, 1, 2, 3, 4]);
  });

  it('includes each row with probability k/n (simple random sample; chi-square, common practice)', () => {
    // 400 draws of 10 from 50: each index is expected 80 times; chi-square with 49 d.f.
    // has its 99.9th percentile near 85.4 (standard chi-square tables, from memory; for 50 d.f. 86.7).
    const hits = new Array(50).fill(0);
    for (let s = 0; s < 400; s++) for (const i of sampleIndices(50, 10, s)) hits[i]++;
    const chi2 = hits.reduce((acc, h) => acc + (h - 80) ** 2 / 80, 0);
    expect(chi2).toBeLessThan(85.4);
  });
});

describe('largestIndices', () => {
  it('finds the largest finite values, largest first', () => {
    expect(largestIndices([3, NaN, 9, 1, Infinity, 9], 3)).toEqual([2, 5, 0]);
  });
});

describe('bin2d', () => {
  it('counts every finite row once and averages the colour per cell like a grouped mean', () => {
    const rng = new Rng(5);
    const n = 20_000;
    const x: number[] = [], y: number[] = [], c: number[] = [];
    for (let i = 0; i < n; i++) {
      x.push(rng.uniform(0, 10));
      y.push(rng.uniform(-1, 1));
      c.push(rng.normal());
    }
    x[3] = NaN;
    c[4] = Infinity;
    const b = bin2d(x, y, 10, 4, c);
    expect(b.nonFinite).toBe(2);
    expect(b.binned).toBe(n - 2);
    expect(b.cells.reduce((s, q) => s + q.count, 0)).toBe(n - 2);
    // Reference: group rows by cell independently and take simple-statistics' mean of each group.
    const groups = new Map<string, number[]>();
    const wx = (b.xMax - b.xMin) / 10, wy = (b.yMax - b.yMin) / 4;
    for (let i = 0; i < n; i++) {
      if (!Number.isFinite(x[i]!) || !Number.isFinite(c[i]!)) continue;
      const cx = Math.min(9, Math.floor((x[i]! - b.xMin) / wx));
      const cy = Math.min(3, Math.floor((y[i]! - b.yMin) / wy));
      const k = `${cx},${cy}`;
      if (!groups.has(k)) groups.set(k, []);
      groups.get(k)!.push(c[i]!);
    }
    expect(b.cells.length).toBe(groups.size);
    for (const cell of b.cells) {
      const cx = Math.round((cell.x0 - b.xMin) / wx);
      const cy = Math.round((cell.y0 - b.yMin) / wy);
      const g = groups.get(`${cx},${cy}`)!;
      expect(cell.count).toBe(g.length);
      expect(cell.mean!).toBeCloseTo(mean(g), 12);
    }
  });

  it('puts the maximum on the last cell and handles a constant column', () => {
    const b = bin2d([0, 1, 2], [5, 5, 5], 2, 2);
    expect(b.cells.reduce((s, q) => s + q.count, 0)).toBe(3);
    expect(b.yMin).toBe(4.5);
    expect(b.yMax).toBe(5.5);
    expect(b.cells.every((q) => q.mean === null)).toBe(true);
  });
});
