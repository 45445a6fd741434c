/**
 * The demo census: an INVENTED table of "cusped 3-manifold records" drawn from the documented
 * random model below. It is not data about real manifolds; it exists so the pipeline has
 * something with a known answer to find.
 *
 * The random model (all draws from `Rng(deriveSeed(seed, 'census'))`, row by row):
 *
 *   family   'twisted' with probability 0.1, else 'generic'
 *   generic: xings ~ U{6..30}; vol = xings · U(0.35, 0.5);  inj = 0.15 + 0.85 · U(0,1)^1.5; twist = 0
 *   twisted: twist ~ U{2..40}; xings = 8 + ⌊twist/4⌋; vol = 6.5 · (1 − 1/twist²) · U(0.97, 1.03);
 *            inj = (1.2 / twist) · U(0.9, 1.1)                      (inj → 0 along the family)
 *   sig      = 2k, k = round(N(0, 1) · xings / 5) clipped to ±⌊xings/2⌋      (an even integer)
 *   u ~ U(−1, 1);  e = C · (vol / inj) · u³  with C = 0.1
 *   slope    = 2·sig + e                                               (the planted law)
 *   mer      = m · e^{iθ}, m ~ U(0.8, 1.6), θ ~ U(−1.1, 1.1)            (complex meridian)
 *   lon      = slope · m / cos θ      so that re(lon / mer) = slope exactly (real longitude)
 *   geo      = 2 · inj · U(0.9, 1.1)                   (nuisance: a short geodesic tied to inj)
 *   vol_est  = vol · (1 + 0.05 · N(0, 1))              (nuisance: a noisy copy of vol)
 *   d_noise ~ N(0, 1), d_unif ~ U(0, 1), d_count ~ U{0..9}             (pure distractors)
 *
 * What later stages should recover (the tests check these):
 *   - the target `sig` is predicted by lon and mer (through slope = re(lon/mer)); d_* carry nothing;
 *   - least squares of slope on sig: coefficient 2, intercept 0 (E[e | sig] = 0 since u is symmetric);
 *   - |2·sig − slope| ≤ C · vol / inj on every row, with C = 0.1 approached from below;
 *   - the naive bound |2·sig − slope| ≤ c · vol fails along the twisted family: its per-stratum
 *     constant grows like 1/inj (as inj decreases, i.e. as twist grows).
 * Row-policy exercise: about 0.2% of rows have `geo` missing (empty cell), and 10 rows are
 * exact duplicates of earlier rows (appended at random positions).
 */
import { Rng, deriveSeed } from '../util/rng.ts';

/** The planted constant C of |2·sig − slope| ≤ C·vol/inj. */
export const PLANTED_BOUND_CONSTANT = 0.1;
/** The planted coefficient of sig in slope = 2·sig + e. */
export const PLANTED_SLOPE_COEFFICIENT = 2;

export const CENSUS_COLUMNS = [
  'rec', 'family', 'twist', 'xings', 'vol', 'mer', 'lon', 'inj', 'geo', 'vol_est',
  'd_noise', 'd_unif', 'd_count', 'sig',
] as const;

export interface CensusOptions {
  rows: number;
  seed: number;
}

/** Six significant digits, without exponent noise for ordinary magnitudes. */
function fmt(x: number): string {
  return Number(x.toPrecision(6)).toString();
}

function fmtComplex(re: number, im: number): string {
  const r = fmt(re);
  const i = fmt(Math.abs(im));
  return `${r}${im < 0 ? '-' : '+'}${i}j`;
}

/** The census as CSV text (header + `rows` data rows, LF line ends). Deterministic in `seed`. */
export function generateCensus(opts: CensusOptions): string {
  const { rows, seed } = opts;
  const rng = new Rng(deriveSeed(seed, 'census'));
  const nDup = rows >= 1000 ? 10 : 0;
  const nBase = rows - nDup;
  const lines: string[] = [];
  const C = PLANTED_BOUND_CONSTANT;
  for (let r = 0; r < nBase; r++) {
    const twisted = rng.next() < 0.1;
    let xings: number;
    let vol: number;
    let inj: number;
    let twist = 0;
    if (twisted) {
      twist = 2 + rng.int(39);
      xings = 8 + Math.floor(twist / 4);
      vol = 6.5 * (1 - 1 / (twist * twist)) * rng.uniform(0.97, 1.03);
      inj = (1.2 / twist) * rng.uniform(0.9, 1.1);
    } else {
      xings = 6 + rng.int(25);
      vol = xings * rng.uniform(0.35, 0.5);
      inj = 0.15 + 0.85 * Math.pow(rng.next(), 1.5);
    }
    const half = Math.floor(xings / 2);
    const k = Math.max(-half, Math.min(half, Math.round((rng.normal() * xings) / 5)));
    const sig = 2 * k + 0; // + 0 turns −0 into 0
    const u = rng.uniform(-1, 1);
    // Round the inputs first so that the written table satisfies the law exactly as stated.
    const volW = Number(fmt(vol));
    const injW = Number(fmt(inj));
    const e = C * (volW / injW) * u * u * u;
    const slope = 2 * sig + e;
    const m = rng.uniform(0.8, 1.6);
    const theta = rng.uniform(-1.1, 1.1);
    const merRe = Number(fmt(m * Math.cos(theta)));
    const merIm = Number(fmt(m * Math.sin(theta)));
    // re(lon/mer) = lon·re(mer)/|mer|²  ⇒  lon = slope·|mer|²/re(mer)
    const lon = (slope * (merRe * merRe + merIm * merIm)) / merRe;
    const geo = rng.next() < 0.002 ? '' : fmt(2 * inj * rng.uniform(0.9, 1.1));
    const volEst = vol * (1 + 0.05 * rng.normal());
    const dNoise = rng.normal();
    const dUnif = rng.next();
    const dCount = rng.int(10);
    lines.push(
      [
        `M${String(r + 1).padStart(6, '0')}`,
        twisted ? 'twisted' : 'generic',
        String(twist),
        String(xings),
        fmt(volW),
        fmtComplex(merRe, merIm),
        // lon keeps more digits so that re(lon/mer) reproduces the planted slope closely
        Number(lon.toPrecision(10)).toString(),
        fmt(injW),
        geo,
        fmt(volEst),
        fmt(dNoise),
        fmt(dUnif),
        String(dCount),
        String(sig),
      ].join(','),
    );
  }
  // exact duplicates of earlier rows, inserted after their originals
  for (let d = 0; d < nDup; d++) {
    const src = rng.int(lines.length);
    const at = src + 1 + rng.int(lines.length - src);
    lines.splice(at, 0, lines[src]!);
  }
  return `${CENSUS_COLUMNS.join(',')}\n${lines.join('\n')}\n`;
}
