/**
 * "A new family is one file and one line": a function family added to the one list (terms/list.ts,
 * mocked here to append the tangent) becomes a grammar operation and a tree function, and the
 * search finds a law that needs it, printed so that it reads back in the expression language.
 */
import { describe, it, expect, vi } from 'vitest';
import type { FunctionFamily } from '../../src/relate/terms/family.ts';

const tan: FunctionFamily<'tan'> = { name: 'tan', description: 'tangent (test only)', value: Math.tan, refuses: [] };

vi.mock('../../src/relate/terms/list.ts', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../src/relate/terms/list.ts')>();
  return { FUNCTION_FAMILIES: [...real.FUNCTION_FAMILIES, tan] };
});

const { unaryOps } = await import('../../src/relate/grammar.ts');
const { FN } = await import('../../src/relate/tree.ts');
const { searchRelations } = await import('../../src/relate/search.ts');
const { evaluateExpression } = await import('../../src/table/expr/evaluate.ts');
const { makeTable } = await import('./helpers.ts');
const { Rng } = await import('../../src/util/rng.ts');

describe('a function family registered in the one list', () => {
  it('is a grammar operation and a tree function', () => {
    expect(unaryOps([-2, 2]).map((o) => o.label('u'))).toContain('tan(u)');
    expect((FN as Record<string, (x: number) => number>).tan!(Math.PI / 4)).toBeCloseTo(1, 15); // tan(π/4) = 1
  });

  it('lets the search find y = 2·tan(x) + 1 (planted, x uniform on [−1.2, 1.2], noise SD 0.01), and the formula reads back', () => {
    const rng = new Rng(4);
    const x = Float64Array.from({ length: 600 }, () => rng.uniform(-1.2, 1.2));
    const w = Float64Array.from({ length: 600 }, () => rng.uniform(-1, 1));
    const y = Float64Array.from(x, (v) => 2 * Math.tan(v) + 1 + 0.01 * rng.normal());
    const t = makeTable({ x, w, y });
    const r = searchRelations(t, { target: 'y', from: ['x', 'w'], maxTerms: 1, maxComplexity: 3, seed: 2, timeLimit: 60 });
    const best = r.candidates[0]!;
    expect(best.terms).toEqual(['tan(x)']);
    expect(best.rationals[0]!.text).toBe('2');
    const back = evaluateExpression(t, best.terms[0]!).re;
    x.forEach((v, i) => expect(back[i]).toBeCloseTo(Math.tan(v), 12));
  });
});
