import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { boundArrays } from '../../src/bound/core.ts';
import { topK } from '../../src/bound/topk.ts';
import { equalCountStrata } from '../../src/bound/strata.ts';
import { kahanSum } from '../../src/util/sum.ts';
import { Rng } from '../../src/util/rng.ts';

const all = (n: number) => Int32Array.from({ length: n }, (_, i) => i);

/** Bound lhs ≤ c·rhs (or ≥) on arrays, by the core, stratified along `by`. */
function bound(lhs: number[], rhs: number[], by: number[], upper = true, bins = 10, top = 5) {
  const ratio = Float64Array.from(lhs, (l, i) => l / rhs[i]!);
  return boundArrays(ratio, Float64Array.from(by), all(lhs.length), { bins, top, upper, byName: 'x' });
}

describe('tightest constant, witnesses and strata (brute force, by definition)', () => {
  const data = fc
    .array(fc.tuple(fc.double({ min: -100, max: 100, noNaN: true }), fc.integer({ min: -50, max: 50 })), { minLength: 1, maxLength: 200 })
    .map((rows) => ({ ratio: rows.map((r) => r[0]), by: rows.map((r) => r[1]) }));

  it('c* is the brute-force max (and min in the lower form); witnesses are exactly the top-K ratios', () => {
    fc.assert(
      fc.property(data, fc.integer({ min: 1, max: 12 }), fc.boolean(), ({ ratio, by }, k, upper) => {
        const res = boundArrays(Float64Array.from(ratio), Float64Array.from(by), all(ratio.length), { bins: 4, top: k, upper, byName: 'b' });
        expect(res.constant).toBe(upper ? Math.max(...ratio) : Math.min(...ratio));
        // brute force: sort rows by ratio (best first), ties by row number
        const order = [...ratio.keys()].sort((a, b) => (upper ? ratio[b]! - ratio[a]! : ratio[a]! - ratio[b]!) || a - b);
        expect(Array.from(res.witnessRows)).toEqual(order.slice(0, Math.min(k, ratio.length)));
      }),
    );
  });

  // Brute force by definition: every stratum is a closed value range [low, high]; its rows are exactly the rows whose
  // `by` lies in it; its constant is their max ratio; equal values are never split between strata.
  it('strata partition the rows into value ranges, each constant the brute-force max of its rows', () => {
    fc.assert(
      fc.property(data, fc.integer({ min: 1, max: 15 }), ({ ratio, by }, bins) => {
        const r = Float64Array.from(ratio);
        const b = Float64Array.from(by);
        const strata = equalCountStrata(b, r, all(ratio.length), bins, true);
        expect(strata.length).toBeGreaterThanOrEqual(1);
        expect(strata.length).toBeLessThanOrEqual(Math.min(bins, new Set(by).size));
        expect(strata.reduce((s, st) => s + st.n, 0)).toBe(ratio.length);
        for (let s = 1; s < strata.length; s++) expect(strata[s - 1]!.high).toBeLessThan(strata[s]!.low);
        for (const st of strata) {
          const members = [...ratio.keys()].filter((i) => b[i]! >= st.low && b[i]! <= st.high);
          expect(members.length).toBe(st.n);
          expect(st.constant).toBe(Math.max(...members.map((i) => r[i]!)));
          expect(r[st.witness]).toBe(st.constant);
          expect(st.centre).toBeGreaterThanOrEqual(st.low);
          expect(st.centre).toBeLessThanOrEqual(st.high);
        }
      }),
    );
  });

  it('without ties in `by` the strata have equal counts (±1)', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: -1000, max: 1000 }), { minLength: 1, maxLength: 200 }), fc.integer({ min: 1, max: 15 }), (by, bins) => {
        const strata = equalCountStrata(Float64Array.from(by), Float64Array.from(by, (v) => -v), all(by.length), bins, true);
        expect(strata.length).toBe(Math.min(bins, by.length));
        const sizes = strata.map((s) => s.n);
        expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
      }),
    );
  });

  // An integer column that is 0 on 80% of rows (like a twist count on untwisted rows): the zeros form one stratum.
  it('keeps a large run of equal values in one stratum', () => {
    const by = Float64Array.from({ length: 1000 }, (_, i) => (i < 800 ? 0 : 1 + (i % 37)));
    const strata = equalCountStrata(by, Float64Array.from(by), all(1000), 10, true);
    expect(strata[0]).toMatchObject({ low: 0, high: 0, n: 800 });
    expect(strata.length).toBeGreaterThanOrEqual(2);
  });

  it('with distinct `by` values each stratum is exactly the corresponding slice of the sorted rows', () => {
    const rng = new Rng(11);
    const n = 1003;
    const by = Float64Array.from({ length: n }, () => rng.normal());
    const ratio = Float64Array.from({ length: n }, () => rng.normal());
    const strata = equalCountStrata(by, ratio, all(n), 7, true);
    const order = [...by.keys()].sort((a, b) => by[a]! - by[b]!);
    expect(strata.length).toBe(7);
    let offset = 0;
    strata.forEach((st) => {
      expect([143, 144]).toContain(st.n); // 1003 = 7·143 + 2
      const slice = order.slice(offset, offset + st.n);
      offset += st.n;
      expect(st.constant).toBe(Math.max(...slice.map((i) => ratio[i]!)));
      expect(st.low).toBe(by[slice[0]!]);
      expect(st.high).toBe(by[slice[slice.length - 1]!]);
    });
  });

  it('topK keeps the earliest row among ties', () => {
    expect(Array.from(topK(new Float64Array([5, 9, 1, 9]), null, 2, true))).toEqual([1, 3]);
    expect(Array.from(topK(new Float64Array([5, 9, 1, 9]), null, 2, false))).toEqual([2, 0]);
  });
});

