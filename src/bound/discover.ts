import { SurmiseError } from '../errors.ts';
import { checkOptions } from '../util/option-table.ts';
import { DISCOVER_OPTIONS } from './options.ts';
import type { Table } from '../table/types.ts';
import { Rng, deriveSeed } from '../util/rng.ts';
import { trendAlong, type BoundNote, type Trend } from './core.ts';
import { tightestEnvelope } from './envelope.ts';
import type { BoundStratum, BoundWitness, DropCounts } from './find.ts';
import { realColumn, withDerived, type DeriveSpec, type RealValues } from '../table/expr/index.ts';
import { idColumns, labelsOf, lineOf } from './inputs.ts';
import { ratioPoints, type RatioPoints } from './points.ts';
import { ROW_KEPT, ROW_MISSING, ROW_NON_FINITE, validRows } from '../table/dataset-rows.ts';
import { snapRational, type SmallRational } from './snap.ts';
import { stratify, type Stratification } from './strata.ts';
import { estimateSupremum, SUPREMUM_METHOD } from './supremum.ts';
import { topK } from './topk.ts';

/** Discovery of a right-hand side lhs ≤ c·Π x_i^{k_i} (or ≥ with `lower`) over the quantities `from`. */
export interface DiscoverSpec {
  lhs: string;
  /** Positive-valued expressions the monomial is built from (1 to 6). */
  from: readonly string[];
  lower?: boolean;
  /** |k_i| ≤ maxExponent (integer 1–12, default 4). */
  maxExponent?: number;
  /** Exponents are snapped to fractions with denominator ≤ maxDenominator (integer 1–12, default 4). */
  maxDenominator?: number;
  /** Proposals returned, best first (integer 1–50, default 5). */
  proposals?: number;
  /** Witness rows per proposal (integer 1–1000, default 5). */
  top?: number;
  /** Strata per quantity for the trends (integer 3–1000, default 10). */
  bins?: number;
  /** Seed of the selection / held-out split (integer, default 1). */
  seed?: number;
  /** Share of rows held out (0.1–0.9, default 0.4). */
  heldOut?: number;
  /** Exceedances for the tail estimate of the supremum (integer 30–100000; default a tenth of the rows, at most 1000). */
  exceedances?: number;
  id?: readonly string[];
  skipInvalid?: boolean;
  derive?: readonly DeriveSpec[];
}

export { DISCOVER_OPTIONS } from './options.ts';

export const MAX_FROM = 6;

export interface BoundProposal {
  /** The right-hand side in the expression language, e.g. `s^2` or `A*B` (`1` for a constant bound). */
  rhs: string;
  /** Snapped exponent of every `from` quantity (0 when it does not enter). */
  exponents: Record<string, number>;
  /** The same as fractions: `2`, `1/2`, `-3/4`. */
  exponentText: Record<string, string>;
  /** Exponents of the exact envelope before snapping (over the quantities of this proposal's subset). */
  envelopeExponents: Record<string, number>;
  /** c* on every row used (upper form: max lhs/rhs; lower form: min). */
  constant: number;
  /** c* on the selection rows (the fitted constant). */
  selectionConstant: number;
  /** Largest (lower form: smallest) ratio on the held-out rows. */
  heldOutConstant: number;
  /** Held-out rows beyond the fitted constant. */
  heldOutExceed: number;
  /** Mean |log(c_selection) − log(lhs/rhs)| over the held-out rows: how close the bound runs to the data. */
  heldOutMeanLogGap: number;
  /** Tail estimate of the true constant (supremum; lower form infimum) of the ratio, or null. */
  supremum: { estimate: number; low: number | null; high: number | null } | null;
  supremumNote: string;
  witnesses: BoundWitness[];
  /** Trend of the per-stratum constant along every `from` quantity. */
  trend: { kind: 'none' | 'up' | 'down'; verdict: string; along: Record<string, Trend & { strata: BoundStratum[] }> };
  /** Nonzero exponents plus the sum of their denominators (smaller is simpler). */
  complexity: number;
  /** The ratio against the first `from` quantity on the rows used, for plotting (at most PLOT_POINTS, seeded). */
  points: RatioPoints;
}

