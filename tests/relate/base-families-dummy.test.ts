/**
 * "A new family is one file and one line": a base-quantity family added to the one list
 * (bases/list.ts, mocked here to append the conjugate product a·conj(b) of two complex columns,
 * real part) enters the search's base quantities, checked like the others.
 */
import { describe, it, expect, vi } from 'vitest';
import type { BaseFamily } from '../../src/relate/bases/family.ts';

// re(a·conj(b)) = re(a)re(b) + im(a)im(b) (definition of the conjugate)
const conjugateProducts: BaseFamily = {
  name: 'conjugate products',
  description: 're(a*conj(b)) of two complex columns (test only)',
  ofPair: (a, b) => (a.complex && b.complex ? [{ text: `re(${a.name}*conj(${b.name}))`, cost: 5, values: a.re.map((r, i) => r * b.re[i]! + a.im[i]! * b.im[i]!) }] : []),
};

vi.mock('../../src/relate/bases/list.ts', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../src/relate/bases/list.ts')>();
  return { BASE_FAMILIES: [...real.BASE_FAMILIES, conjugateProducts] };
});

const { baseQuantities } = await import('../../src/relate/bases.ts');
const { evaluateExpression } = await import('../../src/table/expr/evaluate.ts');
const { makeTable } = await import('./helpers.ts');

describe('a base-quantity family registered in the one list', () => {
  it('enters the base quantities after the families before it, and its text reads back', () => {
    const n = 30;
    const f = (g: (i: number) => number) => Float64Array.from({ length: n }, (_, i) => g(i));
    const t = makeTable({ a: { re: f((i) => i + 1), im: f((i) => Math.sin(i)) }, b: { re: f((i) => Math.cos(i) + 2), im: f((i) => 0.5 * i) } });
    const { bases } = baseQuantities(t, ['a', 'b'], Int32Array.from({ length: n }, (_, i) => i));
    const texts = bases.map((q) => q.text);
    // per ordered pair, each family in list order
    expect(texts.slice(-6)).toEqual(['re(a/b)', 'im(a/b)', 're(a*conj(b))', 're(b/a)', 'im(b/a)', 're(b*conj(a))']);
    const q = bases.find((x) => x.text === 're(a*conj(b))')!;
    const v = evaluateExpression(t, q.text).re;
    q.values.forEach((x, i) => expect(x).toBeCloseTo(v[i]!, 12));
  });
});
