/**
 * searchRelations: which few terms, built from chosen columns, best predict a target?
 * Candidates are scored on a SELECTION part of the rows; the survivors are refitted there by
 * Householder QR and their error is then measured on a HELD-OUT part that took no part in the
 * choice. Screening uses the Gram matrix of the centred, unit-length candidate columns (a
 * correlation matrix): for a subset S, RSS = yᵀy − bₛᵀ Gₛ⁻¹ bₛ (e.g. Miller, "Subset Selection in
 * Regression", 2nd ed., ch. 3); the reported numbers always come from the QR refit.
 */
import { SurmiseError } from '../errors.ts';
import { tooLarge } from '../util/integer.ts';
import { RELATE_LIMITS } from './limits.ts';
import type { Table } from '../table/types.ts';
import { Rng, deriveSeed } from '../util/rng.ts';
import { buildCandidates, type CandidateTerm, type SkippedTerm } from './candidates.ts';
import { getColumnOrThrow } from './columns.ts';
import { gather, predictRows, rmseOn } from './crossval.ts';
import { lstsq } from './lstsq.ts';
import { simpleFraction, type Rational } from './rational.ts';
import { completeRows, realExpression, withDerived, type DroppedRows } from './rows.ts';

export interface SearchSpec {
  target: string;
  /** Column names to build terms from. */
  from: string[];
  /** Largest number of terms besides the intercept (default 2). */
  maxTerms?: number;
  /** Integer powers [lo, hi] (default [−3, 3]). */
  powers?: [number, number];
  /** Row indices of the selection and held-out parts; default a seeded 60/40 split of the usable rows. */
  split?: { selection: ArrayLike<number>; heldOut: ArrayLike<number>; description?: string };
  /** Number of candidates to report (default 10). */
  top?: number;
  seed?: number;
  derive?: Array<{ name: string; expression: string }>;
  /** Exhaustive search only when it needs at most this many subset fits (default 200,000); else greedy. */
  maxExhaustive?: number;
  /** Cap on product terms (default 600). */
  maxProducts?: number;
  /** Keep rows that repeat an earlier row in every column the target and candidate terms use (default false: drop and count them). */
  keepDuplicates?: boolean;
  /** Sample the usable rows (before any split) so that (candidate terms × rows) ≤ this (default 25,000,000). */
  maxCells?: number;
  /** Called with (done, total) while subsets are screened. */
  progress?: (done: number, total: number) => void;
}

export interface SearchCandidate {
  terms: string[];
  coefs: number[];
  /** [intercept, …terms] standard errors and 95% intervals from the selection refit. */
  se: number[];
  low: number[];
  high: number[];
  /** The one fraction with denominator ≤ 12 inside each interval (simpleFraction; intercept first), or null. */
  rationals: Array<Rational | null>;
  intercept: { coef: number; se: number; low: number; high: number; rational: Rational | null };
  complexity: number;
  selectionRmse: number;
  selectionBic: number;
  heldOutRmse: number;
  /** Held-out RMSE of the model with every coefficient replaced by its rational (where one exists). */
  roundedHeldOutRmse: number;
  formula: string;
  roundedFormula: string;
  condition: number;
}

export interface SearchResult {
  target: string;
  mode: 'exhaustive' | 'greedy';
  nCandidateTerms: number;
  nCandidatesTried: number;
  /** Subsets passed over as numerically collinear during screening. */
  nCollinearSkipped: number;
  selectionRows: number;
  heldOutRows: number;
  /** How the usable rows were divided. */
  split: string;
  dropped: DroppedRows;
  skippedTerms: SkippedTerm[];
  /** Best first by selection BIC. */
  candidates: SearchCandidate[];
  /** Pareto front of (complexity, held-out RMSE) over the survivors, simplest first. */
  front: SearchCandidate[];
  seed: number;
  notes: string[];
}

function nChooseK(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return Math.round(r);
}