export interface DiscoverResult {
  source: string;
  lhs: string;
  from: string[];
  form: 'upper' | 'lower';
  /** Rows in the table; rows used; the split. */
  n: number;
  used: number;
  selectionRows: number;
  heldOutRows: number;
  seed: number;
  dropped: DropCounts;
  /** How many exponent vectors were checked. */
  candidates: number;
  proposals: BoundProposal[];
  notes: BoundNote[];
  method: { envelope: string; supremum: string; ranking: string };
}

const ENVELOPE_METHOD =
  'in log space, the plane log c + Σ k_i log x_i above every selection row (below, lower form) that is lowest at their centroid, with |k_i| ≤ the exponent limit: a linear program in (1 + quantities) variables solved exactly by the revised simplex method on its dual (Dantzig 1963; Chvátal 1983, with Bland 1977 against cycling), for every subset of the quantities; exponents then snapped to simple fractions and every constant re-computed';
const RANKING =
  'fewest quantities along which the stratum constant trends, then held-out rows beyond the fitted constant (more than 3 and 0.1% of them counts as failing), then the held-out mean log gap (within 2% of the best counts as equal), then simplicity';
/** Snapping windows tried for each subset's envelope exponents. */
const SNAP_TOLERANCES = [0.05, 0.15, 0.3] as const;

/**
 * Searches monomials rhs = Π x_i^{k_i} over `from` for the tightest bound lhs ≤ c·rhs (lower form
 * lhs ≥ c·rhs) that shows no trend along any of the quantities. For each subset of the quantities,
 * the exact envelope of log lhs over the selection rows gives exponents; they are snapped to simple
 * fractions and each candidate is re-checked on every row: c*, held-out behaviour, trend of the
 * stratum constant along every quantity, witnesses and a tail estimate of the true constant.
 * Evidence on this table, not a proof.
 */
