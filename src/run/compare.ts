/**
 * Compare two runs' results: how the rankings, the fitted coefficients and the bound constants
 * moved. Flags are deliberately conservative: a rank change counts only when the two runs'
 * intervals do not overlap (inside the intervals it is noise), a coefficient only when the new
 * estimate leaves the old 95% interval, and a bound constant whenever it grew.
 */

interface RankEntry { feature: string; score: number; low: number; high: number }
interface FitTerm { term: string; coef: number; low: number; high: number }
interface ComparableResults {
  input?: { path?: string; sha256?: string; rows?: number };
  rank?: { target?: string; model?: { metric?: string; score?: number }; ranking?: RankEntry[] } | null;
  fits?: Array<{ target?: string; terms: FitTerm[] }>;
  bounds?: Array<{ lhs: string; results: Array<{ rhs: string; constant: number }> }>;
}

export interface RankMove {
  feature: string;
  rankA: number | null;
  rankB: number | null;
  scoreA: number | null;
  scoreB: number | null;
  /** true when the rank changed and the two intervals do not overlap */
  flagged: boolean;
}

export interface CoefMove {
  fit: string;
  term: string;
  coefA: number | null;
  coefB: number | null;
  lowA: number | null;
  highA: number | null;
  /** true when the new estimate lies outside the old 95% interval (or a term appeared/vanished) */
  flagged: boolean;
}

export interface ConstantMove {
  lhs: string;
  rhs: string;
  constantA: number | null;
  constantB: number | null;
  /** relative change (B − A)/|A| */
  change: number | null;
  /** true when the constant grew */
  flagged: boolean;
}

export interface Comparison {
  inputA: { path?: string; sha256?: string; rows?: number };
  inputB: { path?: string; sha256?: string; rows?: number };
  skill: { metric: string; a: number | null; b: number | null } | null;
  ranking: RankMove[];
  coefficients: CoefMove[];
  constants: ConstantMove[];
  flags: string[];
}

function rankMap(r: RankEntry[] | undefined): Map<string, { rank: number; e: RankEntry }> {
  const m = new Map<string, { rank: number; e: RankEntry }>();
  (r ?? []).forEach((e, i) => m.set(e.feature, { rank: i + 1, e }));
  return m;
}

export function compareRuns(a: ComparableResults, b: ComparableResults): Comparison {
  const flags: string[] = [];
  const ra = rankMap(a.rank?.ranking);
  const rb = rankMap(b.rank?.ranking);
  const features = [...new Set([...ra.keys(), ...rb.keys()])];
  const ranking: RankMove[] = features.map((f) => {
    const x = ra.get(f);
    const y = rb.get(f);
    let flagged = false;
    if (x && y && x.rank !== y.rank) flagged = x.e.high < y.e.low || y.e.high < x.e.low;
    if (!x || !y) flagged = true;
    if (flagged) {
      flags.push(
        !x || !y
          ? `feature '${f}' ranked in only one run`
          : `feature '${f}' moved from rank ${x.rank} to ${y.rank} and its intervals do not overlap ` +
              `([${fmt(x.e.low)}, ${fmt(x.e.high)}] vs [${fmt(y.e.low)}, ${fmt(y.e.high)}])`,
      );
    }
    return { feature: f, rankA: x?.rank ?? null, rankB: y?.rank ?? null, scoreA: x?.e.score ?? null, scoreB: y?.e.score ?? null, flagged };
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
      const flagged = !ta || !tb || tb.coef < ta.low || tb.coef > ta.high;
      if (flagged) {
        flags.push(
          !ta || !tb
            ? `fit of ${name}: term '${term}' present in only one run`
            : `fit of ${name}: coefficient of '${term}' moved from ${fmt(ta.coef)} to ${fmt(tb.coef)}, outside the first run's 95% interval [${fmt(ta.low)}, ${fmt(ta.high)}]`,
        );
      }
      coefficients.push({ fit: name, term, coefA: ta?.coef ?? null, coefB: tb?.coef ?? null, lowA: ta?.low ?? null, highA: ta?.high ?? null, flagged });
    }
  }

  const constants: ConstantMove[] = [];
  const nBounds = Math.max(a.bounds?.length ?? 0, b.bounds?.length ?? 0);
  for (let i = 0; i < nBounds; i++) {
    const ba = a.bounds?.[i];
    const bb = b.bounds?.[i];
    const lhs = ba?.lhs ?? bb?.lhs ?? '';
    const rhss = [...new Set([...(ba?.results ?? []).map((r) => r.rhs), ...(bb?.results ?? []).map((r) => r.rhs)])];
    for (const rhs of rhss) {
      const x = ba?.results.find((r) => r.rhs === rhs)?.constant ?? null;
      const y = bb?.results.find((r) => r.rhs === rhs)?.constant ?? null;
      const change = x !== null && y !== null && x !== 0 ? (y - x) / Math.abs(x) : null;
      const flagged = x !== null && y !== null && y > x;
      if (flagged) flags.push(`bound ${lhs} ≤ c·(${rhs}): the constant grew from ${fmt(x)} to ${fmt(y)}`);
      constants.push({ lhs, rhs, constantA: x, constantB: y, change, flagged });
    }
  }

  const metric = a.rank?.model?.metric ?? b.rank?.model?.metric;
  return {
    inputA: a.input ?? {},
    inputB: b.input ?? {},
    skill: metric ? { metric, a: a.rank?.model?.score ?? null, b: b.rank?.model?.score ?? null } : null,
    ranking,
    coefficients,
    constants,
    flags,
  };
}

