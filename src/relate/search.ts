/**
 * searchRelations: which closed-form formula target ≈ c₀ + Σ cⱼ·termⱼ, with terms built from the
 * chosen columns by the grammar of grammar.ts, predicts the target? The method is SISSO's
 * (Ouyang et al., Phys. Rev. Materials 2, 083802, 2018): grow the terms level by level in
 * complexity and screen them by correlation (enumerate.ts), then search every subset of at most K
 * screened terms (subsets.ts). Screening and the subset search use a seeded sample of the
 * SELECTION rows; the survivors get their inner constants by Levenberg–Marquardt
 * (inner-constants.ts), are refitted on all selection rows by Householder QR (lstsq.ts) and are
 * measured on the HELD-OUT rows, which took no part in any choice.
 */
import { SurmiseError } from '../errors.ts';
import { badOption, checkOptions } from '../util/option-table.ts';
import { SEARCH_OPTIONS } from './options.ts';
import type { Table } from '../table/types.ts';
import { Rng, deriveSeed } from '../util/rng.ts';
import { baseQuantities, type SkippedTerm } from './bases.ts';
import { getColumnOrThrow } from './columns.ts';
import { gather, rmseOn } from './crossval.ts';
import { enumerateTerms, type EnumerateResult } from './enumerate.ts';
import { unaryOps } from './grammar.ts';
import { fitInnerConstants, residualVector } from './inner-constants.ts';
import { detectLattice, exactFraction, type Lattice } from './lattice.ts';
import { lstsq } from './lstsq.ts';
import { simpleFraction, type Rational } from './rational.ts';
import { completeRows, type DroppedRows } from './rows.ts';
import { realColumn, withDerived, type DeriveSpec } from '../table/expr/index.ts';
import { countSubsets, subsetSearch } from './subsets.ts';
import { complexity, constantsOf, evaluateTree, firstBase, type Tree } from './tree.ts';
import { formulaText, treeText, type Coef } from './canonical.ts';
import type { Note } from '../util/note.ts';

export interface SearchSpec {
  target: string;
  /** Column names to build terms from. */
  from: string[];
  /** Largest number of terms besides the intercept (default 2). */
  maxTerms?: number;
  /** Integer powers [lo, hi] of the grammar (default [−3, 3]). */
  powers?: [number, number];
  /** Row indices of the selection and held-out parts; default a seeded 60/40 split of the usable rows. */
  split?: { selection: ArrayLike<number>; heldOut: ArrayLike<number>; description?: string };
  /** Number of candidates to report (default 10). */
  top?: number;
  /** Seed of the split and the screening rows (default 1, as every stage). */
  seed?: number;
  /** Derived columns added before anything else is evaluated (the table is not changed). */
  derive?: readonly DeriveSpec[];
  /** Largest complexity of one term (default 7). */
  maxComplexity?: number;
  /** Terms of each complexity level kept to build the next (beam width, default 100). */
  beam?: number;
  /** At most this many subsets in the exhaustive subset search (default 1,000,000): the screened terms are cut to fit. */
  maxExhaustive?: number;
  /** Selection rows used for screening (default 2000). */
  screenRows?: number;
  /** Keep rows that repeat an earlier row in every column the target and terms use (default false: drop and count them). */
  keepDuplicates?: boolean;
  /** Memory bound in float64 cells for stored term values (default 25,000,000 ≈ 200 MB). */
  maxCells?: number;
  /** Time budget in seconds for growing terms (default 60). */
  timeLimit?: number;
  /** 'auto' (default): report round-to-lattice exactness when the target is integer-valued; 'off'; or a step. */
  lattice?: 'auto' | 'off' | number;
  /** Called with (done, total) as the search advances. */
  progress?: (done: number, total: number) => void;
  /** Clock in milliseconds (default performance.now); tests pass their own. */
  now?: () => number;
}

