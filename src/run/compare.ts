/**
 * Compare two runs' results with both runs' uncertainty: for every ranked quantity, fitted
 * coefficient and coefficient of the best searched formula, the difference B − A with its interval
 * (differenceOf: half-widths combined as √(h_A² + h_B²)); searches are matched by name (a search
 * in one run only is flagged); a difference is flagged only when that
 * interval excludes 0, otherwise the two are reported "consistent". The held-out skill is compared
 * through its per-repeat values (Student-t interval of each mean). A bound constant is a maximum
 * (or minimum) over rows, not an estimate: a constant that grew means B's table has a row beyond
 * A's bound — a real failure of A's statement on B's rows — and is always flagged.
 */
import { differenceOf, meanEstimate, type Difference, type Estimate } from './difference.ts';

interface RankEntry { feature: string; score: number; low: number; high: number; aboveNoise?: boolean }
interface FitTerm { term: string; coef: number; low: number; high: number }
interface SearchCand { terms: string[]; coefs: number[]; low: number[]; high: number[]; intercept: { coef: number; low: number; high: number }; heldOutRmse: number; formula: string }
interface SearchSide { name?: string; target?: string; candidates?: SearchCand[] }
interface ComparableResults {
  input?: { path?: string; sha256?: string; rows?: number };
  rank?: { target?: string; model?: { metric?: string; score?: number; perRepeat?: number[] }; ranking?: RankEntry[]; noise?: { reference?: number } } | null;
  fits?: Array<{ target?: string; terms: FitTerm[] }>;
  /** The run's searches (results formatVersion 2), matched between runs by name. */
  searches?: SearchSide[];
  /** One search (formatVersion 1, or a hand-made input): read as a list of one named `search 1`. */
  search?: Omit<SearchSide, 'name'> | null;
  bounds?: Array<{ lhs: string; form?: 'upper' | 'lower'; results: Array<{ rhs: string; constant: number }> }>;
  /** Right-hand sides found by `discover` (proposals best first). */
  discoveries?: Array<{ lhs: string; form?: 'upper' | 'lower'; proposals: Array<{ rhs: string; constant: number }> }>;
}

/** A difference B − A with its interval; null fields when a side is missing. */
type Diff = Pick<Difference, 'difference' | 'low' | 'high' | 'consistent'>;

export interface RankMove {
  feature: string;
  rankA: number | null;
  rankB: number | null;
  scoreA: number | null;
  scoreB: number | null;
  diff: Diff | null;
  /** Above the noise level in each run (undefined when a run had no probes). */
  aboveNoiseA?: boolean;
  aboveNoiseB?: boolean;
  /** true when the difference interval excludes 0, or the quantity is ranked in one run only */
  flagged: boolean;
}

export interface CoefMove {
  fit: string;
  term: string;
  coefA: number | null;
  coefB: number | null;
  lowA: number | null;
  highA: number | null;
  lowB: number | null;
  highB: number | null;
  diff: Diff | null;
  /** true when the difference interval excludes 0 (or the term is in one run only) */
  flagged: boolean;
}

export interface SearchMove {
  /** The search's name in both runs (searches are matched by name). */
  name: string;
  /** In which runs a search of this name is: both, or only one (then flagged). */
  in: 'both' | 'A' | 'B';
  target: string;
  formulaA: string | null;
  formulaB: string | null;
  /** Both runs' best formulas use the same terms. */
  sameTerms: boolean;
  /** Where A's best formula (by its terms) stands among B's candidates (1-based), or null. */
  rankOfAInB: number | null;
  heldOutRmseA: number | null;
  heldOutRmseB: number | null;
  /** With the same terms: intercept and each coefficient compared. */
  coefficients: CoefMove[];
  flagged: boolean;
}

export interface ConstantMove {
  lhs: string;
  rhs: string;
  constantA: number | null;
  constantB: number | null;
  /** relative change (B − A)/|A| */
  change: number | null;
  /** true when B's constant lies beyond A's (grew for an upper bound, shrank for a lower one): A's bound fails on B's rows */
  flagged: boolean;
  /** 'discovered' for a right-hand side proposed by `discover`, else a bound the configuration named. */
  source?: 'bound' | 'discovered';
}