/** RSS reduction bᵀG⁻¹b for the subset `s` by Cholesky of G_s; null when numerically singular. */
function explained(gram: (i: number, j: number) => number, b: Float64Array, s: number[]): number | null {
  const k = s.length;
  const L = new Float64Array(k * k);
  for (let i = 0; i < k; i++) {
    for (let j = 0; j <= i; j++) {
      let v = gram(s[i]!, s[j]!);
      for (let m = 0; m < j; m++) v -= L[i * k + m]! * L[j * k + m]!;
      if (i === j) {
        if (v <= 1e-9) return null; // pivot ≤ 1e-9 of a unit diagonal: collinear within 1e-9
        L[i * k + i] = Math.sqrt(v);
      } else L[i * k + j] = v / L[j * k + j]!;
    }
  }
  // z = L⁻¹ b_s; explained = ‖z‖²
  const z = new Float64Array(k);
  let e = 0;
  for (let i = 0; i < k; i++) {
    let v = b[s[i]!]!;
    for (let m = 0; m < i; m++) v -= L[i * k + m]! * z[m]!;
    z[i] = v / L[i * k + i]!;
    e += z[i]! * z[i]!;
  }
  return e;
}

function fmtCoef(x: number): string {
  return Number(x.toPrecision(6)).toString();
}

function formulaText(intercept: string, coefs: string[], terms: string[]): string {
  let s = intercept;
  terms.forEach((t, j) => {
    const c = coefs[j]!;
    const neg = c.startsWith('-');
    const mag = neg ? c.slice(1) : c;
    const prod = mag === '1' ? t : `${mag}*${t}`;
    s = s === '0' ? (neg ? `-${prod}` : prod) : `${s} ${neg ? '-' : '+'} ${prod}`;
  });
  return s;
}