export interface SearchCandidate {
  terms: string[];
  coefs: number[];
  /** Standard errors and 95% intervals of the coefficients (terms), from the selection refit. */
  se: number[];
  low: number[];
  high: number[];
  /** The one fraction with denominator ≤ 12 inside each interval (simpleFraction), or null. */
  rationals: Array<Rational | null>;
  intercept: { coef: number; se: number; low: number; high: number; rational: Rational | null };
  /** Numeric constants inside the terms, fitted by Levenberg–Marquardt: estimate, SE, value used. */
  innerConstants: Array<{ estimate: number; se: number; used: number }>;
  complexity: number;
  selectionRmse: number;
  selectionBic: number;
  heldOutRmse: number;
  /** Held-out RMSE of the formula with every coefficient replaced by its rational (where one exists). */
  roundedHeldOutRmse: number;
  /** With a lattice: held-out fraction where round_L(formula) is exactly the target (fitted, and with rationals). */
  heldOutExact: number | null;
  roundedHeldOutExact: number | null;
  formula: string;
  roundedFormula: string;
  condition: number;
}

export interface SearchResult {
  target: string;
  /** 'exhaustive': every screened term entered the subset search; 'screened': only the best-screened did. */
  mode: 'exhaustive' | 'screened';
  method: string;
  nCandidateTerms: number;
  nCandidatesTried: number;
  nCollinearSkipped: number;
  selectionRows: number;
  heldOutRows: number;
  /**
   * Standard deviation of the target on the held-out rows (divisor n): the held-out RMSE of
   * predicting each of them by their mean, the scale a held-out RMSE is read against
   * (heldOutRmse / heldOutSd = √(1 − R²) on those rows).
   */
  heldOutSd: number;
  screeningRows: number;
  split: string;
  dropped: DroppedRows;
  skippedTerms: SkippedTerm[];
  /** Best first (README "Search": the simplest formula whose held-out RMSE reaches the lowest one). */
  candidates: SearchCandidate[];
  /** Pareto front of (complexity, held-out RMSE) over the survivors, simplest first. */
  front: SearchCandidate[];
  lattice: Lattice | null;
  /** What cut the search: the time budget, the beam (memory bound), the subset limit. */
  cuts: { time: boolean; beam: number[]; subsets: boolean };
  seed: number;
  notes: SearchNote[];
}

/** What a search note is about; the report chooses by kind and never reads the words. */
export type SearchNote = Note<'screened' | 'multipleComparisons' | 'merged' | 'timeLimit' | 'beam' | 'subsetLimit' | 'collinear' | 'lattice'>;

/** Options checked once against SEARCH_OPTIONS; the powers pair and the lattice step here. */
function checkSearchOptions(spec: SearchSpec): SearchDefaults {
  const o = checkOptions<SearchDefaults>(SEARCH_OPTIONS, spec as unknown as Record<string, unknown>);
  const p = spec.powers;
  if (p && !(Number.isInteger(p[0]) && Number.isInteger(p[1]) && p[0] <= p[1] && Math.max(-p[0], p[1]) <= 12 && (p[0] !== 0 || p[1] !== 0)))
    throw new SurmiseError('relate.badPowers', `expected powers to be a range lo..hi of integers within −12..12, not both 0, got ${p[0]}..${p[1]}`, { option: 'powers' });
  const L = spec.lattice;
  if (L !== undefined && L !== 'auto' && L !== 'off' && !(typeof L === 'number' && Number.isFinite(L) && L > 0))
    throw badOption('lattice', 'auto, off or a positive step', L);
  if (spec.from.length === 0) throw new SurmiseError('relate.noColumns', 'give at least one column to build terms from');
  return o;
}

type SearchDefaults = Required<Pick<SearchSpec, 'maxTerms' | 'top' | 'seed' | 'maxComplexity' | 'maxExhaustive' | 'maxCells' | 'timeLimit' | 'screenRows' | 'beam'>>;

function coefOf(r: Rational | null, x: number): Coef {
  return r ? { num: r.num, den: r.den } : { decimal: x };
}