export interface Comparison {
  inputA: { path?: string; sha256?: string; rows?: number };
  inputB: { path?: string; sha256?: string; rows?: number };
  skill: { metric: string; a: number | null; b: number | null; diff: Diff | null } | null;
  ranking: RankMove[];
  coefficients: CoefMove[];
  /** Search by search, matched by name (A's order, then those only in B). */
  searches: SearchMove[];
  constants: ConstantMove[];
  flags: string[];
  /** How differences are judged, in words. */
  rule: string;
}

export const COMPARE_RULE =
  'difference B − A with interval ±√(h_A² + h_B²) from the two runs\' interval half-widths (Altman & Bland 2003); ' +
  '"consistent" when that interval contains 0; conservative when both runs share rows';

function rankMap(r: RankEntry[] | undefined): Map<string, { rank: number; e: RankEntry }> {
  const m = new Map<string, { rank: number; e: RankEntry }>();
  (r ?? []).forEach((e, i) => m.set(e.feature, { rank: i + 1, e }));
  return m;
}

const est = (estimate: number, low: number, high: number): Estimate => ({ estimate, low, high });

function coefMove(fit: string, term: string, a: Estimate | undefined, b: Estimate | undefined): CoefMove {
  const diff = a && b ? differenceOf(a, b) : null;
  return {
    fit,
    term,
    coefA: a?.estimate ?? null,
    coefB: b?.estimate ?? null,
    lowA: a?.low ?? null,
    highA: a?.high ?? null,
    lowB: b?.low ?? null,
    highB: b?.high ?? null,
    diff,
    flagged: !a || !b || diff!.consistent === false,
  };
}

function coefFlag(c: CoefMove, where: string): string {
  if (c.coefA === null || c.coefB === null) return `${where}: term '${c.term}' present in only one run`;
  return `${where}: coefficient of '${c.term}' moved from ${fmt(c.coefA)} to ${fmt(c.coefB)}; difference ${fmtDiff(c.diff)} excludes 0`;
}

/** A run's searches as a list, each named (`search 1`, … for unnamed ones, as a run names them). */
function searchesOf(r: ComparableResults): Array<SearchSide & { name: string }> {
  const list: SearchSide[] = r.searches ?? (r.search ? [r.search] : []);
  return list.map((s, i) => ({ ...s, name: s.name ?? `search ${i + 1}` }));
}

function compareSearch(name: string, a: SearchSide | undefined, b: SearchSide | undefined): SearchMove | null {
  const ca = a?.candidates?.[0];
  const cb = b?.candidates?.[0];
  if (!ca && !cb && a && b) return null;
  const key = (c: SearchCand) => [...c.terms].sort().join('\u0000');
  const sameTerms = Boolean(ca && cb && key(ca) === key(cb));
  const pos = ca && b?.candidates ? b.candidates.findIndex((c) => key(c) === key(ca)) : -1;
  const target = a?.target ?? b?.target ?? '';
  const coefficients: CoefMove[] = [];
  if (sameTerms) {
    coefficients.push(coefMove(target, '1', est(ca!.intercept.coef, ca!.intercept.low, ca!.intercept.high), est(cb!.intercept.coef, cb!.intercept.low, cb!.intercept.high)));
    ca!.terms.forEach((t, j) => {
      const k = cb!.terms.indexOf(t);
      coefficients.push(coefMove(target, t, est(ca!.coefs[j]!, ca!.low[j]!, ca!.high[j]!), est(cb!.coefs[k]!, cb!.low[k]!, cb!.high[k]!)));
    });
  }
  return {
    name,
    in: a && b ? 'both' : a ? 'A' : 'B',
    target,
    formulaA: ca?.formula ?? null,
    formulaB: cb?.formula ?? null,
    sameTerms,
    rankOfAInB: pos >= 0 ? pos + 1 : null,
    heldOutRmseA: ca?.heldOutRmse ?? null,
    heldOutRmseB: cb?.heldOutRmse ?? null,
    coefficients,
    flagged: !a || !b || !sameTerms || coefficients.some((c) => c.flagged),
  };
}

