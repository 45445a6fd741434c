import type { Block, Inline } from './doc.ts';
import type { ReportInput, ReportSearch } from './types.ts';
import { bestAcrossSearches, bestOfSearch, relativeError, searchesOf } from './searches.ts';
import { formatCount, formatInterval, formatMaybe, formatNumber } from './format.ts';
import { compareScore, completenessTroubled, equation, metricDirection, metricLabel, searchFormula, secondaryLabel, trendGrows, witnessLabels } from './words.ts';

/** The sentence every report carries after its summary. */
export const EVIDENCE_SENTENCE = 'These findings are statistical evidence on this table, not a proof.';

/**
 * The opening summary in plain words: predictability, the quantities that matter, the best
 * formula, the tightest constants and where they are attained, and flags.
 */
export function summaryBlocks(input: ReportInput): Block[] {
  const items: Inline[][] = [];
  const flags: Inline[][] = [];
  const r = input.rank;
  if (r) {
    items.push(predictabilitySentence(r));
    const top = [...r.ranking].sort((a, b) => b.score - a.score);
    if (top.length > 0) {
      const lead = leadingGroup(top);
      const named = lead ?? top.slice(0, Math.min(3, top.length));
      const parts: Inline[] = [`The quantities that matter most for `, { text: r.target, code: true }, ': '];
      named.forEach((f, k) => {
        if (k > 0) parts.push(k === named.length - 1 ? ' and ' : ', ');
        parts.push({ text: f.feature, code: true, ...(k === 0 ? { key: 'top-feature' } : {}) });
        parts.push(` (score ${formatNumber(f.score)}, interval ${formatInterval(f.low, f.high)})`);
      });
      parts.push('.');
      if (top.length > 1) {
        if (lead && lead.length === 1) parts.push(' ', { text: top[0]!.feature, code: true }, ' is clearly ahead: its interval lies above every other one.');
        else if (lead) parts.push(` These ${lead.length} are clearly ahead of the rest: each of their intervals lies above every later one; their order among themselves is not settled.`);
        else parts.push(` The top ones cannot be told apart from those that follow: no interval among the first ${named.length} lies above all the later ones, so neither their order nor where the leading group ends is settled.`);
      }
      items.push(parts);
    }
  }
  const searches = searchesOf(input);
  const pick = bestSearchFormula(input);
  if (pick && (pick.comparable || searches.length === 1)) {
    const { search: s, best } = pick;
    const several = searches.length > 1;
    const rel = several ? relativeError(s, best) : null;
    const parts: Inline[] = [
      several ? `Best formula found by the ${searches.length} searches: ` : 'Best formula found by the search: ',
      { text: searchFormula(s.target, best), code: true, key: 'best-formula' },
      ` (${several ? `from search ${quoteName(s, pick.index)}; ` : ''}held-out RMSE ${formatNumber(best.heldOutRmse)}${rel !== null ? `, or ${formatNumber(rel)} times the target's standard deviation on those rows` : ''}${best.selectionRmse !== undefined ? `, selection RMSE ${formatNumber(best.selectionRmse)}` : ''}, complexity ${best.complexity})`,
    ];
    if (best.rationalFormula) parts.push('; with fractions: ', { text: `${s.target ?? 'target'} ≈ ${best.rationalFormula}`, code: true });
    const tried = searches.every((x) => x.nCandidatesTried !== undefined) ? searches.reduce((t, x) => t + x.nCandidatesTried!, 0) : undefined;
    parts.push(
      tried !== undefined
        ? several
          ? `. It was chosen among ${formatCount(tried)} screened subsets in all (each search's best compared by held-out error relative to its target's standard deviation); with so many candidates some overfit by luck.`
          : `. It was chosen among ${formatCount(tried)} screened subsets, and with so many candidates some overfit by luck.`
        : '.',
    );
    items.push(parts);
  } else if (pick) {
    // searches whose errors cannot be put on one scale: each search's best on its own
    searches.forEach((s, k) => {
      const best = bestOfSearch(s);
      if (!best) return;
      items.push([
        `Best formula found by search ${quoteName(s, k)}: `,
        { text: searchFormula(s.target, best), code: true },
        ` (held-out RMSE ${formatNumber(best.heldOutRmse)}, complexity ${best.complexity}).`,
      ]);
    });
  }
  for (const f of input.fits ?? []) {
    const parts: Inline[] = [
      'Fit you asked for: ',
      { text: equation(f.target, f.terms, false)!, code: true },
      ` (R² ${formatNumber(f.r2)}, cross-validated RMSE ${formatNumber(f.cvRmse)}, n = ${formatCount(f.n)})`,
    ];
    const frac = equation(f.target, f.terms, true);
    if (frac !== null) parts.push('; with its coefficients as fractions: ', { text: frac, code: true });
    parts.push('.');
    items.push(parts);
    const real = f.warnings.filter((w) => w.kind !== 'rows').map((w) => w.text);
    if (real.length > 0) {
      flags.push([`The fit of `, { text: f.target, code: true }, ` carries warnings: ${real.join('; ')}.`]);
    }
  }
  if (r && completenessTroubled(r.completeness)) {
    flags.push([
      'Integrated gradients: integration error on some rows. Their attributions do not add up to the change in the prediction (the largest gap on one row exceeds 10% of the mean change); the ranking, averaged over rows, is little affected.',
    ]);
  }
  (input.bounds ?? []).forEach((b, i) => {
    b.results.forEach((res, j) => {
      const w = res.witnesses[0];
      const parts: Inline[] = [
        'Tightest constant: ',
        { text: `${b.lhs} ≤ c * (${res.rhs})`, code: true },
        ' holds on every row with c = ',
        { text: formatNumber(res.constant), key: `bound-${i}-${j}-constant`, strong: true },
      ];
      if (w) {
        const lab = witnessLabels(w);
        parts.push(', attained at row ', { text: String(w.row), key: `bound-${i}-${j}-row` });
        if (lab) parts.push(' (', lab, ')');
        parts.push(` where ${b.lhs} = ${formatNumber(w.lhs)} and ${res.rhs} = ${formatNumber(w.rhs)}`);
      }
      parts.push('.');
      items.push(parts);
      if (trendGrows(res.trend) && res.trend) {
        const by = b.by ?? 'the stratifying quantity';
        const st = res.strata;
        const span =
          st.length > 1
            ? ` the largest ratio is ${formatNumber(st[0]!.constant)} for ${by} from ${formatNumber(st[0]!.low)} to ${formatNumber(st[0]!.high)} and ${formatNumber(st[st.length - 1]!.constant)} for ${by} from ${formatNumber(st[st.length - 1]!.low)} to ${formatNumber(st[st.length - 1]!.high)};`
            : '';
        flags.push([
          'The constant of ',
          { text: `${b.lhs} ≤ c * (${res.rhs})`, code: true },
          ` is not stable along ${by}:${span} trend slope ${formatMaybe(res.trend.slope)} (interval ${formatInterval(res.trend.low, res.trend.high)}), verdict: ${res.trend.verdict}. A trend towards a finite limit is still a trend: this alone does not show that no constant holds.`,
        ]);
      }
    });
  });
  const out: Block[] = [{ kind: 'heading', level: 2, text: 'In brief', id: 'summary' }];
  const head = headlineBlock(input);
  if (head) out.push(head);
  if (items.length > 0) out.push({ kind: 'list', items });
  else out.push({ kind: 'paragraph', parts: ['This report holds no results from the ranking, fitting or bounding stages.'] });
  for (const f of flags) out.push({ kind: 'paragraph', parts: [{ text: 'Flag:', strong: true }, ' ', ...f], tone: 'flag' });
  out.push({ kind: 'paragraph', parts: [EVIDENCE_SENTENCE], tone: 'note' });
  return out;
}

