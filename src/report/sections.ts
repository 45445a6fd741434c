import type { Block, Inline } from './doc.ts';
import type { ReportInput, Interval } from './types.ts';
import type { PlotPlan } from './plan.ts';
import { formatCount, formatInterval, formatMaybe, formatNumber } from './format.ts';
import { completenessTroubled, equation, metricDirection, metricLabel, searchFormula, secondaryLabel, trendGrows } from './words.ts';
import { attributionSpec } from './plots/attribution.ts';
import { scatterSpec } from './plots/scatter.ts';
import { predictionSpec } from './plots/predictions.ts';
import { residualSpec } from './plots/residuals.ts';
import { boundSpec } from './plots/bound.ts';
import { ATTRIBUTION_REGISTRY } from '../attribute/methods/index.ts';
import { dependenceSpec } from './plots/dependence.ts';
import { plotLibraryVersions } from './render-plot.ts';
import { searchesOf } from './searches.ts';
import { deriveSeed } from '../util/rng.ts';

export interface SectionSettings {
  seed: number;
  maxPoints: number;
  scatterMode: 'bin' | 'sample';
}

const n4 = (x: number): Inline => formatNumber(x);

/** The table and its row policy: every drop with its reason, duplicates and the accounting. */
export function dataSection(input: ReportInput): Block[] {
  const out: Block[] = [{ kind: 'heading', level: 2, text: 'The table and the rows used', id: 'data' }];
  out.push({
    kind: 'paragraph',
    parts: ['Input file ', { text: input.input.path, code: true }, ` with ${formatCount(input.input.rows)} rows.`],
  });
  const d = input.drops;
  if (!d) {
    out.push({ kind: 'paragraph', parts: ['No row policy was reported for this run.'] });
    return out;
  }
  out.push({
    kind: 'paragraph',
    parts: [
      `Of ${formatCount(d.inputRows)} rows read, `,
      { text: formatCount(d.keptRows), key: 'kept-rows' },
      ' were kept for the analysis.',
    ],
  });
  const rows: Inline[][] = d.dropped.map((x) => [{ text: x.column, code: true }, x.reason, formatCount(x.rows)]);
  rows.push(['(whole row)', `exact duplicate (${d.duplicateRule})`, formatCount(d.duplicates)]);
  out.push({ kind: 'table', header: ['column', 'reason', 'rows dropped'], rows, numeric: [false, false, true] });
  const listed = d.dropped.reduce((s, x) => s + x.rows, 0) + d.duplicates;
  const gone = d.inputRows - d.keptRows;
  if (listed > gone) {
    out.push({
      kind: 'paragraph',
      parts: [`A row can be dropped for more than one reason: the counts above add up to ${formatCount(listed)}, while ${formatCount(gone)} distinct rows were dropped.`],
    });
  } else if (listed < gone) {
    out.push({
      kind: 'paragraph',
      tone: 'flag',
      parts: [`${formatCount(gone - listed)} dropped rows are not explained by the reasons above (${formatCount(gone)} dropped, ${formatCount(listed)} explained).`],
    });
  }
  return out;
}

