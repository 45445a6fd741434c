/**
 * Closed forms from handbooks, with the target computed numerically (a sum, a quadrature), found
 * back by the formula search with exact rational coefficients.
 */
import { describe, it, expect } from 'vitest';
import { searchRelations } from '../../src/relate/search.ts';
import { compileExpression } from '../../src/table/expr/evaluate.ts';
import { Rng } from '../../src/util/rng.ts';
import { makeTable } from './helpers.ts';

describe('formula search on handbook closed forms', () => {
  it('Σ_{k≤n} k² = n³/3 + n²/2 + n/6 (Graham, Knuth & Patashnik, Concrete Mathematics §2.5, from memory): exact rationals, integer lattice, every held-out row exact', () => {
    const rng = new Rng(11);
    const n = Float64Array.from({ length: 600 }, (_, i) => i + 1);
    const m = Float64Array.from(n, () => rng.uniform(1, 5)); // a distractor
    let acc = 0;
    const s = Float64Array.from(n, (k) => (acc += k * k)); // summed, not the closed form
    const t = makeTable({ n, m, s });
    const r = searchRelations(t, { target: 's', from: ['n', 'm'], maxTerms: 3, seed: 1, maxComplexity: 4 });
    const best = r.candidates[0]!;
    expect(r.lattice).toEqual({ step: 1, offset: 0 });
    expect(best.roundedHeldOutExact).toBe(1);
    const closed = compileExpression(t, 'n^3/3 + n^2/2 + n/6').evaluate().re;
    const found = compileExpression(t, best.roundedFormula).evaluate().re;
    for (let i = 0; i < n.length; i++) expect(Math.abs(found[i]! - closed[i]!)).toBeLessThan(1e-6 * closed[i]!);
    expect(best.roundedFormula).toBe('n^3/3 + n^2/2 + n/6');
  });
  it('Σ_{k≤n} k³ = (n(n + 1)/2)² (Nicomachus; Concrete Mathematics §2.5, from memory): found exactly, every held-out row on the lattice', () => {
    const rng = new Rng(12);
    const n = Float64Array.from({ length: 500 }, (_, i) => i + 1);
    const w = Float64Array.from(n, () => rng.uniform(0.5, 3)); // a distractor
    let acc = 0;
    const s = Float64Array.from(n, (k) => (acc += k * k * k));
    const t = makeTable({ n, w, s });
    const r = searchRelations(t, { target: 's', from: ['n', 'w'], maxTerms: 2, seed: 2, maxComplexity: 5 });
    const best = r.candidates[0]!;
    expect(best.roundedHeldOutExact).toBe(1);
    const closed = compileExpression(t, '(n*(n + 1)/2)^2').evaluate().re;
    const found = compileExpression(t, best.roundedFormula).evaluate().re;
    for (let i = 0; i < n.length; i++) expect(Math.abs(found[i]! - closed[i]!)).toBeLessThan(1e-6 * closed[i]!);
  });
});