describe('known inequalities', () => {
  // |sin x − x| ≤ |x|³/6, approached as x → 0 (Taylor; ../shared/reference-checks.md, from memory).
  // x ≥ 0.01 keeps the cancellation in x − sin x (relative error ~ 6ε/x² ≈ 7e-12) far below the margin x²/120 ≥ 8e-7.
  it('|sin x − x| ≤ c·|x|³ on (0, 0.5]: c* within 1e-3 of 1/6 from below, witness at the smallest x', () => {
    const rng = new Rng(3);
    const x = Array.from({ length: 5000 }, () => rng.uniform(0.01, 0.5));
    const lhs = x.map((v) => Math.abs(Math.sin(v) - v));
    const res = bound(lhs, x.map((v) => v ** 3), x);
    expect(res.constant).toBeLessThan(1 / 6);
    expect(res.constant).toBeGreaterThan(1 / 6 - 1e-3);
    expect(x[res.witnessRows[0]!]).toBe(Math.min(...x));
    // c* per stratum rises towards 1/6 as x decreases (ratio = 1/6 − x²/120 + …), so the mildest trend is flagged with its direction
    expect(res.trend.kind).toBe('down');
    expect(res.trend.verdict).toMatch(/^increasing towards low x /);
    expect(res.extremeStratum).toBe('lowest');
  });

  // |eˣ − 1 − x| ≤ (e − 2)x² on [−1, 1], attained at x = 1 (from memory); the smallest ratio is at x = −1: e⁻¹ (from the formula).
  it('|eˣ − 1 − x| ≤ c·x² on [−1, 1]: c* = e − 2 at x = 1; lower form 1/e at x = −1', () => {
    const rng = new Rng(5);
    const x = [1, -1, ...Array.from({ length: 4000 }, () => rng.uniform(-1, 1))];
    const lhs = x.map((v) => Math.abs(Math.expm1(v) - v));
    const rhs = x.map((v) => v * v);
    const up = bound(lhs, rhs, x);
    expect(up.constant).toBeCloseTo(Math.E - 2, 14);
    expect(x[up.witnessRows[0]!]).toBe(1);
    const lo = bound(lhs, rhs, x, false);
    expect(lo.constant).toBeCloseTo(1 / Math.E, 14);
    expect(x[lo.witnessRows[0]!]).toBe(-1);
  });

  // Stirling: 1/(12n+1) < ln n! − (n ln n − n + ½ ln 2πn) < 1/(12n) (H. Robbins, "A remark on Stirling's formula",
  // Amer. Math. Monthly 62, 1955; from memory). n ≤ 200: ln n! carries an absolute rounding error ~1e-13, while the
  // upper ratio's distance from 1 is ~1/(30n²) ≥ 8e-7; past n ≈ 1000 float64 cancellation would swamp that margin.
  it('Stirling error: c* of err ≤ c/(12n) is ≤ 1 (at the largest n); lower form err ≥ c/(12n+1) gives c ≥ 1', () => {
    const N = 200;
    const logs = Float64Array.from({ length: N }, (_, k) => Math.log(k + 1));
    const n = Array.from({ length: N }, (_, k) => k + 1);
    const err = n.map((m) => kahanSum(logs.subarray(0, m)) - (m * Math.log(m) - m + 0.5 * Math.log(2 * Math.PI * m)));
    const up = bound(err, n.map((m) => 1 / (12 * m)), n);
    expect(up.constant).toBeLessThanOrEqual(1);
    expect(up.constant).toBeGreaterThan(1 - 1e-5);
    expect(n[up.witnessRows[0]!]).toBe(N);
    const lo = bound(err, n.map((m) => 1 / (12 * m + 1)), n, false);
    expect(lo.constant).toBeGreaterThanOrEqual(1);
    // err·(12n+1) ≈ (1 + 1/(12n))(1 − 1/(30n²)) falls towards 1 (Stirling series 1/(12n) − 1/(360n³), from memory):
    // the smallest ratio is at the largest n, just above 1
    expect(n[lo.witnessRows[0]!]).toBe(N);
    expect(lo.constant).toBeLessThan(1 + 1 / (12 * N));
  });
});

