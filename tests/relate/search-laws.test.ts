/**
 * The laws the formula search must find (issue "Discover formulas, not only fit them"), each on a
 * neutral synthetic table: the law's columns plus distractors, 5 columns in all, noise 0.5% of the
 * law's standard deviation. Known answers by construction; the checks are the recovered formula
 * (the same function as the law, found by evaluating it) and a held-out RMSE within 3× the noise.
 */
import { describe, it, expect } from 'vitest';
import { searchRelations } from '../../src/relate/search.ts';
import { compileExpression } from '../../src/table/expr/evaluate.ts';
import { Rng } from '../../src/util/rng.ts';
import { makeTable } from './helpers.ts';

const N = 1500;
type Law = { law: string; complex?: boolean };
const LAWS: Law[] = [
  { law: '2*log(a) - b' },
  { law: 're(z)*im(z)', complex: true },
  { law: 'abs(z)^2 + a', complex: true },
  { law: 'abs(z)/a', complex: true },
  { law: 'a*b*c' },
  { law: '(a + b)^2' },
  { law: 'sqrt(a^2 + b^2)' },
  { law: 'a/(1 + a)' },
  { law: 'exp(-a^2/2)' },
  { law: 'sin(a)*b' },
  { law: 'cos(a - b)' },
  { law: 'log(1 + a*b)' },
];

function lawTable(l: Law, seed: number) {
  const rng = new Rng(seed);
  const u = () => Float64Array.from({ length: N }, () => rng.uniform(0.5, 3));
  type Cols = Record<string, Float64Array | { re: Float64Array; im: Float64Array }>;
  const cols: Cols = l.complex ? { a: u(), z: { re: u(), im: u() }, d: u(), g: u(), h: u() } : { a: u(), b: u(), c: u(), d: u(), g: u() };
  const exact = compileExpression(makeTable(cols), l.law).evaluate().re;
  const mean = exact.reduce((s, x) => s + x, 0) / N;
  const sd = Math.sqrt(exact.reduce((s, x) => s + (x - mean) ** 2, 0) / N);
  const noise = 0.005 * sd;
  const y = exact.map((x) => x + noise * rng.normal());
  return { table: makeTable({ ...cols, y }), from: Object.keys(cols), noise };
}

describe('formula search recovers the laws of the issue (known answers by construction)', () => {
  it.each(LAWS.map((l, k) => [l.law, l, k] as const))('%s', (_name, l, k) => {
    const { table, from, noise } = lawTable(l, 100 + k);
    const r = searchRelations(table, { target: 'y', from, maxTerms: 2, seed: k, maxComplexity: 6, beam: 60 });
    const best = r.candidates[0]!;
    expect(best.heldOutRmse).toBeLessThan(3 * noise);
    // the rounded formula is the law itself: equal values on every row (up to the rounding of rationals)
    const law = compileExpression(table, l.law).evaluate().re;
    const found = compileExpression(table, best.roundedFormula).evaluate().re;
    let worst = 0;
    for (let i = 0; i < N; i++) worst = Math.max(worst, Math.abs(found[i]! - law[i]!));
    expect(worst, best.roundedFormula).toBeLessThan(3 * noise);
  });
});