function fmt(x: number | null | undefined): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return String(x);
  return Number(x.toPrecision(4)).toString();
}

function table(rows: string[][]): string {
  const widths = rows[0]!.map((_, j) => Math.max(...rows.map((r) => r[j]!.length)));
  return rows.map((r) => r.map((c, j) => c.padEnd(widths[j]!)).join('  ').trimEnd()).join('\n');
}

/** The comparison as aligned text, side by side. */
export function formatComparison(c: Comparison): string {
  const out: string[] = [];
  out.push(`A: ${c.inputA.path ?? '?'} (${c.inputA.rows ?? '?'} rows, sha256 ${String(c.inputA.sha256 ?? '?').slice(0, 12)})`);
  out.push(`B: ${c.inputB.path ?? '?'} (${c.inputB.rows ?? '?'} rows, sha256 ${String(c.inputB.sha256 ?? '?').slice(0, 12)})`);
  if (c.skill) out.push(`held-out ${c.skill.metric}: A ${fmt(c.skill.a)}  B ${fmt(c.skill.b)}`);
  if (c.ranking.length) {
    out.push('', 'ranking');
    out.push(table([['feature', 'rank A', 'rank B', 'score A', 'score B', ''],
      ...c.ranking.map((r) => [r.feature, String(r.rankA ?? '-'), String(r.rankB ?? '-'), fmt(r.scoreA), fmt(r.scoreB), r.flagged ? '<< moved' : ''])]));
  }
  if (c.coefficients.length) {
    out.push('', 'coefficients');
    out.push(table([['fit', 'term', 'A', 'B', '95% interval (A)', ''],
      ...c.coefficients.map((r) => [r.fit, r.term, fmt(r.coefA), fmt(r.coefB), r.lowA === null ? '-' : `[${fmt(r.lowA)}, ${fmt(r.highA)}]`, r.flagged ? '<< moved' : ''])]));
  }
  if (c.constants.length) {
    out.push('', 'bound constants');
    out.push(table([['lhs', 'rhs', 'c* A', 'c* B', 'change', ''],
      ...c.constants.map((r) => [r.lhs, r.rhs, fmt(r.constantA), fmt(r.constantB), r.change === null ? '-' : `${(r.change * 100).toFixed(1)}%`, r.flagged ? '<< grew' : ''])]));
  }
  out.push('', c.flags.length ? `${c.flags.length} change(s) flagged:` : 'nothing flagged: every move is inside the first run\'s intervals.');
  for (const f of c.flags) out.push(`  - ${f}`);
  return out.join('\n') + '\n';
}
