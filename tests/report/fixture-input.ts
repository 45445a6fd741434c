/**
 * A realistic, invented report input for the tests (neutral names): a table of n rows where
 * z = 3k + 0.1·(b·w)·u³ (u uniform on (−1, 1)) and a "wide" sub-family has large w. Every number is computed from the generated rows, so the bound's constant, its witness and
 * its strata are consistent with each other.
 */
import { Rng } from '../../src/util/rng.ts';
import type { ReportInput, ReportBoundResult } from '../../src/report/types.ts';

export const EVIL = '<img src=x onerror=alert(1)>';

export interface FixtureRows {
  k: number[];
  z: number[];
  b: number[];
  w: number[];
  family: string[];
  rec: string[];
}

export function makeRows(n: number, seed: number): FixtureRows {
  const rng = new Rng(seed);
  const r: FixtureRows = { k: [], z: [], b: [], w: [], family: [], rec: [] };
  for (let i = 0; i < n; i++) {
    const wide = rng.next() < 0.2;
    const m = 1 + rng.int(12);
    const w = wide ? 0.9 * m : rng.uniform(1, 3);
    const b = rng.uniform(2, 20);
    const k = rng.int(11) - 5;
    const u = rng.uniform(-1, 1);
    r.k.push(k);
    r.w.push(w);
    r.b.push(b);
    r.z.push(3 * k + 0.1 * b * w * u ** 3);
    r.family.push(wide ? 'wide' : 'main');
    r.rec.push(`R${i + 1}`);
  }
  return r;
}

/** The result of the bound lhs ≤ c·rhs computed straight from the rows, strata by quantiles of w. */
export function boundResult(rows: FixtureRows, rhsName: string, rhs: number[], withEvilLabel: boolean): ReportBoundResult {
  const n = rows.k.length;
  const ratio = rows.k.map((s, i) => Math.abs(3 * s - rows.z[i]!) / rhs[i]!);
  const order = ratio.map((_, i) => i).sort((a, b) => ratio[b]! - ratio[a]!);
  const witnesses = order.slice(0, 5).map((i) => ({
    row: i + 1,
    lhs: Math.abs(3 * rows.k[i]! - rows.z[i]!),
    rhs: rhs[i]!,
    ratio: ratio[i]!,
    labels: { name: rows.rec[i]!, family: rows.family[i]!, ...(withEvilLabel ? { note: EVIL } : {}) },
  }));
  const byOrder = rows.w.map((_, i) => i).sort((a, b) => rows.w[a]! - rows.w[b]!);
  const strata = [];
  for (let k = 0; k < 5; k++) {
    const part = byOrder.slice(Math.floor((k * n) / 5), Math.floor(((k + 1) * n) / 5));
    strata.push({
      low: rows.w[part[0]!]!,
      high: rows.w[part[part.length - 1]!]!,
      n: part.length,
      constant: Math.max(...part.map((i) => ratio[i]!)),
    });
  }
  const sorted = [...ratio].sort((a, b) => a - b);
  const q = (p: number) => sorted[Math.min(n - 1, Math.floor(p * (n - 1)))]!;
  // Slope of the per-stratum constant against the stratum midpoint (least squares by hand).
  const xs = strata.map((s) => (s.low + s.high) / 2);
  const ys = strata.map((s) => s.constant);
  const mx = xs.reduce((a, b) => a + b, 0) / xs.length;
  const my = ys.reduce((a, b) => a + b, 0) / ys.length;
  const slope =
    xs.reduce((a, x, k) => a + (x - mx) * (ys[k]! - my), 0) / xs.reduce((a, x) => a + (x - mx) ** 2, 0);
  // The fixture's trend is stated along w (growth as w increases), as a bound stage would.
  const grows = slope > 0 && ys[ys.length - 1]! > 2 * ys[0]!;
  return {
    rhs: rhsName,
    constant: sorted[n - 1]!,
    witnesses,
    quantiles: { '0.5': q(0.5), '0.9': q(0.9), '0.99': q(0.99), '1': sorted[n - 1]! },
    strata,
    trend: grows
      ? { slope, low: slope * 0.6, high: slope * 1.4, verdict: 'grows' }
      : { slope, low: -Math.abs(slope) - 0.01, high: Math.abs(slope) + 0.01, verdict: 'flat' },
    points: { by: rows.w.slice(), ratio },
  };
}