function predictabilitySentence(r: NonNullable<ReportInput['rank']>): Inline[] {
  const m = r.model;
  const dir = metricDirection(m.metric);
  const label = metricLabel(m.metric);
  const parts: Inline[] = [
    'Predictability: on held-out rows the network scores ',
    `${label} = `,
    { text: formatNumber(m.score), key: 'network-score' },
    ` against ${formatNumber(m.baselines.constant)} for a constant prediction and ${formatNumber(m.baselines.ridge)} for ridge regression`,
  ];
  if (m.secondary) {
    parts.push(
      ` (${secondaryLabel(m.secondary.metric)} ${formatNumber(m.secondary.score)} against ${formatNumber(m.secondary.baselines.constant)} and ${formatNumber(m.secondary.baselines.ridge)})`,
    );
  }
  if (dir === 0) {
    parts.push(` (the report does not know whether a larger ${m.metric} is better, so it draws no conclusion).`);
    return parts;
  }
  const vsConst = compareScore(m.score, m.baselines.constant, dir);
  const vsRidge = compareScore(m.score, m.baselines.ridge, dir);
  let verdict: string;
  if (vsConst !== 'better') {
    verdict = `: no better than a constant, so no evidence that ${r.target} is predictable from these columns.`;
  } else if (vsRidge === 'better') {
    verdict = `: ${r.target} is predictable from these columns, and not only linearly.`;
  } else if (vsRidge === 'same') {
    verdict = `: ${r.target} is predictable, and a linear combination already does about as well.`;
  } else {
    verdict = `: ${r.target} is predictable, but the network does worse than ridge regression here; prefer the ridge figure.`;
  }
  parts.push(verdict);
  return parts;
}