/** Network skill against the constant and ridge baselines, with the predicted-against-actual plot. */
export function predictabilitySection(input: ReportInput, plan: PlotPlan, set: SectionSettings): Block[] {
  const r = input.rank;
  if (!r) return [];
  const out: Block[] = [{ kind: 'heading', level: 2, text: 'Can the target be predicted?', id: 'predictability' }];
  const dir = metricDirection(r.model.metric);
  out.push({
    kind: 'paragraph',
    parts: [
      `Target `,
      { text: r.target, code: true },
      ` (${r.task}). Scores on held-out rows, metric ${metricLabel(r.model.metric)}`,
      dir === 1 ? ' (larger is better):' : dir === -1 ? ' (smaller is better):' : ':',
    ],
  });
  const sec = r.model.secondary;
  out.push({
    kind: 'table',
    header: sec ? ['model', metricLabel(r.model.metric), secondaryLabel(sec.metric)] : ['model', metricLabel(r.model.metric)],
    rows: [
      ['network', { text: formatNumber(r.model.score), key: 'network-score-table' }, ...(sec ? [n4(sec.score)] : [])],
      ['constant prediction', n4(r.model.baselines.constant), ...(sec ? [n4(sec.baselines.constant)] : [])],
      ['ridge regression', n4(r.model.baselines.ridge), ...(sec ? [n4(sec.baselines.ridge)] : [])],
    ],
    numeric: sec ? [false, true, true] : [false, true],
  });
  if (sec) {
    out.push({
      kind: 'paragraph',
      parts: [
        sec.metric === 'rmse'
          ? 'RMSE is the root-mean-square error of the prediction on the held-out rows, in the units of the target (smaller is better).'
          : 'Balanced accuracy is the mean over classes of the fraction of each class predicted right (larger is better); a constant guess scores 1 over the number of classes.',
      ],
    });
  }
  const c = r.completeness;
  if (c && c.length > 0) {
    const pct = (v: number) => `${(100 * v).toFixed(1)}%`;
    out.push({
      kind: 'paragraph',
      parts: [
        `Integrated gradients completeness (the attributions of a row should add up to f(x) − f(baseline)): per repeat the mean gap is ${c.map((x) => pct(x.meanAbsGap / x.meanAbsDelta)).join(', ')} and the largest gap on one row ${c.map((x) => pct(x.maxAbsGap / x.meanAbsDelta)).join(', ')} of mean |f(x) − f(baseline)|.`,
      ],
    });
    if (completenessTroubled(c)) {
      out.push({
        kind: 'paragraph',
        tone: 'flag',
        parts: [
          { text: 'Flag:', strong: true },
          ' integration error on some rows: their integrated-gradients attributions do not add up to the change in the prediction (largest gap above 10% of the mean change). The shares averaged over rows are little affected; read single rows with care.',
        ],
      });
    }
  }
  if (r.predictions && r.predictions.actual.length > 0) {
    const title =
      r.task === 'classification'
        ? `Network expected value of ${r.target} (Σ p_k c_k over the classes) against the actual class`
        : `Network prediction of ${r.target} against the actual value`;
    const name = plan.add('predicted-vs-actual', title, predictionSpec(r.target, r.predictions, set.maxPoints, deriveSeed(set.seed, 'report', 'predictions'), r.task));
    out.push({ kind: 'plot', name, title });
  }
  if (r.confusion) out.push(...confusionBlocks(r.target, r.confusion));
  if (r.dependence && r.dependence.x.length > 1) {
    const d = r.dependence;
    const title = `How the prediction of ${r.target} moves with ${d.feature} (partial dependence)`;
    const name = plan.add('dependence', title, dependenceSpec(r.target, d, r.task));
    out.push({ kind: 'plot', name, title });
  }
  return out;
}

/**
 * The confusion matrix in compact form: per actual class, the held-out rows, how many the network
 * put in that class, and the class it chose most often instead.
 */
function confusionBlocks(target: string, c: NonNullable<NonNullable<ReportInput['rank']>['confusion']>): Block[] {
  const rows: Inline[][] = [];
  let right = 0;
  let total = 0;
  c.classes.forEach((cls, i) => {
    const counts = c.counts[i]!;
    const n = counts.reduce((a, b) => a + b, 0);
    if (n === 0) return;
    const ok = counts[i]!;
    right += ok;
    total += n;
    let other = -1;
    counts.forEach((v, j) => {
      if (j !== i && v > 0 && (other < 0 || v > counts[other]!)) other = j;
    });
    rows.push([n4(cls), formatCount(n), formatCount(ok), `${Math.round((100 * ok) / n)}%`, other < 0 ? '—' : `${n4(c.classes[other]!) as string} (${formatCount(counts[other]!)})`]);
  });
  return [
    { kind: 'heading', level: 3, text: 'Which classes the network gets right' },
    {
      kind: 'paragraph',
      parts: [`Held-out rows of the first repeat by actual value of `, { text: target, code: true }, `: ${formatCount(right)} of ${formatCount(total)} predicted exactly (the most probable class).`],
    },
    { kind: 'table', header: ['actual', 'rows', 'predicted right', 'share', 'most common other prediction (rows)'], rows, numeric: [true, true, true, true, false] },
  ];
}