/** A full report input over n rows; `evil` puts the malicious string into a feature name, a label and the config. */
export function makeInput(n: number, seed = 7, evil = true): ReportInput {
  const rows = makeRows(n, seed);
  const rng = new Rng(seed + 1);
  const feats = ['p', 'q.re', 'q.im', 'b', evil ? EVIL : 'c', 'w', 'd_noise', 'd_unif'];
  const base = [0.41, 0.33, 0.12, 0.05, 0.03, 0.02, 0.004, 0.003];
  const method = (jitter: number) =>
    feats
      .map((feature, k) => {
        const s = base[k]! * (1 + jitter * (rng.next() - 0.5));
        return { feature, score: s, low: s * 0.9, high: s * 1.1 };
      })
      .sort((a, b) => b.score - a.score);
  const residual = rows.z.map((s, i) => s - 3 * rows.k[i]!);
  return {
    title: 'k against an invented table',
    createdAt: '2026-01-02T03:04:05Z',
    tool: { name: 'surmise', version: '0.1.0' },
    input: { path: 'tables/invented.csv', sha256: 'ab'.repeat(32), rows: n + 12 },
    drops: {
      inputRows: n + 12,
      keptRows: n,
      dropped: [{ column: evil ? EVIL : 'g', reason: 'missing value', rows: 9 }],
      duplicates: 3,
      duplicateRule: 'identical in every column; first copy kept',
    },
    rank: {
      target: 'k',
      task: 'regression',
      model: { metric: 'r2', score: 0.93, baselines: { constant: -0.0004, ridge: 0.41 } },
      methods: {
        saliency: { ranking: method(0.2), kendallTau: 0.93 },
        'integrated gradients': { ranking: method(0.2), kendallTau: 0.87 },
        permutation: { ranking: method(0.4), kendallTau: 0.79 },
      },
      ranking: feats.map((feature, k) => ({ feature, score: base[k]!, low: base[k]! * 0.92, high: base[k]! * 1.08 })),
      predictions: { actual: rows.k.slice(), predicted: rows.k.map((s) => s + 0.4 * rng.normal()) },
    },
    scatter: { x: rows.z.slice(), y: rows.k.slice(), color: rows.b.slice(), xName: 'z', yName: 'k', colorName: 'b' },
    fits: [
      {
        target: 'z',
        n,
        r2: 0.9871,
        rmse: 0.5012,
        cvRmse: 0.5034,
        terms: [
          { term: 'k', coef: 3.0003, se: 0.0011, low: 2.9981, high: 3.0025, rational: { text: '3' } },
          { term: '1', coef: -0.0012, se: 0.0041, low: -0.0092, high: 0.0068, rational: { text: '0' } },
        ],
        warnings: evil ? [`column ${EVIL} is nearly constant`] : [],
        residuals: { byTerm: [{ term: 'k', x: rows.k.slice() }], residual },
      },
    ],
    search: {
      mode: 'exhaustive',
      candidates: [
        { terms: ['k'], coefs: [3.0003], heldOutRmse: 0.503, complexity: 1 },
        { terms: ['k', 'b'], coefs: [3.0001, 0.0004], heldOutRmse: 0.5029, complexity: 2 },
        { terms: ['b'], coefs: [0.1], heldOutRmse: 6.1, complexity: 1 },
      ],
      front: [
        { terms: ['k'], coefs: [3.0003], heldOutRmse: 0.503, complexity: 1 },
        { terms: ['k', 'b'], coefs: [3.0001, 0.0004], heldOutRmse: 0.5029, complexity: 2 },
      ],
    },
    bounds: [
      {
        lhs: '|3*k - z|',
        by: 'w',
        results: [
          boundResult(rows, 'b*w', rows.b.map((v, i) => v * rows.w[i]!), evil),
          boundResult(rows, 'b', rows.b.slice(), evil),
        ],
      },
    ],
    configText: `# resolved configuration\ninput: tables/invented.csv\ntarget: k\nseed: 7\nexclude: ["${evil ? EVIL : 'g'}"]\n`,
  };
}