export function discoverBound(table: Table, spec: DiscoverSpec): DiscoverResult {
  const o = checkDiscoverSpec(spec);
  table = withDerived(table, o.derive);
  const upper = !o.lower;
  const n = table.nRows;
  const lhs = realColumn(table, o.lhs, 'lhs');
  const xs = o.from.map((f) => realColumn(table, f, 'from'));
  // rows: missing → non-finite → a quantity ≤ 0 → lhs ≤ 0
  const dropped: DropCounts = { missing: 0, nonFinite: 0, rhsNonPositive: 0, total: 0 };
  const bad: Array<{ i: number; why: string }> = [];
  // first reason per row: the shared row policy (1 missing, 2 not finite), then 3 + j quantity j ≤ 0, 9 lhs ≤ 0
  const reason = validRows(n, [lhs, ...xs].map((c, k) => ({ name: String(k), parts: [c.values], missing: c.missing }))).reason;
  const mark = (i: number, r: number) => {
    if (reason[i] === ROW_KEPT || r < reason[i]!) reason[i] = r;
  };
  xs.forEach((x, j) => {
    for (let i = 0; i < n; i++) if (!(x.values[i]! > 0)) mark(i, 3 + j);
  });
  for (let i = 0; i < n; i++) if (!(lhs.values[i]! > 0)) mark(i, 9);
  let lhsNonPositive = 0;
  let kept = 0;
  const keepAll = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const r = reason[i]!;
    if (r === ROW_KEPT) {
      keepAll[kept++] = i;
      continue;
    }
    if (r === 9 && upper) {
      lhsNonPositive++; // holds for every c ≥ 0: kept out of the fit, counted in a note
      continue;
    }
    if (r === ROW_MISSING) dropped.missing++;
    else if (r === ROW_NON_FINITE) dropped.nonFinite++;
    else dropped.rhsNonPositive++;
    dropped.total++;
    if (bad.length < 5) bad.push({ i, why: r === ROW_MISSING ? 'a missing cell' : r === ROW_NON_FINITE ? 'a value that is not finite' : r === 9 ? 'lhs ≤ 0 (no positive lower bound)' : `${o.from[r - 3]} ≤ 0` });
  }
  if (dropped.total > 0 && !o.skipInvalid) {
    const first = bad.map((b) => `row ${b.i + 1}${lineOf(table, b.i)} (${b.why})`).join('; ');
    throw new SurmiseError(
      'bound.invalidRows',
      `${table.source}: ${dropped.total} of ${n} rows cannot be used to search ${o.lhs} ${upper ? '≤' : '≥'} c·Π x^k over ${o.from.join(', ')} ` +
        `(the quantities must be > 0${upper ? '' : ' and so must lhs'}); first: ${first}. With \`skipInvalid\` they are dropped and counted instead`,
      { counts: dropped, rows: bad.map((b) => b.i + 1), option: 'skipInvalid' },
    );
  }
  const rows = keepAll.slice(0, kept);
  const m = rows.length;
  if (m < 20) throw new SurmiseError('bound.tooFewRows', `${table.source}: only ${m} usable rows to search ${o.lhs} over ${o.from.join(', ')}; at least 20 are needed`);
  const notes: BoundNote[] = [];
  if (lhsNonPositive > 0) notes.push({ kind: 'lhsNonPositive', text: `${lhsNonPositive} rows with lhs ≤ 0 satisfy every such bound with c ≥ 0 and were left out of the search` });

  // seeded split of the usable rows
  const perm = new Rng(deriveSeed(o.seed, 'bound', 'split')).permutation(m);
  const nHeld = Math.round(o.heldOut * m);
  const heldPos = perm.slice(0, nHeld).sort();
  const selPos = perm.slice(nHeld).sort();
  const sel = Int32Array.from(selPos, (t) => rows[t]!);
  const held = Int32Array.from(heldPos, (t) => rows[t]!);

  const y = new Float64Array(n);
  const z = xs.map(() => new Float64Array(n));
  for (let t = 0; t < m; t++) {
    const i = rows[t]!;
    y[i] = Math.log(lhs.values[i]!);
  }
  xs.forEach((x, j) => {
    const zj = z[j]!;
    for (let t = 0; t < m; t++) zj[rows[t]!] = Math.log(x.values[rows[t]!]!);
  });
  const d = o.from.length;
  // every subset's envelope, then snapped candidates (deduplicated by exponent vector)
  const candidates = new Map<string, { exps: SmallRational[]; envelope: number[] }>();
  const addCandidate = (exps: SmallRational[], envelope: number[]) => {
    const key = exps.map((e) => e.text).join(',');
    if (!candidates.has(key)) candidates.set(key, { exps, envelope });
  };
  const zero = snapRational(0, 1, o.maxExponent, 0);
  addCandidate(o.from.map(() => zero), o.from.map(() => 0));
  for (let mask = 1; mask < 1 << d; mask++) {
    const idx = o.from.map((_, j) => j).filter((j) => mask & (1 << j));
    const env = tightestEnvelope(y, idx.map((j) => z[j]!), sel, { upper, maxSlope: o.maxExponent });
    const full = o.from.map(() => 0);
    idx.forEach((j, t) => (full[j] = env.slopes[t]!));
    for (const tol of SNAP_TOLERANCES) addCandidate(full.map((k) => snapRational(k, o.maxDenominator, o.maxExponent, tol)), full);
  }

  // re-check every candidate
  const strat: Stratification[] = xs.map((x) => stratify(x.values, rows, o.bins));
  const ratio = new Float64Array(n);
  const evaluated: Array<{ key: string; exps: SmallRational[]; envelope: number[]; sc: number; hc: number; exceed: number; gap: number; along: Array<ReturnType<typeof trendAlong>>; trended: number; complexity: number }> = [];
  for (const [key, c] of candidates) {
    monomialRatio(lhs.values, xs.map((x) => x.values), c.exps, rows, ratio);
    let sc = upper ? -Infinity : Infinity;
    for (let t = 0; t < sel.length; t++) sc = upper ? Math.max(sc, ratio[sel[t]!]!) : Math.min(sc, ratio[sel[t]!]!);
    let hc = upper ? -Infinity : Infinity;
    let exceed = 0;
    let gap = 0;
    const lsc = Math.log(sc);
    for (let t = 0; t < held.length; t++) {
      const v = ratio[held[t]!]!;
      hc = upper ? Math.max(hc, v) : Math.min(hc, v);
      if (upper ? v > sc : v < sc) exceed++;
      gap += Math.abs(lsc - Math.log(v));
    }
    gap = held.length > 0 ? gap / held.length : 0;
    const top = topK(ratio, rows, 1, upper)[0]!;
    const along = strat.map((st, j) => trendAlong(ratio, st, { upper, byName: o.from[j]!, bins: o.bins }, top));
    const trended = along.filter((a) => a.trend.kind !== 'none').length;
    const nz = c.exps.filter((e) => e.num !== 0);
    const complexity = nz.length + nz.reduce((s, e) => s + e.den, 0);
    evaluated.push({ key, exps: c.exps, envelope: c.envelope, sc, hc, exceed, gap, along, trended, complexity });
  }
  const failing = (e: { exceed: number }) => e.exceed > Math.max(3, 0.001 * held.length);
  const bestGap = Math.min(...evaluated.map((e) => e.gap));
  const gapClass = (g: number) => Math.floor(g / Math.max(0.02 * bestGap, 1e-12));
  evaluated.sort(
    (a, b) =>
      a.trended - b.trended ||
      Number(failing(a)) - Number(failing(b)) ||
      gapClass(a.gap) - gapClass(b.gap) ||
      a.complexity - b.complexity ||
      a.gap - b.gap ||
      (a.key < b.key ? -1 : a.key > b.key ? 1 : 0),
  );

  const idCols = idColumns(table, o.id);
  const proposals: BoundProposal[] = [];
  for (const e of evaluated.slice(0, o.proposals)) {
    const rhsText = monomialText(o.from, e.exps);
    monomialRatio(lhs.values, xs.map((x) => x.values), e.exps, rows, ratio);
    const w = topK(ratio, rows, o.top, upper);
    const sup = estimateSupremum(ratio, rows, { upper, ...(o.exceedances !== null ? { exceedances: o.exceedances } : {}) });
    const along: Record<string, Trend & { strata: BoundStratum[] }> = {};
    e.along.forEach((a, j) => {
      along[o.from[j]!] = {
        ...a.trend,
        strata: a.strata.map((s) => ({ low: s.low, high: s.high, n: s.n, constant: s.constant, centre: s.centre, row: s.witness + 1 })),
      };
    });
    const trendedNames = o.from.filter((f) => along[f]!.kind !== 'none');
    const quiet = o.from.filter((f) => along[f]!.kind === 'none');
    const verdictParts = trendedNames.map((f) => along[f]!.verdict.replace(/ \(.*$/, ''));
    if (quiet.length) verdictParts.push(`no trend detected along ${quiet.join(', ')}`);
    proposals.push({
      rhs: rhsText,
      exponents: Object.fromEntries(o.from.map((f, j) => [f, e.exps[j]!.value])),
      exponentText: Object.fromEntries(o.from.map((f, j) => [f, e.exps[j]!.text])),
      envelopeExponents: Object.fromEntries(o.from.map((f, j) => [f, e.envelope[j]!])),
      constant: ratio[w[0]!]!,
      selectionConstant: e.sc,
      heldOutConstant: e.hc,
      heldOutExceed: e.exceed,
      heldOutMeanLogGap: e.gap,
      supremum: sup.estimate ? { estimate: sup.estimate.estimate, low: sup.estimate.low, high: sup.estimate.high } : null,
      supremumNote: sup.note,
      witnesses: Array.from(w, (i) => witness(table, idCols, i, lhs, ratio[i]!)),
      trend: { kind: trendedNames.length ? along[trendedNames[0]!]!.kind : 'none', verdict: verdictParts.join('; '), along },
      complexity: e.complexity,
      points: ratioPoints(ratio, xs[0]!.values, rows, upper, deriveSeed(o.seed, 'bound', 'plot')),
    });
  }
  return {
    source: table.source,
    lhs: o.lhs,
    from: [...o.from],
    form: upper ? 'upper' : 'lower',
    n,
    used: m,
    selectionRows: sel.length,
    heldOutRows: held.length,
    seed: o.seed,
    dropped,
    candidates: evaluated.length,
    proposals,
    notes,
    method: { envelope: ENVELOPE_METHOD, supremum: SUPREMUM_METHOD, ranking: RANKING },
  };
}

