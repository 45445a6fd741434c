/**
 * The report's input from a run's results: what each stage computed and handed on (figures,
 * notes, plot points), shaped for the report. Nothing is re-evaluated here; the table is read
 * only for the label column that colours the points.
 */
import { isAbsolute, relative } from 'node:path';
import { VERSION } from '../version.ts';
import type { Table } from '../table/index.ts';
import type { RankResult } from '../attribute/rank.ts';
import { describeProbes } from '../attribute/probes.ts';
import type { SearchResult } from '../relate/search.ts';
import type { BoundResult } from '../bound/find.ts';
import type { DiscoverResult } from '../bound/discover.ts';
import type { ReportInput } from '../report/index.ts';
import type { RunResults } from './run.ts';

/** A path as the report shows it: relative to the working folder when inside it, else as is. */
function shownPath(p: string): string {
  const r = relative(process.cwd(), p);
  return r && !r.startsWith('..') && !isAbsolute(r) ? r : p;
}

/**
 * A label column that names groups of rows (e.g. a family): the first label column with 2 to 12
 * distinct values. Its values colour the report's point plots.
 */
function groupingLabel(table: Table): { name: string; values: string[] } | null {
  for (const c of table.columns) {
    if (c.kind !== 'label') continue;
    const seen = new Set<string>();
    for (let i = 0; i < table.nRows && seen.size <= 12; i++) seen.add(c.missing[i] ? '' : c.values[i]!);
    if (seen.size >= 2 && seen.size <= 12) return { name: c.name, values: Array.from({ length: table.nRows }, (_, i) => (c.missing[i] ? '' : c.values[i]!)) };
  }
  return null;
}

