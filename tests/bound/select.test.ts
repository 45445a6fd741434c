import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { quantile } from 'simple-statistics';
import { selectByKey, selectValues } from '../../src/bound/select.ts';
import { quantilesType7 } from '../../src/bound/quantile.ts';

const sorted = (a: ArrayLike<number>) => Float64Array.from(a).sort();

describe('selection', () => {
  // Definition of the k-th order statistic (Hoare 1961): compared with a full sort of the same data.
  it('places the k-th smallest value at k, smaller left and larger right', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: -5, max: 5 }), { minLength: 1, maxLength: 60 }), fc.nat(), (xs, kk) => {
        const a = Float64Array.from(xs);
        const k = kk % a.length;
        selectValues(a, 0, a.length - 1, k);
        expect(a[k]).toBe(sorted(xs)[k]);
        for (let i = 0; i < k; i++) expect(a[i]!).toBeLessThanOrEqual(a[k]!);
        for (let i = k + 1; i < a.length; i++) expect(a[i]!).toBeGreaterThanOrEqual(a[k]!);
      }),
    );
  });

  it('selects on an index array keyed by values, keeping the same multiset of indices', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 60 }), fc.nat(), (xs, kk) => {
        const key = Float64Array.from(xs);
        const idx = Int32Array.from(xs.keys());
        const k = kk % xs.length;
        selectByKey(idx, key, 0, xs.length - 1, k);
        expect(key[idx[k]!]).toBe(sorted(xs)[k]);
        expect(Array.from(idx).sort((a, b) => a - b)).toEqual([...xs.keys()]);
      }),
    );
  });
});

describe('quantiles (Hyndman & Fan type 7)', () => {
  // simple-statistics `quantile` implements type 7 (its documentation: "R's type=7 and numpy's default").
  it('agree with simple-statistics quantile on random data', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 1, maxLength: 300 }),
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 6 }),
        (xs, ps) => {
          const ours = quantilesType7(Float64Array.from(xs), ps);
          const ref = ps.map((p) => quantile(xs, p));
          ours.forEach((q, i) => expect(q).toBeCloseTo(ref[i]!, 9));
        },
      ),
    );
  });

  // Hyndman & Fan 1996, type 7 by hand: on 1..10, h = 9p, so Q(0.9) = x₈ + 0.1(x₉ − x₈) = 9.1 (from memory: R's quantile(1:10, 0.9) prints 9.1).
  it('matches the worked value quantile(1:10, 0.9) = 9.1', () => {
    const [q] = quantilesType7(Float64Array.from({ length: 10 }, (_, i) => i + 1), [0.9]);
    expect(q).toBeCloseTo(9.1, 12);
  });

  it('leaves its input untouched and refuses an empty sample', () => {
    const a = Float64Array.from([3, 1, 2]);
    quantilesType7(a, [0.5]);
    expect(Array.from(a)).toEqual([3, 1, 2]);
    expect(() => quantilesType7(new Float64Array(0), [0.5])).toThrow(RangeError);
  });
});