function witness(table: Table, idCols: ReturnType<typeof idColumns>, i: number, lhs: RealValues, ratio: number): BoundWitness {
  const l = lhs.values[i]!;
  return { row: i + 1, line: table.lines ? table.lines[i]! : null, labels: labelsOf(idCols, i), lhs: l, rhs: l / ratio, ratio, by: l / ratio };
}

/**
 * ratio[i] = lhs[i] / Π x_j[i]^{e_j} for i in rows, computed directly (not through logarithms) so
 * that equality cases come out exact: powers ±1 and ±2 by multiplication, the rest by Math.pow.
 */
export function monomialRatio(lhs: Float64Array, xs: readonly Float64Array[], exps: readonly SmallRational[], rows: Int32Array, ratio: Float64Array): void {
  const n = rows.length;
  for (let t = 0; t < n; t++) ratio[rows[t]!] = 1;
  exps.forEach((e, j) => {
    if (e.num === 0) return;
    const x = xs[j]!;
    const v = e.value;
    if (v === 1) for (let t = 0; t < n; t++) ratio[rows[t]!]! *= x[rows[t]!]!;
    else if (v === 2) for (let t = 0; t < n; t++) ratio[rows[t]!]! *= x[rows[t]!]! * x[rows[t]!]!;
    else if (v === -1) for (let t = 0; t < n; t++) ratio[rows[t]!]! *= 1 / x[rows[t]!]!;
    else for (let t = 0; t < n; t++) ratio[rows[t]!]! *= Math.pow(x[rows[t]!]!, v);
  });
  for (let t = 0; t < n; t++) {
    const r = rows[t]!;
    ratio[r] = lhs[r]! / ratio[r]!;
  }
}