export function compareRuns(a: ComparableResults, b: ComparableResults): Comparison {
  const flags: string[] = [];
  const ra = rankMap(a.rank?.ranking);
  const rb = rankMap(b.rank?.ranking);
  const features = [...new Set([...ra.keys(), ...rb.keys()])];
  const ranking: RankMove[] = features.map((f) => {
    const x = ra.get(f);
    const y = rb.get(f);
    const diff = x && y ? differenceOf(est(x.e.score, x.e.low, x.e.high), est(y.e.score, y.e.low, y.e.high)) : null;
    const flagged = !x || !y || diff!.consistent === false;
    if (flagged) {
      flags.push(
        !x || !y
          ? `feature '${f}' ranked in only one run`
          : `feature '${f}': share ${fmt(x.e.score)} (rank ${x.rank}) → ${fmt(y.e.score)} (rank ${y.rank}); difference ${fmtDiff(diff)} excludes 0`,
      );
    }
    const move: RankMove = { feature: f, rankA: x?.rank ?? null, rankB: y?.rank ?? null, scoreA: x?.e.score ?? null, scoreB: y?.e.score ?? null, diff, flagged };
    if (x?.e.aboveNoise !== undefined) move.aboveNoiseA = x.e.aboveNoise;
    if (y?.e.aboveNoise !== undefined) move.aboveNoiseB = y.e.aboveNoise;
    if (move.aboveNoiseA !== undefined && move.aboveNoiseB !== undefined && move.aboveNoiseA !== move.aboveNoiseB) {
      flags.push(`feature '${f}' is ${move.aboveNoiseA ? 'above' : 'at'} the noise level in A but ${move.aboveNoiseB ? 'above' : 'at'} it in B`);
    }
    return move;
  });
  ranking.sort((p, q) => (p.rankB ?? 1e9) - (q.rankB ?? 1e9));

  const coefficients: CoefMove[] = [];
  const nFits = Math.max(a.fits?.length ?? 0, b.fits?.length ?? 0);
  for (let i = 0; i < nFits; i++) {
    const fa = a.fits?.[i];
    const fb = b.fits?.[i];
    const name = fa?.target ?? fb?.target ?? `fit ${i + 1}`;
    const terms = [...new Set([...(fa?.terms ?? []).map((t) => t.term), ...(fb?.terms ?? []).map((t) => t.term)])];
    for (const term of terms) {
      const ta = fa?.terms.find((t) => t.term === term);
      const tb = fb?.terms.find((t) => t.term === term);
      const c = coefMove(name, term, ta && est(ta.coef, ta.low, ta.high), tb && est(tb.coef, tb.low, tb.high));
      if (c.flagged) flags.push(coefFlag(c, `fit of ${name}`));
      coefficients.push(c);
    }
  }

  const sa = searchesOf(a);
  const sb = searchesOf(b);
  const names = [...new Set([...sa.map((x) => x.name), ...sb.map((x) => x.name)])];
  const searches: SearchMove[] = [];
  for (const name of names) {
    const search = compareSearch(name, sa.find((x) => x.name === name), sb.find((x) => x.name === name));
    if (!search) continue;
    searches.push(search);
    // one search in each run: named by its target alone, as before there could be several
    const label = names.length > 1 ? `search '${name}' for ${search.target}` : `search for ${search.target}`;
    if (search.in !== 'both') {
      flags.push(`${label}: in run ${search.in} only (searches are matched by name)`);
      continue;
    }
    if (!search.flagged) continue;
    if (!search.sameTerms) {
      flags.push(
        `${label}: the best formula changed from ${search.formulaA ?? '(none)'} to ${search.formulaB ?? '(none)'}` +
          (search.formulaA ? (search.rankOfAInB ? ` (A's formula is candidate ${search.rankOfAInB} in B)` : " (A's formula is not among B's candidates)") : ''),
      );
    }
    for (const c of search.coefficients) if (c.flagged) flags.push(coefFlag(c, label));
  }

  const constants: ConstantMove[] = [];
  // one list of (lhs, form, rhs → constant) per bound, whether the configuration named the rhs or `discover` proposed it
  type Side = { lhs: string; form?: 'upper' | 'lower'; results: Array<{ rhs: string; constant: number }> } | undefined;
  const compareConstants = (as: Side[], bs: Side[], source: 'bound' | 'discovered') => {
    for (let i = 0; i < Math.max(as.length, bs.length); i++) {
      const ba = as[i];
      const bb = bs[i];
      const lhs = ba?.lhs ?? bb?.lhs ?? '';
      const lower = (ba?.form ?? bb?.form) === 'lower';
      if (source === 'discovered' && ba?.results[0] && bb?.results[0] && ba.results[0].rhs !== bb.results[0].rhs) {
        flags.push(`discovered bound for ${lhs}: the best right-hand side changed from ${ba.results[0].rhs} to ${bb.results[0].rhs}`);
      }
      const rhss = [...new Set([...(ba?.results ?? []).map((r) => r.rhs), ...(bb?.results ?? []).map((r) => r.rhs)])];
      for (const rhs of rhss) {
        const x = ba?.results.find((r) => r.rhs === rhs)?.constant ?? null;
        const y = bb?.results.find((r) => r.rhs === rhs)?.constant ?? null;
        const change = x !== null && y !== null && x !== 0 ? (y - x) / Math.abs(x) : null;
        const flagged = x !== null && y !== null && (lower ? y < x : y > x);
        if (flagged) {
          flags.push(`${source === 'discovered' ? 'discovered bound' : 'bound'} ${lhs} ${lower ? '≥' : '≤'} c·(${rhs}): the constant ${lower ? 'shrank' : 'grew'} from ${fmt(x)} to ${fmt(y)}, so A's bound fails on some row of B`);
        }
        constants.push({ lhs, rhs, constantA: x, constantB: y, change, flagged, source });
      }
    }
  };
  compareConstants(a.bounds ?? [], b.bounds ?? [], 'bound');
  const asBounds = (d: NonNullable<ComparableResults['discoveries']>): Side[] => d.map((x) => ({ lhs: x.lhs, form: x.form, results: x.proposals }));
  compareConstants(asBounds(a.discoveries ?? []), asBounds(b.discoveries ?? []), 'discovered');

  const metric = a.rank?.model?.metric ?? b.rank?.model?.metric;
  let skill: Comparison['skill'] = null;
  if (metric) {
    const pa = a.rank?.model?.perRepeat;
    const pb = b.rank?.model?.perRepeat;
    const diff = pa?.length && pb?.length ? differenceOf(meanEstimate(pa), meanEstimate(pb)) : null;
    skill = { metric, a: a.rank?.model?.score ?? null, b: b.rank?.model?.score ?? null, diff };
    if (diff?.consistent === false) flags.push(`held-out ${metric}: ${fmt(skill.a)} → ${fmt(skill.b)}; difference ${fmtDiff(diff)} excludes 0`);
  }
  return {
    inputA: a.input ?? {},
    inputB: b.input ?? {},
    skill,
    ranking,
    coefficients,
    searches,
    constants,
    flags,
    rule: COMPARE_RULE,
  };
}