function rankingTable(ranking: readonly Interval[]): Block {
  const sorted = [...ranking].sort((a, b) => b.score - a.score);
  const noise = sorted.some((f) => f.aboveNoise !== undefined);
  return {
    kind: 'table',
    header: ['rank', 'quantity', 'score', 'low', 'high', ...(noise ? ['vs noise'] : [])],
    rows: sorted.map((f, k) => [String(k + 1), { text: f.feature, code: true }, n4(f.score), n4(f.low), n4(f.high), ...(noise ? [f.aboveNoise ? 'above' : 'at noise'] : [])]),
    numeric: noise ? [true, false, true, true, true, false] : [true, false, true, true, true],
  };
}

/** The noise line under a ranking: what the probes were, their reference, and how many quantities clear it. */
function noiseParagraph(ranking: readonly Interval[], noise: NonNullable<ReportInput['rank']>['noise']): Block[] {
  if (!noise) return [];
  const above = ranking.filter((f) => f.aboveNoise).length;
  return [{
    kind: 'paragraph',
    parts: [
      `Noise level: ${noise.probes} were trained and attributed beside the real quantities in every repeat; the largest upper interval end of any probe is `,
      { text: formatNumber(noise.reference), key: 'noise-reference' },
      `. ${above} of ${ranking.length} quantities have their whole interval above it (“above”); the others cannot be told apart from noise on this table (“at noise”). Probes are not ranked.`,
    ],
  }];
}

/** How prose names a method: its registered strategy's label (`integrated gradients`), else the name as given. */
export const methodLabel = (name: string): string => ATTRIBUTION_REGISTRY.find((m) => m.name === name)?.label ?? name;

/** The combined ranking, then per method its plot, table and Kendall τ; the target-against-top-feature plot. */
export function attributionSection(input: ReportInput, plan: PlotPlan, set: SectionSettings): Block[] {
  const r = input.rank;
  const s = input.scatter;
  if (!r && !s) return [];
  const out: Block[] = [{ kind: 'heading', level: 2, text: 'Which quantities matter', id: 'attribution' }];
  if (r) {
    out.push({
      kind: 'paragraph',
      parts: [
        'Combined ranking over all methods: each quantity’s share of the attribution (shares add up to 1), with a bootstrap interval over rows and repeats. A quantity whose interval overlaps another’s cannot be ranked above it.',
      ],
    });
    const combinedTitle = 'Combined ranking (all methods)';
    out.push({ kind: 'plot', name: plan.add('attribution-combined', combinedTitle, attributionSpec('all methods combined', r.ranking)), title: combinedTitle });
    out.push(...noiseParagraph(r.ranking, r.noise));
    out.push({ kind: 'details', summary: 'The combined ranking as a table', blocks: [rankingTable(r.ranking)] });
    for (const [method, m] of Object.entries(r.methods)) {
      const inner: Block[] = [];
      inner.push({
        kind: 'paragraph',
        parts: [
          `Agreement between this method’s repeats (Kendall τ): `,
          { text: formatMaybe(m.kendallTau, 3) },
          m.kendallTau === null ? ' (not defined: a single repeat or all ties).' : '.',
        ],
      });
      const label = methodLabel(method);
      const title = `Attribution by ${label}`;
      const name = plan.add(`attribution-${method}`, title, attributionSpec(label, m.ranking));
      inner.push({ kind: 'plot', name, title });
      inner.push(rankingTable(m.ranking));
      out.push({ kind: 'details', summary: `Method: ${label}`, blocks: inner });
    }
  }
  if (s && s.x.length > 0) {
    out.push({ kind: 'heading', level: 3, text: `${s.yName} against ${s.xName}` });
    const title = `${s.yName} against ${s.xName}${s.colorName ? `, coloured by ${s.colorName}` : ''}`;
    const name = plan.add(
      'target-vs-top-feature',
      title,
      scatterSpec(s, { maxPoints: set.maxPoints, mode: set.scatterMode, seed: deriveSeed(set.seed, 'report', 'scatter') }),
    );
    out.push({ kind: 'plot', name, title });
  }
  return out;
}