/** `s^2`, `A*B`, `x^(1/2)/y`, `1/z^3`, `1` — in the table's expression language. */
export function monomialText(names: readonly string[], exps: readonly SmallRational[]): string {
  const wrap = (s: string) => (/^[A-Za-z_][A-Za-z0-9_.]*$/.test(s) ? s : `(${s})`);
  const pow = (name: string, e: SmallRational) => {
    const a = Math.abs(e.num);
    const t = e.den === 1 ? String(a) : `(${a}/${e.den})`;
    return a === 1 && e.den === 1 ? wrap(name) : `${wrap(name)}^${t}`;
  };
  const num = names.map((f, j) => [f, exps[j]!] as const).filter(([, e]) => e.num > 0).map(([f, e]) => pow(f, e));
  const den = names.map((f, j) => [f, exps[j]!] as const).filter(([, e]) => e.num < 0).map(([f, e]) => pow(f, e));
  const top = num.length ? num.join('*') : '1';
  if (!den.length) return top;
  return `${top}/${den.length === 1 ? den[0] : `(${den.join('*')})`}`;
}

interface CheckedDiscover {
  lhs: string;
  from: string[];
  lower: boolean;
  maxExponent: number;
  maxDenominator: number;
  proposals: number;
  top: number;
  bins: number;
  seed: number;
  heldOut: number;
  exceedances: number | null;
  id: string[] | null;
  skipInvalid: boolean;
  derive: DeriveSpec[];
}

/** Options checked once against DISCOVER_OPTIONS; errors name the option key. */
export function checkDiscoverSpec(spec: DiscoverSpec): CheckedDiscover {
  if (typeof spec.lhs !== 'string' || spec.lhs.trim() === '') throw new SurmiseError('bound.badOption', 'expected lhs to be an expression, got nothing', { option: 'lhs' });
  const from = [...(spec.from ?? [])];
  if (from.length === 0 || from.length > MAX_FROM) {
    throw new SurmiseError('bound.badOption', `expected from to list 1 to ${MAX_FROM} quantities, got ${from.length}`, { option: 'from' });
  }
  for (const f of from) if (typeof f !== 'string' || f.trim() === '') throw new SurmiseError('bound.badOption', 'expected every from quantity to be an expression, got an empty one', { option: 'from' });
  const dup = from.find((f, i) => from.indexOf(f) !== i);
  if (dup !== undefined) throw new SurmiseError('bound.badOption', `from lists '${dup}' twice`, { option: 'from' });
  const o = checkOptions<Omit<CheckedDiscover, 'lhs' | 'from' | 'derive'>>(DISCOVER_OPTIONS, spec as unknown as Record<string, unknown>);
  return {
    lhs: spec.lhs,
    from,
    ...o,
    derive: [...(spec.derive ?? [])],
  };
}
