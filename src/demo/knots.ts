/**
 * The demo table: knots that surmise draws and computes itself. Every diagram is a closed braid
 * made by the generators behind `surmise knots generate` (torus braids, full twists, random braid
 * words whose closure is a knot), and every invariant is computed by the code behind
 * `surmise knots` (`computeInvariants`), so each row can be recomputed from its `code` cell with
 * `surmise knots TABLE --column code --kind braid`.
 *
 * Rows, in this order (all draws from `Rng(deriveSeed(seed, 'demo-knots', …))`):
 *   torus   T(p, q) and its mirror T(p, −q) for coprime 2 ≤ p < q with (p − 1)·q ≤ 41
 *   twist   12 base braids (random knot braids on 3 or 4 strands, 5–8 letters), each followed by
 *           q full twists on strands 1..2 for q = −10..10
 *   random  400 random knot braids on each of 3, 4, 5 and 6 strands, length uniform in n+2..24
 * Columns:
 *   name, family, code            labels (code: the braid word, `n: g1 g2 …`)
 *   strands, crossings, writhe    the diagram
 *   seifert_circles, genus_bound  Seifert's algorithm on the diagram (s = strands for a closed braid)
 *   signature, determinant        σ = sign(V + Vᵀ), det = |Δ(−1)|
 *   alexander                     Δ(t), Conway-normalised, as text
 *   alexander_degree, alexander_lead, alexander_at_minus1
 *                                 highest power of Δ, its coefficient, and Δ(−1) with its sign
 *   levine_tristram_1_3           σ_ω at ω = e^{2πi/3}
 *   decoy_uniform                 a seeded uniform draw on [0, 1), independent of the knot: a decoy
 */
import { Rng, deriveSeed } from '../util/rng.ts';
import { quoteField } from '../table/write.ts';
import { computeInvariants, diagramFrom, randomKnotBraid, torusBraid, twistedBraid, valueAtMinusOne, type Braid, type InvariantName } from '../knots/index.ts';
import { gcd } from '../util/gcd.ts';
import { checkOption, optionOf } from '../util/option-table.ts';
import { DEMO_DATA_OPTIONS } from './options.ts';

export const DEMO_KNOT_COLUMNS = [
  'name', 'family', 'code', 'strands', 'crossings', 'writhe', 'seifert_circles', 'genus_bound',
  'signature', 'determinant', 'alexander', 'alexander_degree', 'alexander_lead', 'alexander_at_minus1',
  'levine_tristram_1_3', 'decoy_uniform',
] as const;

/** What `surmise knots --invariants … --omega 0.3333333333333333` computes for each row. */
export const DEMO_INVARIANTS: readonly InvariantName[] = ['crossings', 'writhe', 'signature', 'determinant', 'alexander', 'seifert_circles', 'genus_bound', 'levine_tristram'];

/** Largest (p − 1)·q of the torus rows (keeps |σ| ≤ 40, so the signature has at most 41 values). */
export const TORUS_MAX_CROSSINGS = 41;
export const TWIST_BASES = 12;
export const TWIST_RANGE: [number, number] = [-10, 10];
export const RANDOM_STRANDS = [3, 4, 5, 6] as const;
export const RANDOM_PER_STRANDS = 400;
export const RANDOM_MAX_LENGTH = 24;

export interface DemoDiagram {
  name: string;
  family: 'torus' | 'twist' | 'random';
  braid: Braid;
}

const braidText = (b: Braid): string => `${b.strands}: ${b.word.join(' ')}`;

/** The demo's diagrams, in table order. Deterministic in `seed`. */
export function demoDiagrams(seed: number): DemoDiagram[] {
  const out: DemoDiagram[] = [];
  for (let p = 2; (p - 1) * (p + 1) <= TORUS_MAX_CROSSINGS; p++)
    for (let q = p + 1; (p - 1) * q <= TORUS_MAX_CROSSINGS; q++) {
      if (gcd(p, q) !== 1) continue;
      out.push({ name: `T(${p},${q})`, family: 'torus', braid: torusBraid(p, q) });
      out.push({ name: `T(${p},${-q})`, family: 'torus', braid: torusBraid(p, -q) });
    }
  const tw = new Rng(deriveSeed(seed, 'demo-knots', 'twist'));
  for (let b = 1; b <= TWIST_BASES; b++) {
    const base = randomKnotBraid(tw, 3 + tw.int(2), 5 + tw.int(4));
    for (let q = TWIST_RANGE[0]; q <= TWIST_RANGE[1]; q++) {
      const tag = `${q < 0 ? '-' : '+'}${String(Math.abs(q)).padStart(2, '0')}`;
      out.push({ name: `tw${String(b).padStart(2, '0')}_q${tag}`, family: 'twist', braid: twistedBraid(base, 1, 2, q) });
    }
  }
  for (const n of RANDOM_STRANDS) {
    const rr = new Rng(deriveSeed(seed, 'demo-knots', 'random', n));
    for (let k = 1; k <= RANDOM_PER_STRANDS; k++) {
      const length = n + 2 + rr.int(RANDOM_MAX_LENGTH - n - 1);
      out.push({ name: `r${n}_${String(k).padStart(3, '0')}`, family: 'random', braid: randomKnotBraid(rr, n, length) });
    }
  }
  return out;
}

const num = (x: number | string | bigint | undefined): string => (x === undefined ? '' : String(x));

/** One CSV line of invariants for a diagram (`decoy` is the row's decoy draw). */
export function demoRow(d: DemoDiagram, decoy: number): string {
  const diagram = diagramFrom({ kind: 'braid', braid: d.braid });
  const r = computeInvariants(diagram, { invariants: DEMO_INVARIANTS, omega: 1 / 3 });
  const a = r.alexander!;
  const top = a.coefficients.length - 1;
  const [atMinusOne] = valueAtMinusOne(a); // a knot's Δ has integer powers: Δ(−1) is real
  return [
    quoteField(d.name, ','), d.family, braidText(d.braid), d.braid.strands, r.crossings, r.writhe,
    r.seifertCircles, r.genusBound, r.signature, num(r.determinant), quoteField(r.alexanderText!, ','),
    a.lowestExponent + top, num(a.coefficients[top]), num(atMinusOne), r.levineTristram, Number(decoy.toPrecision(6)),
  ].map((x) => (typeof x === 'string' ? x : num(x))).join(',');
}

/** The demo table as CSV text (header + one line per diagram, LF line ends). Deterministic in `seed`. */
export function generateDemoKnots(seed: number, onRow?: (done: number, total: number) => void): string {
  checkOption(optionOf(DEMO_DATA_OPTIONS, 'seed'), seed);
  const diagrams = demoDiagrams(seed);
  const decoy = new Rng(deriveSeed(seed, 'demo-knots', 'decoy'));
  const lines = [DEMO_KNOT_COLUMNS.join(',')];
  diagrams.forEach((d, k) => {
    lines.push(demoRow(d, decoy.next()));
    onRow?.(k + 1, diagrams.length);
  });
  return lines.join('\n') + '\n';
}