/** The report's input from a run's results, the table they came from and the configuration text. */
export function buildReportInput(
  results: RunResults,
  table: Table,
  configText: string,
): ReportInput {
  const { config, rank, fits } = results;
  // each search's proposals are shown as bounds along its first quantity
  const bounds = [...results.bounds, ...results.discoveries.map(discoveryAsBounds)];
  const group = groupingLabel(table);
  const labelsOfRows = (rows: number[]) => (group ? { labels: { name: group.name, values: rows.map((r) => group.values[r - 1]!) } } : {});
  const input: ReportInput = {
    title: `surmise: what predicts ${config.target}`,
    createdAt: results.createdAt,
    tool: { name: 'surmise', version: VERSION },
    input: { path: shownPath(results.input.path), sha256: results.input.sha256, rows: results.input.rows },
    configText,
  };
  if (rank) {
    input.drops = rank.rows;
    const methods: NonNullable<ReportInput['rank']>['methods'] = {};
    for (const [m, r] of Object.entries(rank.methods)) {
      if (r) methods[m] = { ranking: r.ranking, kendallTau: r.kendallTau ?? NaN };
    }
    input.rank = {
      target: rank.target,
      task: rank.task,
      model: {
        metric: rank.model.metric,
        score: rank.model.score,
        baselines: { constant: rank.model.baselines.constant.score, ridge: rank.model.baselines.ridge.score },
        ...(rank.model.secondary
          ? {
              secondary: {
                metric: rank.model.secondary.metric,
                score: rank.model.secondary.score,
                baselines: { constant: rank.model.baselines.constant.secondary!.score, ridge: rank.model.baselines.ridge.secondary!.score },
              },
            }
          : {}),
      },
      methods,
      ranking: rank.ranking,
    };
    if (rank.predictions) input.rank.predictions = { actual: rank.predictions.actual, predicted: rank.predictions.predicted };
    if (rank.completeness) input.rank.completeness = rank.completeness;
    if (rank.confusion) input.rank.confusion = { classes: rank.confusion.classes, counts: rank.confusion.counts };
    const lead = rank.dependence?.find((d) => d.feature === rank.ranking[0]?.feature);
    if (lead) input.rank.dependence = lead;
    if (rank.noise) input.rank.noise = { probes: describeProbes(rank.noise.probes), reference: rank.noise.reference };
    // target against the top feature, coloured by the second (points chosen by the rank stage)
    const pts = rank.points;
    const [first, second] = pts.groups;
    if (first) {
      input.scatter = {
        x: first.values,
        y: pts.target,
        xName: first.expression,
        yName: config.target,
        ...(second ? { color: second.values, colorName: second.expression } : {}),
        ...labelsOfRows(pts.rows),
        ...(pts.sampledFrom > pts.rows.length ? { sampledFrom: pts.sampledFrom } : {}),
      };
    }
  }
  if (fits.length) {
    input.fits = fits.map((f) => {
      const p = f.residualPoints;
      return {
        target: f.target,
        n: f.n,
        r2: f.r2,
        rmse: f.rmse,
        cvRmse: f.cvRmse,
        terms: f.terms.map((t) => ({ term: t.term, coef: t.coef, se: t.se, low: t.low, high: t.high, rational: t.rational ? { text: t.rational.text } : null })),
        warnings: f.warnings,
        residuals: { byTerm: p.byTerm, residual: p.residual, sampledFrom: p.sampledFrom },
      };
    });
  }
  const searches = results.searches ?? [];
  if (searches.length) {
    const conv = (c: SearchResult['candidates'][number]) => ({
      terms: c.terms,
      coefs: c.coefs,
      heldOutRmse: c.heldOutRmse,
      complexity: c.complexity,
      intercept: c.intercept.coef,
      selectionRmse: c.selectionRmse,
      rationalFormula: c.intercept.rational || c.rationals.some((q) => q !== null) ? c.roundedFormula : null,
      rationalHeldOutRmse: c.roundedHeldOutRmse,
    });
    input.searches = searches.map((search) => ({
      name: search.name,
      candidates: search.candidates.map(conv),
      front: search.front.map(conv),
      mode: search.mode,
      target: search.target,
      nCandidateTerms: search.nCandidateTerms,
      nCandidatesTried: search.nCandidatesTried,
      selectionRows: search.selectionRows,
      heldOutRows: search.heldOutRows,
      ...(search.heldOutSd !== undefined ? { heldOutSd: search.heldOutSd } : {}),
      notes: search.notes,
    }));
  }
  if (results.residual) {
    const rr = results.residual;
    const noiseOf = (r: RankResult) => (r.noise ? { noise: { probes: describeProbes(r.noise.probes), reference: r.noise.reference } } : {});
    input.residual = {
      target: rr.fit.target,
      fit: `${rr.fit.target} ≈ ${rr.fit.terms.map((t) => `${Number(t.coef.toPrecision(6))}${t.term === '1' ? '' : `·${t.term}`}`).join(' + ')}`,
      r2: rr.fit.r2,
      rmse: rr.fit.rmse,
      residualName: rr.residualName,
      features: rr.features,
      ranking: rr.ranking.ranking,
      ...noiseOf(rr.ranking),
      ...(rr.absolute ? { absolute: { ranking: rr.absolute.ranking, ...noiseOf(rr.absolute) } } : {}),
      next: rr.next?.proposal ? { from: rr.next.from, formula: rr.next.proposal.formula, heldOutRmse: rr.next.proposal.heldOutRmse, nextTerms: rr.next.nextTerms! } : null,
      notes: rr.notes,
    };
  }
  if (bounds.length) {
    input.bounds = bounds.map((b) => {
      return {
        lhs: b.lhs,
        ...(b.by ? { by: b.by } : {}),
        results: b.results.map((r) => {
          const quantiles: Record<string, number> = {};
          for (const q of r.quantiles) quantiles[`${Number((q.p * 100).toPrecision(4))}%`] = q.value;
          return {
            rhs: r.rhs,
            constant: r.constant,
            witnesses: r.witnesses.map((w) => ({
              row: w.row,
              lhs: w.lhs,
              rhs: w.rhs,
              ratio: w.ratio,
              by: w.by,
              labels: Object.fromEntries(Object.entries(w.labels).map(([k, v]) => [k, v === null ? '' : String(v)])),
            })),
            quantiles,
            strata: r.strata.map((s) => ({ low: s.low, high: s.high, n: s.n, constant: s.constant })),
            trend: r.trend && r.trend.slope !== null && r.trend.low !== null && r.trend.high !== null
              ? { slope: r.trend.slope, low: r.trend.low, high: r.trend.high, kind: r.trend.kind, verdict: r.trend.verdict }
              : null,
            points: { by: r.points.by, ratio: r.points.ratio, sampledFrom: r.points.sampledFrom, ...labelsOfRows(r.points.rows) },
            notes: r.notes,
          };
        }),
      };
    });
  }
  return input;
}


/** A right-hand-side search seen as bounds along its first quantity, for the report. */
function discoveryAsBounds(d: DiscoverResult): BoundResult {
  const by = d.from[0]!;
  return {
    source: d.source,
    lhs: d.lhs,
    by,
    form: d.form,
    n: d.n,
    dropped: d.dropped,
    results: d.proposals.map((p) => {
      const { strata, ...trend } = p.trend.along[by]!;
      return {
        rhs: p.rhs,
        by,
        constant: p.constant,
        n: d.used,
        dropped: d.dropped,
        witnesses: p.witnesses,
        quantiles: [],
        quantileDefinition: '',
        strata,
        trend,
        extremeStratum: null,
        notes: [],
        points: p.points,
      };
    }),
  };
}