/**
 * The leading quantities up to the first clear gap among the first three (best first): the
 * shortest head top[0..k], k < 3, whose every interval lies above every later interval (lowest
 * low of the head > highest high of the rest). Null when there is no such gap, or when the
 * ranking has a single entry (which is returned alone).
 */
export function leadingGroup<T extends { low: number; high: number }>(sorted: readonly T[]): T[] | null {
  if (sorted.length === 1) return [sorted[0]!];
  let minLow = Infinity;
  for (let k = 0; k < Math.min(3, sorted.length - 1); k++) {
    minLow = Math.min(minLow, sorted[k]!.low);
    const restHigh = Math.max(...sorted.slice(k + 1).map((f) => f.high));
    if (minLow > restHigh) return sorted.slice(0, k + 1);
  }
  return null;
}

/**
 * The best formula the searches found (bestAcrossSearches: by held-out error relative to each
 * target's spread), with its search and that search's place; null without a search formula.
 */
export function bestSearchFormula(input: Pick<ReportInput, 'search' | 'searches'>): ReturnType<typeof bestAcrossSearches> {
  return bestAcrossSearches(searchesOf(input));
}

/** A search's name as the report writes it (`'genus'`), or its place (`2`) when it has none. */
function quoteName(s: ReportSearch, index: number): string {
  return s.name !== undefined ? `'${s.name}'` : String(index + 1);
}

/**
 * The three or four figures that matter, as cards: skill against the baselines, the leading
 * quantities, the search's best formula with its held-out error, and the tightest bound that shows
 * no trend (else the first one, with its trend).
 */
export function headlineBlock(input: ReportInput): Block | null {
  const items: Array<{ label: string; value: Inline[]; detail: Inline[] }> = [];
  const r = input.rank;
  if (r) {
    const m = r.model;
    items.push({
      label: 'Skill on held-out rows',
      value: [`${metricLabel(m.metric)} `, { text: formatNumber(m.score), key: 'headline-skill' }],
      detail: [`constant prediction ${formatNumber(m.baselines.constant)}, ridge regression ${formatNumber(m.baselines.ridge)}`],
    });
    const top = [...r.ranking].sort((a, b) => b.score - a.score);
    if (top.length > 0) {
      const lead = leadingGroup(top);
      const named = lead ?? top.slice(0, Math.min(3, top.length));
      const value: Inline[] = [];
      named.forEach((f, k) => {
        if (k > 0) value.push(', ');
        value.push({ text: f.feature, code: true });
      });
      items.push({
        label: 'Leading quantities',
        value,
        detail: [
          `share ${formatNumber(top[0]!.score)} (${formatInterval(top[0]!.low, top[0]!.high)}) for the first; `,
          lead ? 'clearly ahead of the rest' : 'not separated from those that follow',
        ],
      });
    }
  }
  const pick = bestSearchFormula(input);
  if (pick?.comparable) {
    const { search: s, best } = pick;
    const n = searchesOf(input).length;
    items.push({
      label: 'Best formula found',
      value: [{ text: best.rationalFormula ? `${s.target ?? 'target'} ≈ ${best.rationalFormula}` : searchFormula(s.target, best), code: true }],
      detail: [
        `held-out RMSE ${formatNumber(best.rationalFormula && best.rationalHeldOutRmse !== undefined ? best.rationalHeldOutRmse : best.heldOutRmse)}`,
        s.heldOutRows !== undefined ? ` on ${formatCount(s.heldOutRows)} rows` : '',
        s.nCandidatesTried !== undefined ? `; ${formatCount(s.nCandidatesTried)} subsets screened` : '',
        n > 1 ? `; from search ${quoteName(s, pick.index)}, the best of ${n}` : '',
      ],
    });
  }
  const all = (input.bounds ?? []).flatMap((b) => b.results.map((res) => ({ b, res })));
  const steady = all.find((x) => !trendGrows(x.res.trend)) ?? all[0];
  if (steady) {
    const { b, res } = steady;
    const w = res.witnesses[0];
    const lab = w ? witnessLabels(w) : '';
    items.push({
      label: 'Tightest bound',
      value: [{ text: `${b.lhs} ≤ ${formatNumber(res.constant)} * (${res.rhs})`, code: true }],
      detail: [
        w ? `attained at row ${w.row}${lab ? ` (${lab})` : ''}` : 'on every row',
        res.trend ? `; ${trendGrows(res.trend) ? 'grows' : 'no trend'} along ${b.by ?? 'the strata'}` : '',
      ],
    });
  }
  return items.length > 0 ? { kind: 'headline', items } : null;
}
