import { describe, it, expect } from 'vitest';
import { detectLattice, exactFraction, roundToLattice } from '../../src/relate/lattice.ts';

describe('lattice', () => {
  it('a signature is always even (fact of the trade): step 2, offset 0', () => {
    expect(detectLattice(Float64Array.of(-4, 2, 0, 6, -10))).toEqual({ step: 2, offset: 0 });
  });
  it('odd integers 1 + 2ℤ; step 3 with offset 1; no lattice for non-integers or a constant', () => {
    expect(detectLattice([1, 3, -5, 7])).toEqual({ step: 2, offset: 1 });
    expect(detectLattice([1, 4, 10, -2])).toEqual({ step: 3, offset: 1 });
    expect(detectLattice([1, 2.5])).toBeNull();
    expect(detectLattice([4, 4, 4])).toBeNull();
  });
  it('rounds to the nearest lattice point, halves away from zero as C round does (C99 7.12.9.6)', () => {
    const L = { step: 2, offset: 0 };
    expect(roundToLattice(3.2, L)).toBe(4);
    expect(roundToLattice(2.9, L)).toBe(2);
    expect(roundToLattice(-3, L)).toBe(-4);
    expect(roundToLattice(3, L)).toBe(4);
    expect(roundToLattice(0.4, { step: 2, offset: 1 })).toBe(1);
    expect(exactFraction([3.9, 0.2, -2.1, 5], [4, 2, -2, 6], [0, 1, 2, 3], L)).toBe(0.75); // 0.2 rounds to 0, not 2
  });
});