function fmt(x: number | null | undefined): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return String(x);
  return Number(x.toPrecision(4)).toString();
}

function fmtDiff(d: Diff | null): string {
  if (!d) return '-';
  const sign = d.difference >= 0 ? '+' : '';
  return Number.isFinite(d.low) ? `${sign}${fmt(d.difference)} [${fmt(d.low)}, ${fmt(d.high)}]` : `${sign}${fmt(d.difference)} (no interval)`;
}

function verdict(d: Diff | null, flagged: boolean): string {
  if (flagged) return '<< differs';
  if (!d || d.consistent === null) return '';
  return 'consistent';
}

function table(rows: string[][]): string {
  const widths = rows[0]!.map((_, j) => Math.max(...rows.map((r) => r[j]!.length)));
  return rows.map((r) => r.map((c, j) => c.padEnd(widths[j]!)).join('  ').trimEnd()).join('\n');
}

const iv = (low: number | null, high: number | null) => (low === null ? '-' : `[${fmt(low)}, ${fmt(high)}]`);

function coefRows(cs: CoefMove[], withFit: boolean): string[][] {
  return [
    [...(withFit ? ['fit'] : []), 'term', 'A', 'interval A', 'B', 'interval B', 'B − A [interval]', ''],
    ...cs.map((r) => [...(withFit ? [r.fit] : []), r.term, fmt(r.coefA), iv(r.lowA, r.highA), fmt(r.coefB), iv(r.lowB, r.highB), fmtDiff(r.diff), verdict(r.diff, r.flagged)]),
  ];
}