describe('trend of the per-stratum constant', () => {
  const family = (seed: number, f: (t: number, u: number) => number) => {
    const rng = new Rng(seed);
    const t = Array.from({ length: 20000 }, () => Math.exp(rng.uniform(0, 5)));
    const ratio = t.map((v) => f(v, rng.next()));
    return boundArrays(Float64Array.from(ratio), Float64Array.from(t), all(t.length), { bins: 10, top: 3, upper: true, byName: 't' });
  };

  // On ratio = t·u (u uniform), per-stratum max ≈ the stratum's top t: log-log slope 1 (by construction).
  it('ratio growing like t: "increasing towards high t", slope ≈ 1, for the maximum and the 0.9 quantile', () => {
    const res = family(1, (t, u) => t * u);
    expect(res.trend.kind).toBe('up');
    expect(res.trend.verdict).toMatch(/^increasing towards high t /);
    expect(res.trend.quantile!.kind).toBe('up');
    expect(res.trend.quantile!.slope!).toBeCloseTo(1, 1);
    expect(res.trend.caveat).toMatch(/finite limit is still a trend/);
    expect(res.trend.slope!).toBeCloseTo(1, 1);
    expect(res.extremeStratum).toBe('highest');
  });

  it('ratio = u/t: "increasing towards low t", slope ≈ −1', () => {
    const res = family(2, (t, u) => u / t);
    expect(res.trend.kind).toBe('down');
    expect(res.trend.verdict).toMatch(/^increasing towards low t /);
    expect(res.trend.slope!).toBeCloseTo(-1, 1);
    expect(res.extremeStratum).toBe('lowest');
  });

  // Bounded ratio (uniform noise, independent of t): the 95% interval should contain 0 in about 95% of seeds
  // (coverage of the t interval, common practice); 40 seeds, at most 6 alarms (binomial tail ≈ 1.4%).
  it('ratio independent of t (uniform noise): "no trend detected" in at least 34 of 40 seeds', () => {
    let none = 0;
    for (let s = 0; s < 40; s++) if (family(100 + s, (_t, u) => u).trend.kind === 'none') none++;
    expect(none).toBeGreaterThanOrEqual(34);
    expect(family(100, (_t, u) => u).trend.verdict).toMatch(/^no trend detected along t/);
    expect(family(100, (_t, u) => u).trend.drivers).toBeNull();
  });

  it('in the lower form a constant falling towards 0 along t is the failure direction', () => {
    const rng = new Rng(9);
    const t = Array.from({ length: 5000 }, () => Math.exp(rng.uniform(0, 4)));
    const ratio = Float64Array.from(t, (v) => (1 + rng.next()) / v);
    const res = boundArrays(ratio, Float64Array.from(t), all(t.length), { bins: 8, top: 1, upper: false, byName: 't' });
    // the stratum minimum falls as t grows: it increases towards low t
    expect(res.trend.kind).toBe('down');
    expect(res.trend.verdict).toMatch(/^increasing towards low t /);
  });

  // The case from the issue: a flat ratio of 3 with a few noisy rows at tiny rhs. The maximum trends
  // (honestly reported), but the verdict names the handful of rows that set it, and the 0.9 quantile is flat.
  it('a flat ratio with 6 noisy rows at tiny t: the growth is attributed to those rows; the 0.9 quantile shows no trend', () => {
    // (the quantile's own interval raises a false alarm on about 5% of seeds by design; seed 23 is not one of them)
    const rng = new Rng(23);
    const n = 20000;
    const t = Float64Array.from({ length: n }, () => Math.exp(rng.uniform(-4, 4)));
    const ratio = Float64Array.from(t, () => 3 * (1 - 0.5 * rng.next()));
    // six rows in the three strata of smallest t (2000 rows each) get ratios 9, 8 | 6, 5 | 4.5, 4
    const order = Array.from(t.keys()).sort((a, b) => t[a]! - t[b]!);
    const noisy: Array<[number, number]> = [[0, 9], [1, 8], [2500, 6], [2501, 5], [4500, 4.5], [4501, 4]];
    for (const [rank, v] of noisy) ratio[order[rank]!] = v;
    const res = boundArrays(ratio, t, all(n), { bins: 10, top: 3, upper: true, byName: 'rhs' });
    expect(res.trend.kind).toBe('down');
    expect(res.trend.drivers).toEqual({ rows: 6, share: 6 / n, side: 'low', limit: t[order[4501]!]! });
    expect(res.trend.verdict).toMatch(/^increasing towards low rhs \(.*set by 6 rows \(0\.03% of rows\) with rhs ≤ /);
    expect(res.trend.quantile!.kind).toBe('none');
    expect(res.trend.verdict).toMatch(/0\.9 quantile: no trend detected along rhs/);
    expect(res.trend.verdict).not.toMatch(/bounded|unbounded/);
  });

  it('uses the stratum rank when `by` takes values ≤ 0, and says so', () => {
    const rng = new Rng(4);
    const t = Array.from({ length: 3000 }, () => rng.uniform(-1, 1));
    const ratio = Float64Array.from(t, (v) => Math.exp(3 * v) * rng.next());
    const res = boundArrays(ratio, Float64Array.from(t), all(t.length), { bins: 10, top: 1, upper: true, byName: 't' });
    expect(res.trend.basis).toBe('rank');
    expect(res.notes.map((n) => n.text).join(' ')).toMatch(/values ≤ 0.*rank/);
    expect(res.notes.map((n) => n.kind)).toContain('rankBasis');
    expect(res.trend.kind).toBe('up');
  });

  it('is undetermined when a stratum constant is ≤ 0, and notes c* ≤ 0', () => {
    const res = bound([-1, -2, -3, -4, -5, -6], [1, 1, 1, 1, 1, 1], [1, 2, 3, 4, 5, 6], true, 3);
    expect(res.constant).toBe(-1);
    expect(res.trend.kind).toBe('none');
    expect(res.trend.determined).toBe(false);
    expect(res.trend.verdict).toMatch(/^no trend detected: not testable/);
    expect(res.notes.map((n) => n.text).join(' ')).toMatch(/c\* = -1 ≤ 0/);
    expect(res.notes.map((n) => n.kind)).toContain('nonPositive');
  });
});