/** Search for formulas target ≈ c₀ + Σ cⱼ·termⱼ with at most `maxTerms` terms. */
export function searchRelations(table0: Table, spec: SearchSpec): SearchResult {
  const { maxTerms, top, seed, maxComplexity, maxExhaustive, maxCells, timeLimit, screenRows: screenLimit, beam: beamWidth } = checkSearchOptions(spec);
  const now = spec.now ?? (() => performance.now());
  const t0 = now();
  const powers = spec.powers ?? [-3, 3];
  const progress = spec.progress ?? (() => {});
  const table = withDerived(table0, spec.derive ?? []);
  const target = realColumn(table, spec.target, 'the target');
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
  const rows = complete.rows;
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
  const selRows = Int32Array.from(sel, (i) => rows[i]!); // table rows
  const heldRows = Int32Array.from(held, (i) => rows[i]!);
  const { bases, skipped } = baseQuantities(table, spec.from, rows);
  if (bases.length === 0) throw new SurmiseError('relate.noCandidates', `no usable quantities from ${spec.from.join(', ')} (${skipped.length} skipped: ${skipped.map((s) => `${s.name}: ${s.reason}`).join('; ')})`);
  const baseValues = bases.map((b) => b.values);
  const baseTrees: Tree[] = bases.map((b, id) => ({ op: 'base', id, text: b.text, cost: b.cost }));
  // screening rows: a seeded sample of the selection rows
  const nScreen = Math.min(sel.length, screenLimit);
  const screenRows = nScreen === sel.length ? selRows : Int32Array.from(new Rng(deriveSeed(seed, 'search', 'screen')).permutation(sel.length).slice(0, nScreen), (i) => selRows[i]!).sort();
  const yScreen = gather(target.values, screenRows);
  const yMean = yScreen.reduce((s, x) => s + x, 0) / nScreen;
  const yC = yScreen.map((x) => x - yMean);
  const screenBases = baseTrees.map((tree, id) => ({ tree, values: gather(baseValues[id]!, screenRows) }));
  const unary = unaryOps(powers);
  const beam = Math.max(1, Math.min(beamWidth, Math.floor(maxCells / (nScreen * (maxComplexity + 4)))));
  const poolPerTarget = 30;
  const deadline = t0 + timeLimit * 1000;
  let timeCut = false;
  const stop = (): boolean => {
    if (now() > deadline) timeCut = true;
    return timeCut;
  };
  const TOTAL = 100;
  const grow = (targets: Float64Array[], levels: number, from: number, span: number): EnumerateResult =>
    enumerateTerms({
      bases: screenBases, targets, unary, maxComplexity: levels, parentsPerLevel: beam, poolPerTarget, perLevel: 4, stop,
      rowName: (i) => `data row ${screenRows[i]! + 1}`,
      progress: (c) => progress(Math.round(from + (span * c) / levels), TOTAL),
    });
  const standardize = (v: Float64Array): Float64Array => {
    const m = v.reduce((s, x) => s + x, 0) / v.length;
    const c = v.map((x) => x - m);
    const nn = Math.sqrt(c.reduce((s, x) => s + x * x, 0));
    return c.map((x) => x / nn);
  };
  // pass 1 (small terms only): the best models of 1..K−1 terms give residual targets for pass 2
  const targets: Float64Array[] = [yC];
  if (maxTerms > 1) {
    const first = grow([yC], Math.min(3, maxComplexity), 0, 10);
    const Z1 = first.pool.map((t) => standardize(t.values));
    const s1 = subsetSearch(Z1, yC, first.pool.map((t) => t.complexity), maxTerms - 1, 1);
    for (let k = 1; k < maxTerms; k++) {
      const b = s1.bestBySize[k - 1];
      if (!b) continue;
      const r = residualVector(b.s.map((j) => first.pool[j]!.values), yScreen);
      if (r) targets.push(r);
    }
  }
  const tA = now();
  const grown = grow(targets, maxComplexity, 10, 70);
  if (process.env.SEARCH_DEBUG) console.error('grow', ((now() - tA) / 1000).toFixed(2), 'pass1', ((tA - t0) / 1000).toFixed(2));
  const pool = grown.pool;
  // inner constants of the best-screened terms that have some, fitted against the target alone
  // (Levenberg–Marquardt); a refined term joins the pool beside the one it came from
  const order: number[] = [];
  const inOrder = new Set<number>();
  const withConst = pool.map((t, i) => ({ t, i })).filter(({ t }) => constantsOf(t.tree).length > 0)
    .sort((a, b) => b.t.scores[0]! - a.t.scores[0]! || a.t.id - b.t.id).slice(0, 20);
  for (const { t } of withConst) {
    const fit = fitInnerConstants([t.tree], baseValues, screenRows, yScreen);
    if (!fit || fit.used.every((v, k) => v === constantsOf(t.tree)[k])) continue;
    const values = evaluateTree(fit.terms[0]!, baseValues, screenRows);
    if (values.some((x) => !Number.isFinite(x))) continue;
    const z = standardize(values);
    const scores = Float64Array.from(targets, (tg) => {
      const nn = Math.sqrt(tg.reduce((q, x) => q + x * x, 0));
      return nn > 0 ? Math.abs(z.reduce((q, x, i) => q + x * tg[i]!, 0)) / nn : 0;
    });
    pool.push({ tree: fit.terms[0]!, complexity: complexity(fit.terms[0]!), values, scores, best: Math.max(...scores), id: 1e9 + pool.length });
    order.push(pool.length - 1);
    inOrder.add(pool.length - 1);
  }
  // the terms for the subset search: those, then round robin over the targets' best lists, then each level's best
  const longest = Math.max(...grown.byTarget.map((l) => l.length));
  for (let r = 0; r < longest; r++) for (const list of grown.byTarget) if (r < list.length && !inOrder.has(list[r]!)) { order.push(list[r]!); inOrder.add(list[r]!); }
  for (let i = 0; i < pool.length; i++) if (!inOrder.has(i)) { order.push(i); inOrder.add(i); }
  let u = order.length;
  while (u > maxTerms && countSubsets(u, maxTerms) > maxExhaustive) u--;
  const subsetCut = u < order.length;
  const chosen = order.slice(0, u).sort((a, b) => pool[a]!.id - pool[b]!.id);
  const Z = chosen.map((i) => standardize(pool[i]!.values));
  const totalSubsets = countSubsets(u, maxTerms);
  const sub = subsetSearch(Z, yC, chosen.map((i) => pool[i]!.complexity), maxTerms, Math.max(5 * top, 50), (d) => progress(80 + Math.round((15 * d) / totalSubsets), TOTAL));
  progress(95, TOTAL);
  const tB = now();
  if (process.env.SEARCH_DEBUG) console.error('subsets', ((tB - tA) / 1000).toFixed(2));
  // survivors: inner constants, refit on all selection rows, measured on held-out rows
  const lattice = spec.lattice === 'off' ? null
    : typeof spec.lattice === 'number' ? { step: spec.lattice, offset: 0 }
      : detectLattice(gather(target.values, rows));
  // inner constants refitted within the model for the best 15 (by selection BIC) that have some
  let lmLeft = 15;
  const survivors = sub.kept.map((sc) => {
    let trees = sc.s.map((j) => pool[chosen[j]!]!.tree);
    let inner: SearchCandidate['innerConstants'] = [];
    if (trees.some((t) => constantsOf(t).length > 0) && lmLeft-- > 0) {
      const fit = fitInnerConstants(trees, baseValues, screenRows, yScreen);
      if (fit) {
        trees = fit.terms;
        inner = fit.estimates.map((e, k) => ({ estimate: e, se: fit.se[k]!, used: fit.used[k]! }));
      }
    }
    return refit(trees, baseValues, target.values, selRows, heldRows, sc.bic, inner, lattice);
  }).filter((c): c is SearchCandidate => c !== null);
  if (process.env.SEARCH_DEBUG) console.error('refit', ((now() - tB) / 1000).toFixed(2));
  // merge formulas that are the same function: equal rounded predictions on probe rows
  const probe = heldRows.slice(0, Math.min(64, heldRows.length));
  const yHeld = gather(target.values, heldRows);
  const yHeldMean = yHeld.reduce((q, x) => q + x, 0) / yHeld.length;
  const heldOutSd = Math.sqrt(yHeld.reduce((q, x) => q + (x - yHeldMean) ** 2, 0) / yHeld.length);
  const order2 = rankBest(survivors, heldRows.length, heldOutSd);
  const seenFn = new Map<string, SearchCandidate>();
  let merged = 0;
  const distinct: SearchCandidate[] = [];
  for (const c of order2) {
    const key = probeKey(c, baseValues, probe);
    if (seenFn.has(key)) { merged++; continue; }
    seenFn.set(key, c);
    distinct.push(c);
  }
  const candidates = distinct.slice(0, top);
  const byComplexity = distinct.slice().sort((x, z) => x.complexity - z.complexity || x.heldOutRmse - z.heldOutRmse);
  const front: SearchCandidate[] = [];
  let bestSoFar = Infinity;
  for (const c of byComplexity) if (c.heldOutRmse < bestSoFar) { front.push(c); bestSoFar = c.heldOutRmse; }
  progress(TOTAL, TOTAL);
  const notes: SearchNote[] = [
    { kind: 'screened', text: `${sub.tried} subsets screened (exhaustive over ${u} screened terms of ${grown.nDistinct} distinct terms built, complexity ≤ ${maxComplexity} per term) on ${nScreen} of the ${sel.length} selection rows; the ${survivors.length} survivors were refitted on all selection rows and measured on ${held.length} held-out rows that took no part in the choice.` },
    { kind: 'multipleComparisons', text: 'With many candidates some fit well by luck (multiple comparisons): trust a formula only when its held-out error matches its selection error and it survives on new data.' },
  ];
  if (merged > 0) notes.push({ kind: 'merged', text: `${merged} candidates that compute the same function as a simpler one (equal predictions of the formula with fractions on ${probe.length} held-out rows) were merged into it.` });
  if (timeCut) notes.push({ kind: 'timeLimit', text: `the time budget of ${timeLimit} s stopped growing terms in complexity level ${grown.stoppedInLevel ?? '?'} (levels up to ${grown.levelsDone} are complete); a faster machine may find more, so this result depends on the machine's speed.` });
  if (grown.beamLevels.length > 0) notes.push({ kind: 'beam', text: `memory bound: at complexity ${grown.beamLevels.join(', ')} only the ${beam} best-screened terms of the level were used to build larger ones (a beam); larger terms built from the others were not tried.` });
  if (subsetCut) notes.push({ kind: 'subsetLimit', text: `the subset search was limited to the ${u} best-screened of ${order.length} screened terms (${maxExhaustive} subsets at most).` });
  if (sub.collinear > 0) notes.push({ kind: 'collinear', text: `${sub.collinear} subsets were passed over as numerically collinear.` });
  if (lattice) notes.push({ kind: 'lattice', text: `the target lies on the lattice ${lattice.offset === 0 ? '' : `${lattice.offset} + `}${lattice.step}ℤ: each formula's held-out fraction of rows where rounding it to that lattice gives the target exactly is reported beside its RMSE.` });
  return {
    target: spec.target, mode: subsetCut ? 'screened' : 'exhaustive',
    method: 'terms grown by complexity with sure independence screening, exhaustive subset search (SISSO, Ouyang et al. 2018), inner constants by Levenberg–Marquardt',
    nCandidateTerms: grown.nDistinct, nCandidatesTried: sub.tried, nCollinearSkipped: sub.collinear,
    selectionRows: sel.length, heldOutRows: held.length, heldOutSd, screeningRows: nScreen,
    split: spec.split ? spec.split.description ?? 'given split' : `random 60/40 split of the ${rows.length} usable rows (seed ${seed})`,
    dropped, skippedTerms: [...skipped, ...grown.skipped],
    candidates, front, lattice,
    cuts: { time: timeCut, beam: grown.beamLevels, subsets: subsetCut },
    seed, notes,
  };
}

