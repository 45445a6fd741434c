import { describe, it, expect } from 'vitest';
import { braidSeifertMatrix, centre, pencilDeterminant, randomBraid } from '../../src/knots/index.ts';
import { conwaySign } from '../../src/knots/circlesign.ts';
import { Rng } from '../../src/util/rng.ts';

describe('conwaySign: the sign of Δ from the Hermitian form at a rational point of the circle', () => {
  it('accepts the exact pencil t^{−m/2}·det(V − tVᵀ) (the normalisation itself) and refuses its negative, on 1,500 random braid closures of 2–4 strands, knots and links', () => {
    const rng = new Rng(81);
    let checked = 0;
    for (let t = 0; t < 1500; t++) {
      const b = randomBraid(rng, 2 + rng.int(3), 1 + rng.int(11));
      const V = braidSeifertMatrix(b);
      const exact = centre(pencilDeterminant(V, V.map((r, i) => r.map((_, j) => -V[j]![i]!))));
      if (exact.coefficients.length === 0) {
        expect(conwaySign(exact, V)).toBeUndefined();
        continue;
      }
      expect(conwaySign(exact, V)).toBe(1);
      expect(conwaySign({ ...exact, coefficients: exact.coefficients.map((x) => -x) }, V)).toBe(-1);
      checked++;
    }
    expect(checked).toBeGreaterThan(800);
  });
});