/** What the first formula leaves over: the residual's ranking and its size's, with noise lines, and the proposed next term. */
export function residualSection(input: ReportInput): Block[] {
  const r = input.residual;
  if (!r) return [];
  const out: Block[] = [{ kind: 'heading', level: 2, text: 'What the fit leaves over', id: 'residual' }];
  out.push({
    kind: 'paragraph',
    parts: [
      'After the fit ',
      { text: r.fit, code: true },
      ` (R² ${formatNumber(r.r2)}, RMSE ${formatNumber(r.rmse)}), its residual `,
      { text: r.residualName, code: true },
      ` was ranked against the remaining columns (${r.features.join(', ')}) with the same network, methods and noise probes:`,
    ],
  });
  out.push(rankingTable(r.ranking), ...noiseParagraph(r.ranking, r.noise));
  if (r.absolute) {
    out.push({ kind: 'paragraph', parts: ['The size of the error, ', { text: `|${r.residualName}|`, code: true }, ', which a bound on the error must follow:'] });
    out.push(rankingTable(r.absolute.ranking), ...noiseParagraph(r.absolute.ranking, r.absolute.noise));
  }
  if (r.next) {
    out.push({
      kind: 'paragraph',
      parts: [
        `Next term proposed by the formula search over ${r.next.from.join(', ')}: `,
        { text: `${r.residualName} ≈ ${r.next.formula}`, code: true },
        ` (held-out RMSE ${formatNumber(r.next.heldOutRmse)}). Fit next with the terms `,
        { text: r.next.nextTerms.join('; '), code: true },
        '.',
      ],
    });
  }
  for (const n of r.notes) out.push({ kind: 'paragraph', parts: [n.text] });
  return out;
}

/** Search notes whose content the report states in its own words (the counts line and the multiple-comparisons caution). */
const SAID_BY_REPORT = new Set(['screened', 'multipleComparisons']);