/**
 * Best first: let e* be the lowest held-out RMSE and τ = 1 + 2/√(2·n_held) (two standard errors of
 * an RMSE estimate under Gaussian residuals, common practice); the formulas with RMSE ≤ τ·e* "reach"
 * it and come first, simplest first (then by RMSE); the rest follow by RMSE.
 */
export function rankBest<C extends { heldOutRmse: number; complexity: number }>(cands: C[], nHeld: number, targetSd = 0): C[] {
  const best = Math.min(...cands.map((c) => c.heldOutRmse));
  const reach = best * (1 + 2 / Math.sqrt(2 * Math.max(nHeld, 1))) + 1e-9 * targetSd;
  return cands.slice().sort((a, b) => {
    const ra = a.heldOutRmse <= reach ? 0 : 1;
    const rb = b.heldOutRmse <= reach ? 0 : 1;
    if (ra !== rb) return ra - rb;
    if (ra === 0) return a.complexity - b.complexity || a.heldOutRmse - b.heldOutRmse;
    return a.heldOutRmse - b.heldOutRmse || a.complexity - b.complexity;
  });
}

interface Internal extends SearchCandidate { trees: Tree[]; roundedCoef: Float64Array }

function probeKey(c: SearchCandidate, bases: Float64Array[], probe: Int32Array): string {
  const it = c as Internal;
  const cols = it.trees.map((t) => evaluateTree(t, bases, probe));
  const parts: string[] = [];
  for (let i = 0; i < probe.length; i++) {
    let s = it.roundedCoef[0]!;
    cols.forEach((v, j) => (s += it.roundedCoef[j + 1]! * v[i]!));
    parts.push(Math.fround(s).toString());
  }
  return parts.join(',');
}

