import { describe, it, expect } from 'vitest';
import { FUNCTION_FAMILIES, FN, type FunctionFamily } from '../../src/relate/terms/index.ts';
import { unaryOps } from '../../src/relate/grammar.ts';
import { FUNCTION_NAMES } from '../../src/table/expr/functions.ts';
import { evaluateExpression } from '../../src/table/expr/evaluate.ts';
import type { Tree } from '../../src/relate/tree.ts';
import { makeTable } from './helpers.ts';

const x = Float64Array.from([0.25, 0.5, 1, 2, 3.5, 7]);
const table = makeTable({ x });
const base: Tree = { op: 'base', id: 0, text: 'x', cost: 1 };

describe('the function families of the formula search', () => {
  it('each is a function of the expression language with the same values, so a printed formula reads back', () => {
    for (const f of FUNCTION_FAMILIES as readonly FunctionFamily[]) {
      expect(FUNCTION_NAMES).toContain(f.name);
      const v = evaluateExpression(table, `${f.name}(x)`).re;
      x.forEach((xi, i) => expect((FN as Record<string, (x: number) => number>)[f.name]!(xi)).toBeCloseTo(v[i]!, 12));
      for (const [c, text] of f.scaled ?? []) {
        const w = evaluateExpression(table, `${f.name}(${text.replace('u', 'x')})`).re;
        x.forEach((xi, i) => expect(f.value(c * xi)).toBeCloseTo(w[i]!, 12));
      }
    }
  });

  it('the grammar tries them in the README order (relate/README.md "Grammar"): powers, roots, functions, constants inside, shifts', () => {
    expect(unaryOps([-3, 3]).map((o) => o.label('u'))).toEqual([
      '1/u^3', '1/u^2', '1/u', 'u^2', 'u^3', 'sqrt(u)', '1/sqrt(u)',
      'log(u)', 'exp(u)', 'sin(u)', 'cos(u)', 'abs(u)',
      'exp(-u)', 'exp(-u/2)', 'exp(u/2)', 'exp(2*u)', 'sin(u/2)', 'sin(2*u)', 'cos(u/2)', 'cos(2*u)',
      'u + 1', '1 - u',
    ]);
  });

  it('refuses the re-spellings the README names: exp(log u) = u, (u²)³ = u⁶, abs(exp u) = exp u, exp(u)² = exp(2u), abs(u)² = u²', () => {
    const ops = new Map(unaryOps([-3, 3]).map((o) => [o.label('u'), o]));
    const op = (l: string) => ops.get(l)!;
    expect(op('exp(u)').accepts(op('log(u)').make(base))).toBe(false);
    expect(op('u^3').accepts(op('u^2').make(base))).toBe(false);
    expect(op('abs(u)').accepts(op('exp(u)').make(base))).toBe(false);
    expect(op('u^2').accepts(op('exp(u)').make(base))).toBe(false);
    expect(op('u^2').accepts(op('abs(u)').make(base))).toBe(false);
    expect(op('u^3').accepts(op('abs(u)').make(base))).toBe(true); // |u|³ is not u³
    expect(op('log(u)').undefinedAt(0)).toBe('is not positive');
    expect(op('sin(u)').undefinedAt(-1)).toBeNull();
  });
});