/** Fitted relations (coefficients, standard errors, intervals, fractions, warnings, residual plots) and the search front. */
export function relationsSection(input: ReportInput, plan: PlotPlan, set: SectionSettings): Block[] {
  const fits = input.fits ?? [];
  const searches = searchesOf(input);
  if (fits.length === 0 && searches.length === 0) return [];
  const out: Block[] = [{ kind: 'heading', level: 2, text: 'Formulas', id: 'relations' }];
  fits.forEach((f, i) => {
    out.push({ kind: 'heading', level: 3, text: `Least-squares fit of ${f.target}` });
    out.push({ kind: 'paragraph', parts: [{ text: equation(f.target, f.terms, false)!, code: true }] });
    const frac = equation(f.target, f.terms, true);
    if (frac !== null) out.push({ kind: 'paragraph', parts: ['With its coefficients as fractions: ', { text: frac, code: true }] });
    out.push({
      kind: 'paragraph',
      parts: [`n = ${formatCount(f.n)}, R² = ${formatNumber(f.r2)}, RMSE = ${formatNumber(f.rmse)}, cross-validated RMSE = ${formatNumber(f.cvRmse)}.`],
    });
    out.push({
      kind: 'table',
      header: ['term', 'coefficient', 'standard error', 'interval', 'as a fraction'],
      rows: f.terms.map((t) => [
        { text: t.term, code: true },
        n4(t.coef),
        n4(t.se),
        formatInterval(t.low, t.high),
        t.rational ? { text: t.rational.text, code: true } : '—',
      ]),
      numeric: [false, true, true, false, false],
    });
    if (f.warnings.length > 0) {
      out.push({ kind: 'list', items: f.warnings.map((w) => (w.kind === 'rows' ? ['Rows: ', w.text] : [{ text: 'Warning:', strong: true }, ' ', w.text])) });
    }
    const res = f.residuals;
    if (res) {
      res.byTerm.forEach((bt, k) => {
        const title = `Residuals of ${f.target} against ${bt.term}`;
        const name = plan.add(
          `residuals-${i + 1}-${bt.term}`,
          title,
          residualSpec(f.target, bt.term, bt.x, res.residual, set.maxPoints, deriveSeed(set.seed, 'report', 'residuals', i, k), res.sampledFrom),
        );
        out.push({ kind: 'plot', name, title });
      });
    }
  });
  searches.forEach((search, k) => {
    const named = searches.length > 1 ? ` ${search.name !== undefined ? `'${search.name}'` : k + 1}${search.target !== undefined ? ` for ${search.target}` : ''}` : '';
    out.push({ kind: 'heading', level: 3, text: `Formula search${named}` });
    const screened =
      search.nCandidatesTried !== undefined
        ? `${formatCount(search.nCandidatesTried)} subsets of ${search.nCandidateTerms !== undefined ? `${formatCount(search.nCandidateTerms)} candidate terms` : 'the candidate terms'} screened${search.selectionRows !== undefined ? ` on ${formatCount(search.selectionRows)} selection rows` : ''}; the best ${formatCount(search.candidates.length)} were refitted and scored on ${search.heldOutRows !== undefined ? `${formatCount(search.heldOutRows)} ` : ''}held-out rows that took no part in the choice`
        : `${formatCount(search.candidates.length)} candidate formulas scored on held-out rows`;
    out.push({
      kind: 'paragraph',
      parts: [
        `Search mode `,
        { text: search.mode, code: true },
        `: ${screened}. The ${formatCount(search.front.length)} below are not beaten on both held-out error and complexity by any other.`,
      ],
    });
    out.push({
      kind: 'paragraph',
      parts: [
        'Complexity counts 1 per column occurrence, plus (|k| − 1) for a power k, plus 1 for a division and 1 per function (x = 1, x² = 2, 1/x = 2, x*y = 2); the intercept counts 0 and a formula’s complexity is the sum over its terms.',
      ],
    });
    const front = [...search.front].sort((a, b) => a.complexity - b.complexity || a.heldOutRmse - b.heldOutRmse);
    const withSel = front.some((c) => c.selectionRmse !== undefined);
    const withFrac = front.some((c) => c.rationalFormula);
    out.push({
      kind: 'table',
      header: ['complexity', 'held-out RMSE', ...(withSel ? ['selection RMSE'] : []), 'fitted formula', ...(withFrac ? ['with fractions'] : [])],
      rows: front.map((c) => [
        String(c.complexity),
        n4(c.heldOutRmse),
        ...(withSel ? [c.selectionRmse !== undefined ? n4(c.selectionRmse) : '—'] : []),
        { text: searchFormula(search.target, c), code: true },
        ...(withFrac
          ? [c.rationalFormula ? { text: `${search.target ?? 'target'} ≈ ${c.rationalFormula}`, code: true } : '—']
          : []),
      ]),
      numeric: [true, true, ...(withSel ? [true] : []), false, ...(withFrac ? [false] : [])],
    });
    const fracRmse = front.filter((c) => c.rationalFormula && c.rationalHeldOutRmse !== undefined);
    if (fracRmse.length > 0) {
      out.push({
        kind: 'paragraph',
        parts: [
          `Held-out RMSE with the fractions in place: ${fracRmse.map((c) => `${formatNumber(c.rationalHeldOutRmse!)} (complexity ${c.complexity})`).join(', ')}.`,
        ],
      });
    }
    out.push({
      kind: 'paragraph',
      tone: 'note',
      parts: [
        'Many candidates were tried, and with many candidates some overfit by luck (multiple comparisons): trust a formula only when its held-out error is close to its selection error, and check it on new data.',
      ],
    });
    const extra = (search.notes ?? []).filter((n) => !SAID_BY_REPORT.has(n.kind));
    if (extra.length > 0) out.push({ kind: 'list', items: extra.map((n) => [n.text]) });
  });
  return out;
}

/**
 * Quantile entries in increasing order of level when every key is a number (an object's integer
 * keys such as '1' would otherwise come first), else in the order given.
 */
function orderQuantiles(q: Record<string, number>): Array<[string, number]> {
  const e = Object.entries(q);
  const level = (k: string) => Number(k.replace(/^[qp]/i, '').replace(/%$/, ''));
  return e.every(([k]) => Number.isFinite(level(k))) ? e.sort((a, b) => level(a[0]) - level(b[0])) : e;
}