function refit(
  trees0: Tree[], bases: Float64Array[], y: Float64Array, selRows: Int32Array, heldRows: Int32Array,
  bic: number, innerConstants: SearchCandidate['innerConstants'], lattice: Lattice | null,
): SearchCandidate | null {
  const trees = trees0.slice().sort((a, b) => complexity(b) - complexity(a) || firstBase(a) - firstBase(b) || (treeText(a) < treeText(b) ? -1 : 1));
  const cols = trees.map((t) => evaluateTree(t, bases, selRows));
  const heldCols = trees.map((t) => evaluateTree(t, bases, heldRows));
  if ([...cols, ...heldCols].some((c) => c.some((x) => !Number.isFinite(x)))) return null;
  const names = trees.map(treeText);
  const fit = lstsq(cols, gather(y, selRows), { names });
  const predict = (coef: ArrayLike<number>): Float64Array => {
    const out = new Float64Array(heldRows.length).fill(coef[0]!);
    heldCols.forEach((v, j) => { for (let i = 0; i < out.length; i++) out[i] = out[i]! + coef[j + 1]! * v[i]!; });
    return out;
  };
  const all = Int32Array.from({ length: heldRows.length }, (_, i) => heldRows[i]!);
  const pred = predict(fit.coef);
  const heldOutRmse = rmseOn(pred, y, all);
  // an exact law is known only to double rounding: each interval is at least ±1e-9·SD(y)/SD(term)
  const sd = (v: Float64Array): number => { const m = v.reduce((q, x) => q + x, 0) / v.length; return Math.sqrt(v.reduce((q, x) => q + (x - m) ** 2, 0) / v.length); };
  const sdY = sd(gather(y, selRows));
  const eps = [1e-9 * sdY, ...cols.map((c) => 1e-9 * sdY / (sd(c) || 1))];
  const rationals = Array.from(fit.coef, (_, j) => (fit.aliased[j] ? null : simpleFraction(fit.low[j]! - eps[j]!, fit.high[j]! + eps[j]!).rational));
  const rounded = Float64Array.from(fit.coef, (c, j) => (rationals[j] ? rationals[j]!.num / rationals[j]!.den : c));
  const rpred = predict(rounded);
  const coefs = Array.from(fit.coef);
  const cand: Internal = {
    terms: names,
    coefs: coefs.slice(1),
    se: Array.from(fit.se).slice(1),
    low: Array.from(fit.low).slice(1),
    high: Array.from(fit.high).slice(1),
    rationals: rationals.slice(1),
    intercept: { coef: coefs[0]!, se: fit.se[0]!, low: fit.low[0]!, high: fit.high[0]!, rational: rationals[0]! },
    innerConstants,
    complexity: trees.reduce((s, t) => s + complexity(t), 0),
    selectionRmse: fit.rmse,
    selectionBic: bic,
    heldOutRmse,
    roundedHeldOutRmse: rmseOn(rpred, y, all),
    heldOutExact: lattice ? exactFraction(pred, y, heldRows, lattice) : null,
    roundedHeldOutExact: lattice ? exactFraction(rpred, y, heldRows, lattice) : null,
    formula: formulaText({ decimal: coefs[0]! }, coefs.slice(1).map((c) => ({ decimal: c })), trees),
    roundedFormula: formulaText(coefOf(rationals[0]!, coefs[0]!), coefs.slice(1).map((c, j) => coefOf(rationals[j + 1]!, c)), trees),
    condition: fit.condition,
    trees,
    roundedCoef: rounded,
  };
  Object.defineProperty(cand, 'trees', { enumerable: false });
  Object.defineProperty(cand, 'roundedCoef', { enumerable: false });
  return cand;
}
