import { describe, it, expect } from 'vitest';
import { formulaText, treeText } from '../../src/relate/canonical.ts';
import { evaluateTree, type Tree } from '../../src/relate/tree.ts';
import { compileExpression } from '../../src/table/expr/evaluate.ts';
import { Rng } from '../../src/util/rng.ts';
import { makeTable } from './helpers.ts';

const b = (id: number, text: string): Tree => ({ op: 'base', id, text, cost: 1 });
const a = b(0, 'a');
const bb = b(1, 'b');
const v = b(2, 'v');
const pow = (x: Tree, num: number, den = 1): Tree => ({ op: 'pow', num, den, a: x });
const mul = (x: Tree, y: Tree): Tree => ({ op: 'mul', a: x, b: y });
const div = (x: Tree, y: Tree): Tree => ({ op: 'div', a: x, b: y });

const cases: Array<[Tree, string]> = [
  [div(mul(pow(a, 2), bb), bb), 'a^2'], // b/b cancels: the same function, printed once
  [div(pow(a, 2), bb), 'a^2/b'],
  [mul(bb, a), 'a*b'], // factors ordered by the column order
  [mul(mul(a, bb), v), 'a*b*v'],
  [pow({ op: 'add', a, b: bb }, 2), '(a + b)^2'],
  [pow({ op: 'add', a: pow(a, 2), b: pow(bb, 2) }, 1, 2), 'sqrt(a^2 + b^2)'],
  [{ op: 'fn', f: 'exp', a: { op: 'scale', c: -0.5, a: pow(a, 2) } }, 'exp(-a^2/2)'],
  [{ op: 'fn', f: 'log', a: { op: 'shift', c: 1, s: 1, a: mul(a, bb) } }, 'log(a*b + 1)'],
  [pow({ op: 'shift', c: 1, s: -1, a: pow(v, 2) }, -1, 2), '1/sqrt(1 - v^2)'],
  [{ op: 'fn', f: 'cos', a: { op: 'sub', a, b: bb } }, 'cos(a - b)'],
  [div(a, { op: 'shift', c: 1, s: 1, a }), 'a/(a + 1)'],
  [pow(a, 3, 2), 'a^(3/2)'],
];

describe('canonical text', () => {
  it.each(cases)('prints %j as the expected text, and the expression language reads it back to the same values', (tree, text) => {
    expect(treeText(tree)).toBe(text);
    const rng = new Rng(5);
    const cols = { a: Float64Array.from({ length: 50 }, () => rng.uniform(0.1, 0.9)), b: Float64Array.from({ length: 50 }, () => rng.uniform(0.1, 0.9)), v: Float64Array.from({ length: 50 }, () => rng.uniform(0.1, 0.9)) };
    const mine = evaluateTree(tree, [cols.a, cols.b, cols.v], Int32Array.from({ length: 50 }, (_, i) => i));
    const theirs = compileExpression(makeTable(cols), text).evaluate().re;
    for (let i = 0; i < 50; i++) expect(theirs[i]).toBeCloseTo(mine[i]!, 12);
  });
  it('merges a rational coefficient into the monomial: 3*a^2/b, -3*a/2, 3*a^2/(2*b); constant last, dropped when 0', () => {
    expect(formulaText({ num: 0, den: 1 }, [{ num: 3, den: 1 }], [div(pow(a, 2), bb)])).toBe('3*a^2/b');
    expect(formulaText({ num: 1, den: 4 }, [{ num: -3, den: 2 }], [a])).toBe('-3*a/2 + 1/4');
    expect(formulaText({ num: 0, den: 1 }, [{ num: 3, den: 2 }], [div(pow(a, 2), bb)])).toBe('3*a^2/(2*b)');
    expect(formulaText({ num: 0, den: 1 }, [{ num: 2, den: 1 }, { num: -1, den: 1 }], [{ op: 'fn', f: 'log', a }, bb])).toBe('2*log(a) - b');
    expect(formulaText({ decimal: 0.25 }, [{ decimal: 2.5 }], [{ op: 'sub', a, b: bb }])).toBe('2.5*(a - b) + 0.25');
  });
});