/** Each bound: constant, quantiles, strata, trend, witness rows and the ratio plot. */
export function boundsSection(input: ReportInput, plan: PlotPlan, set: SectionSettings): Block[] {
  const bounds = input.bounds ?? [];
  if (bounds.length === 0) return [];
  const out: Block[] = [{ kind: 'heading', level: 2, text: 'Inequalities and their constants', id: 'bounds' }];
  bounds.forEach((b, i) => {
    b.results.forEach((r, j) => {
      const stmt = `${b.lhs} ≤ c * (${r.rhs})`;
      out.push({ kind: 'heading', level: 3, text: stmt });
      out.push({
        kind: 'paragraph',
        parts: [
          'Smallest constant that holds on every row: c = ',
          { text: formatNumber(r.constant), key: `bound-${i}-${j}-constant-section`, strong: true },
          '.',
        ],
      });
      const q = orderQuantiles(r.quantiles);
      if (q.length > 0) {
        out.push({ kind: 'paragraph', parts: ['Quantiles of the ratio over the rows:'] });
        out.push({ kind: 'table', header: ['quantile', 'ratio'], rows: q.map(([k, v]) => [k, n4(v)]), numeric: [false, true] });
      }
      if (r.strata.length > 0) {
        out.push({ kind: 'paragraph', parts: [`Largest ratio within each stratum of ${b.by ?? 'the stratifying quantity'}:`] });
        out.push({
          kind: 'table',
          header: [`${b.by ?? 'stratum'} from`, 'to', 'rows', 'largest ratio'],
          rows: r.strata.map((s) => [n4(s.low), n4(s.high), formatCount(s.n), n4(s.constant)]),
          numeric: [true, true, true, true],
        });
      }
      if (r.trend) {
        const grows = trendGrows(r.trend);
        out.push({
          kind: 'paragraph',
          tone: grows ? 'flag' : undefined,
          parts: [
            `Trend of the per-stratum constant along ${b.by ?? 'the strata'}: slope ${formatMaybe(r.trend.slope)} (interval ${formatInterval(r.trend.low, r.trend.high)}); verdict: `,
            { text: r.trend.verdict, strong: true },
            grows
              ? '. The constant changes systematically along this quantity. A trend towards a finite limit is still a trend: this alone does not show that no constant holds, only that the table does not pin one down along this quantity.'
              : '.',
          ],
        });
      }
      for (const n of r.notes ?? []) out.push({ kind: 'paragraph', parts: [`Note: ${n.text}`] });
      if (r.witnesses.length > 0) {
        const labelKeys: string[] = [];
        for (const w of r.witnesses) for (const k of Object.keys(w.labels ?? {})) if (!labelKeys.includes(k)) labelKeys.push(k);
        out.push({ kind: 'paragraph', parts: ['Rows where the ratio is largest (witnesses):'] });
        out.push({
          kind: 'table',
          header: ['row', ...labelKeys, b.lhs, r.rhs, 'ratio'],
          rows: r.witnesses.map((w) => [
            String(w.row),
            ...labelKeys.map((k) => w.labels?.[k] ?? ''),
            n4(w.lhs),
            n4(w.rhs),
            n4(w.ratio),
          ]),
          numeric: [true, ...labelKeys.map(() => false), true, true, true],
        });
      }
      if (b.by !== undefined && (r.points || r.strata.length > 0)) {
        const title = `${stmt}: ratio against ${b.by}`;
        const name = plan.add(
          `bound-${i + 1}-${j + 1}`,
          title,
          boundSpec(b.lhs, b.by, r, set.maxPoints, deriveSeed(set.seed, 'report', 'bound', i, j)),
        );
        out.push({ kind: 'plot', name, title });
      }
    });
  });
  return out;
}

/** Input digest, versions and the resolved configuration verbatim. */
export function reproducibilitySection(input: ReportInput): Block[] {
  const out: Block[] = [{ kind: 'heading', level: 2, text: 'How to reproduce this', id: 'reproducibility' }];
  out.push({
    kind: 'table',
    header: ['item', 'value'],
    rows: [
      ['input file', { text: input.input.path, code: true }],
      ['input SHA-256', { text: input.input.sha256, code: true, key: 'sha256' }],
      ['rows in the input', formatCount(input.input.rows)],
      ['created', input.createdAt],
      ['tool', `${input.tool.name} ${input.tool.version}`],
      ...Object.entries(plotLibraryVersions).map(([k, v]): Inline[] => [`plots drawn with ${k}`, v]),
    ],
  });
  if (input.configText !== undefined) {
    out.push({ kind: 'paragraph', parts: ['The resolved configuration of this run, verbatim:'] });
    out.push({ kind: 'code', text: input.configText });
  }
  return out;
}