/** The comparison as aligned text, side by side. */
export function formatComparison(c: Comparison): string {
  const out: string[] = [];
  out.push(`A: ${c.inputA.path ?? '?'} (${c.inputA.rows ?? '?'} rows, sha256 ${String(c.inputA.sha256 ?? '?').slice(0, 12)})`);
  out.push(`B: ${c.inputB.path ?? '?'} (${c.inputB.rows ?? '?'} rows, sha256 ${String(c.inputB.sha256 ?? '?').slice(0, 12)})`);
  out.push(`rule: ${c.rule}`);
  if (c.skill) out.push(`held-out ${c.skill.metric}: A ${fmt(c.skill.a)}  B ${fmt(c.skill.b)}  B − A ${fmtDiff(c.skill.diff)}${c.skill.diff?.consistent ? '  consistent' : ''}`);
  if (c.ranking.length) {
    const noise = c.ranking.some((r) => r.aboveNoiseA !== undefined || r.aboveNoiseB !== undefined);
    const nz = (v: boolean | undefined) => (v === undefined ? '-' : v ? 'above' : 'at');
    out.push('', 'ranking (shares)');
    out.push(table([['feature', 'rank A', 'rank B', 'share A', 'share B', 'B − A [interval]', ...(noise ? ['noise A/B'] : []), ''],
      ...c.ranking.map((r) => [r.feature, String(r.rankA ?? '-'), String(r.rankB ?? '-'), fmt(r.scoreA), fmt(r.scoreB), fmtDiff(r.diff), ...(noise ? [`${nz(r.aboveNoiseA)}/${nz(r.aboveNoiseB)}`] : []), verdict(r.diff, r.flagged)])]));
  }
  if (c.coefficients.length) {
    out.push('', 'fitted coefficients');
    out.push(table(coefRows(c.coefficients, true)));
  }
  for (const s of c.searches) {
    out.push('', `formula search${c.searches.length > 1 ? ` '${s.name}'` : ''} for ${s.target}${s.in === 'both' ? '' : ` (in run ${s.in} only)`}`);
    out.push(`  best in A: ${s.formulaA ?? '(none)'}   held-out RMSE ${fmt(s.heldOutRmseA)}`);
    out.push(`  best in B: ${s.formulaB ?? '(none)'}   held-out RMSE ${fmt(s.heldOutRmseB)}`);
    if (s.in !== 'both') continue;
    if (s.sameTerms) out.push(table(coefRows(s.coefficients, false)));
    else out.push(`  different terms${s.formulaA ? (s.rankOfAInB ? `; A's formula is candidate ${s.rankOfAInB} in B` : "; A's formula is not among B's candidates") : ''}`);
  }
  if (c.constants.length) {
    out.push('', 'bound constants (a maximum over rows: a larger c* in B means A\'s bound fails on some row of B)');
    out.push(table([['lhs', 'rhs', 'c* A', 'c* B', 'change', ''],
      ...c.constants.map((r) => [r.lhs, r.source === 'discovered' ? `${r.rhs} (discovered)` : r.rhs, fmt(r.constantA), fmt(r.constantB), r.change === null ? '-' : `${(r.change * 100).toFixed(1)}%`, r.flagged ? '<< grew past A' : 'A holds on B'])]));
  }
  out.push('', c.flags.length ? `${c.flags.length} difference(s) flagged:` : 'nothing flagged: every difference is consistent with both runs\' uncertainty.');
  for (const f of c.flags) out.push(`  - ${f}`);
  return out.join('\n') + '\n';
}