/** Search for formulas target ≈ c₀ + Σ cⱼ·termⱼ with at most `maxTerms` terms. */
export function searchRelations(table0: Table, spec: SearchSpec): SearchResult {
  const maxTerms = spec.maxTerms ?? 2;
  const top = spec.top ?? 10;
  const seed = spec.seed ?? 0;
  const powers = spec.powers ?? [-3, 3];
  const maxExhaustive = spec.maxExhaustive ?? 200_000;
  if (!Number.isInteger(maxTerms) || maxTerms < 1 || maxTerms > 6)
    throw new SurmiseError('relate.badMaxTerms', `expected the maximum number of terms to be an integer from 1 to 6, got ${maxTerms}`);
  if (!Number.isInteger(top) || top < 1) throw new SurmiseError('relate.badTop', `expected the number of candidates to report to be a positive integer, got ${top}`);
  if (top > RELATE_LIMITS.top.max) throw tooLarge('top', top, RELATE_LIMITS.top);
  if (!(Number.isInteger(powers[0]) && Number.isInteger(powers[1]) && powers[0] <= powers[1] && Math.max(-powers[0], powers[1]) <= 12 && (powers[0] !== 0 || powers[1] !== 0)))
    throw new SurmiseError('relate.badPowers', `expected a power range lo..hi of integers within −12..12, not both 0, got ${powers[0]}..${powers[1]}`);
  if (spec.from.length === 0) throw new SurmiseError('relate.noColumns', 'give at least one column to build terms from');
  const table = withDerived(table0, spec.derive ?? []);
  const target = realExpression(table, spec.target, 'the target');
  const fromCols = spec.from.map((name) => {
    const c = getColumnOrThrow(table, name);
    if (c.kind === 'label') throw new SurmiseError('relate.labelColumn', `column '${name}' holds labels (text); terms need numeric columns`);
    return c;
  });
  const checks = [
    { expression: spec.target, ...target },
    ...fromCols.map((c) => (c.kind === 'complex'
      ? { expression: c.name, values: c.re.map((x, i) => x + c.im[i]! * 0), missing: c.missing }
      : { expression: c.name, values: (c as { values: Float64Array }).values, missing: c.missing })),
  ];
  const complete = completeRows(checks, table.nRows, spec.keepDuplicates ? undefined : table0);
  const dropped = complete.dropped;
  // memory: every candidate term is a column of the rows in use; keep (terms × rows) under
  // `maxCells` by a seeded sample of the usable rows (said in the notes)
  const nReal = fromCols.filter((c) => c.kind !== 'complex').length;
  const nComplex = fromCols.length - nReal;
  const nPow = powers[1] - powers[0] + 1 - (powers[0] <= 0 && powers[1] >= 0 ? 1 : 0);
  const pairs = (nReal * (nReal - 1)) / 2;
  const estTerms = nReal * (nPow + 3) + 4 * nComplex + Math.min(spec.maxProducts ?? 600, pairs * nPow * nPow) +
    2 * (nComplex * nReal + (nComplex * (nComplex - 1)) / 2);
  const maxCells = spec.maxCells ?? 25_000_000;
  let rows = complete.rows;
  let sampledNote: string | null = null;
  if (rows.length * estTerms > maxCells) {
    const keepN = Math.max(1000, Math.floor(maxCells / estTerms));
    if (keepN < rows.length) {
      const perm = new Rng(deriveSeed(seed, 'search', 'sample')).permutation(rows.length);
      const pick = perm.slice(0, keepN).sort();
      const all = rows;
      rows = Int32Array.from(pick, (i) => all[i]!);
      sampledNote = `to bound memory (about ${estTerms} candidate terms), the search used a seeded random sample of ${keepN} of the ${all.length} usable rows.`;
    }
  }
  // selection / held-out parts (indices into `rows`)
  let sel: Int32Array;
  let held: Int32Array;
  if (spec.split) {
    const pos = new Int32Array(table.nRows).fill(-1);
    rows.forEach((r, i) => (pos[r] = i));
    sel = Int32Array.from(Array.from(spec.split.selection).map((r) => pos[r]!).filter((i) => i >= 0));
    held = Int32Array.from(Array.from(spec.split.heldOut).map((r) => pos[r]!).filter((i) => i >= 0));
  } else {
    const perm = new Rng(deriveSeed(seed, 'search', 'split')).permutation(rows.length);
    const cut = Math.round(0.6 * rows.length);
    sel = perm.slice(0, cut).sort();
    held = perm.slice(cut).sort();
  }
  if (sel.length < maxTerms + 3 || held.length < 2)
    throw new SurmiseError('relate.tooFewRows', `too few usable rows for a search: ${sel.length} for selection and ${held.length} held out (${dropped.total} of ${table.nRows} rows dropped)`);
  const { terms, skipped } = buildCandidates(table, spec.from, rows, { powers, ...(spec.maxProducts ? { maxProducts: spec.maxProducts } : {}) });
  const m = terms.length;
  if (m === 0) throw new SurmiseError('relate.noCandidates', `no usable candidate terms from ${spec.from.join(', ')} (${skipped.length} skipped)`);
  const y = gather(target.values, rows);
  // centred, unit-length columns on the selection rows
  const nS = sel.length;
  const Z: Float64Array[] = terms.map((t) => {
    const v = gather(t.values, sel);
    let mean = 0;
    for (let i = 0; i < nS; i++) mean += v[i]!;
    mean /= nS;
    let ss = 0;
    for (let i = 0; i < nS; i++) { v[i] = v[i]! - mean; ss += v[i]! * v[i]!; }
    const f = ss > 0 ? 1 / Math.sqrt(ss) : 0;
    for (let i = 0; i < nS; i++) v[i] = v[i]! * f;
    return v;
  });
  const yS = gather(y, sel);
  let ymean = 0;
  for (let i = 0; i < nS; i++) ymean += yS[i]!;
  ymean /= nS;
  let yy = 0;
  for (let i = 0; i < nS; i++) { yS[i] = yS[i]! - ymean; yy += yS[i]! * yS[i]!; }
  const dot = (a: Float64Array, b: Float64Array): number => {
    let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
    let i = 0;
    for (; i + 3 < nS; i += 4) { s0 += a[i]! * b[i]!; s1 += a[i + 1]! * b[i + 1]!; s2 += a[i + 2]! * b[i + 2]!; s3 += a[i + 3]! * b[i + 3]!; }
    for (; i < nS; i++) s0 += a[i]! * b[i]!;
    return s0 + s1 + s2 + s3;
  };
  const b = Float64Array.from(Z, (z) => dot(z, yS));
  const gramCache = new Float64Array(m * m).fill(NaN);
  const gram = (i: number, j: number): number => {
    if (i === j) return 1;
    let v = gramCache[i * m + j]!;
    if (Number.isNaN(v)) {
      v = dot(Z[i]!, Z[j]!);
      gramCache[i * m + j] = v;
      gramCache[j * m + i] = v;
    }
    return v;
  };
  let total = 0;
  for (let k = 1; k <= Math.min(maxTerms, m); k++) total += nChooseK(m, k);
  const mode: 'exhaustive' | 'greedy' = total <= maxExhaustive ? 'exhaustive' : 'greedy';
  const poolSize = Math.max(5 * top, 50);
  // pool: best subsets by selection BIC, plus the best by RSS at each complexity (for the front)
  type Scored = { s: number[]; rss: number; bic: number; complexity: number };
  let pool: Scored[] = [];
  const bestByComplexity = new Map<number, Scored>();
  let worstInPool = Infinity;
  let tried = 0;
  let collinear = 0;
  const consider = (s: number[]): number | null => {
    tried++;
    const e = explained(gram, b, s);
    if (e === null) { collinear++; return null; }
    const rss = Math.max(yy - e, 1e-300 * yy);
    const bic = nS * Math.log(rss / nS) + (s.length + 2) * Math.log(nS);
    const complexity = s.reduce((a, j) => a + terms[j]!.complexity, 0);
    const sc = { s: s.slice(), rss, bic, complexity };
    const prior = bestByComplexity.get(complexity);
    if (!prior || rss < prior.rss) bestByComplexity.set(complexity, sc);
    if (pool.length < poolSize || bic < worstInPool) {
      pool.push(sc);
      if (pool.length > 2 * poolSize) {
        pool.sort((x, z) => x.bic - z.bic);
        pool = pool.slice(0, poolSize);
        worstInPool = pool[pool.length - 1]!.bic;
      }
    }
    return rss;
  };
  const report = (done: number) => spec.progress?.(done, mode === 'exhaustive' ? total : maxTerms);
  if (mode === 'exhaustive') {
    const s: number[] = [];
    let done = 0;
    const rec = (start: number, k: number): void => {
      for (let j = start; j < m; j++) {
        s.push(j);
        consider(s);
        done++;
        if ((done & 0xffff) === 0) report(done);
        if (s.length < k) rec(j + 1, k);
        s.pop();
      }
    };
    rec(0, Math.min(maxTerms, m));
    report(total);
  } else {
    // greedy forward selection: add the term that lowers the selection RSS most; every step's
    // runners-up enter the pool too
    const chosen: number[] = [];
    for (let step = 0; step < Math.min(maxTerms, m); step++) {
      let best = -1;
      let bestRss = Infinity;
      for (let j = 0; j < m; j++) {
        if (chosen.includes(j)) continue;
        const rss = consider([...chosen, j]);
        if (rss !== null && rss < bestRss) { bestRss = rss; best = j; }
      }
      if (best < 0) break;
      chosen.push(best);
      report(step + 1);
    }
  }
  pool.sort((x, z) => x.bic - z.bic);
  pool = pool.slice(0, poolSize);
  const inPool = new Set(pool.map((p) => p.s.join(',')));
  for (const sc of bestByComplexity.values()) if (!inPool.has(sc.s.join(','))) { pool.push(sc); inPool.add(sc.s.join(',')); }
  // refit survivors by QR on the selection rows; measure on the held-out rows
  const selRows = sel;
  const survivors: SearchCandidate[] = pool.map((sc) => refit(sc.s.map((j) => terms[j]!), y, selRows, held, sc.bic, sc.complexity));
  survivors.sort((x, z) => x.selectionBic - z.selectionBic);
  const candidates = survivors.slice(0, top);
  // Pareto front: no other survivor is at most as complex and strictly better held out (or equal and simpler)
  const byComplexity = survivors.slice().sort((x, z) => x.complexity - z.complexity || x.heldOutRmse - z.heldOutRmse);
  const front: SearchCandidate[] = [];
  let bestSoFar = Infinity;
  for (const c of byComplexity) {
    if (c.heldOutRmse < bestSoFar) {
      front.push(c);
      bestSoFar = c.heldOutRmse;
    }
  }
  const notes = [
    `${tried} subsets screened (${mode}) on ${sel.length} selection rows; the ${survivors.length} survivors were refitted there and measured on ${held.length} held-out rows that took no part in the choice.`,
    'With many candidates some fit well by luck (multiple comparisons): trust a formula only when its held-out error matches its selection error and it survives on new data.',
  ];
  if (sampledNote) notes.push(sampledNote);
  if (collinear > 0) notes.push(`${collinear} subsets were passed over as numerically collinear.`);
  if (mode === 'greedy') notes.push(`greedy forward selection: ${total} subsets would be needed for an exhaustive search (limit ${maxExhaustive}); the best subset may be missed.`);
  return {
    target: spec.target, mode, nCandidateTerms: m, nCandidatesTried: tried, nCollinearSkipped: collinear,
    selectionRows: sel.length, heldOutRows: held.length,
    split: spec.split ? spec.split.description ?? 'given split' : `random 60/40 split of the ${rows.length} usable rows (seed ${seed})`,
    dropped, skippedTerms: skipped,
    candidates, front, seed, notes,
  };
}

