import { describe, it, expect } from 'vitest';
import { blochWigner } from '../../../src/knots/hyperbolic/dilog.ts';

describe('Bloch–Wigner dilogarithm', () => {
  it('D(i) is Catalan’s constant and D(e^{iπ/3}) the regular ideal tetrahedron (from memory; Milnor 1982)', () => {
    expect(blochWigner(0, 1)).toBeCloseTo(0.915965594177219, 14);
    expect(blochWigner(0.5, Math.sqrt(3) / 2)).toBeCloseTo(1.0149416064096536, 14);
  });
  it('has the six-fold symmetry D(z) = D(1 − 1/z) = −D(1/z) = −D(1 − z) (Zagier 2007, §I.3)', () => {
    for (const [x, y] of [
      [0.3, 2],
      [-1.7, 0.2],
      [4, 0.01],
      [0.5, 0.5],
    ] as const) {
      const d = blochWigner(x, y);
      const m = x * x + y * y;
      expect(blochWigner(1 - x / m, y / m)).toBeCloseTo(d, 13);
      expect(blochWigner(x / m, -y / m)).toBeCloseTo(-d, 13);
      expect(blochWigner(1 - x, -y)).toBeCloseTo(-d, 13);
    }
  });
  it('is 0 on the real line and maximal at e^{iπ/3} (the regular tetrahedron has the largest volume)', () => {
    expect(blochWigner(2, 0)).toBe(0);
    for (const [x, y] of [
      [0.4, 0.9],
      [0.6, 0.8],
      [0.5, 1],
    ])
      expect(blochWigner(x, y)).toBeLessThan(1.0149416064096536);
  });
});
