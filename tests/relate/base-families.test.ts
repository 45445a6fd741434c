import { describe, it, expect } from 'vitest';
import { baseQuantities } from '../../src/relate/bases.ts';
import { BASE_FAMILIES } from '../../src/relate/bases/list.ts';
import { evaluateExpression } from '../../src/table/expr/evaluate.ts';
import { makeTable } from './helpers.ts';

const n = 40;
const f = (g: (i: number) => number) => Float64Array.from({ length: n }, (_, i) => g(i));
const table = makeTable({ x: f((i) => 0.5 + Math.sin(i)), z: { re: f((i) => 1 + Math.cos(i)), im: f((i) => 0.3 + 0.1 * i) }, 'odd name': f((i) => i + 1) });
const rows = Int32Array.from({ length: n }, (_, i) => i);

describe('the base-quantity families', () => {
  it('are column, complex parts, quotients, in that order (relate/README.md "Base quantities")', () => {
    expect(BASE_FAMILIES.map((b) => b.name)).toEqual(['column', 'complex parts', 'quotients']);
    expect(baseQuantities(table, ['x', 'z'], rows).bases.map((b) => `${b.text}:${b.cost}`)).toEqual([
      'x:1', 're(z):2', 'im(z):2', 'abs(z):2', 'arg(z):2', 're(x/z):4', 'im(x/z):4', 're(z/x):4', 'im(z/x):4',
    ]);
  });

  it('every quantity reads back in the expression language with the same values (its own evaluator, complex arithmetic)', () => {
    const { bases } = baseQuantities(table, ['x', 'z', 'odd name'], rows);
    expect(bases.map((b) => b.text)).toContain('re(`odd name`/z)');
    for (const b of bases) {
      const v = evaluateExpression(table, b.text).re;
      b.values.forEach((q, i) => expect(q).toBeCloseTo(v[i]!, 12));
    }
  });
});