function refit(ts: CandidateTerm[], y: Float64Array, sel: Int32Array, held: Int32Array, bic: number, complexity: number): SearchCandidate {
  const cols = ts.map((t) => gather(t.values, sel));
  const fit = lstsq(cols, gather(y, sel), { names: ts.map((t) => t.name) });
  const all = ts.map((t) => t.values);
  const pred = predictRows(all, fit.coef, true, held);
  const heldOutRmse = rmseOn(pred, y, held);
  const rationals = Array.from(fit.coef, (_, j) => (fit.aliased[j] ? null : simpleFraction(fit.low[j]!, fit.high[j]!).rational));
  const rounded = Float64Array.from(fit.coef, (c, j) => (rationals[j] ? rationals[j]!.num / rationals[j]!.den : c));
  const roundedHeldOutRmse = rmseOn(predictRows(all, rounded, true, held), y, held);
  const coefs = Array.from(fit.coef);
  const names = ts.map((t) => t.name);
  return {
    terms: names,
    coefs: coefs.slice(1),
    se: Array.from(fit.se).slice(1),
    low: Array.from(fit.low).slice(1),
    high: Array.from(fit.high).slice(1),
    rationals: rationals.slice(1),
    intercept: { coef: coefs[0]!, se: fit.se[0]!, low: fit.low[0]!, high: fit.high[0]!, rational: rationals[0]! },
    complexity,
    selectionRmse: fit.rmse,
    selectionBic: bic,
    heldOutRmse,
    roundedHeldOutRmse,
    formula: formulaText(fmtCoef(coefs[0]!), coefs.slice(1).map(fmtCoef), names),
    roundedFormula: formulaText(
      rationals[0] ? rationals[0].text : fmtCoef(coefs[0]!),
      coefs.slice(1).map((c, j) => (rationals[j + 1] ? rationals[j + 1]!.text : fmtCoef(c))),
      names.map((n) => (n.includes('/') && !/^[a-z]+\(/.test(n) ? `(${n})` : n)),
    ),
    condition: fit.condition,
  };
}
