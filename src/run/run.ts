/**
 * The whole analysis from one configuration: read the table, derive columns, rank the inputs,
 * fit and search relations, test bounds, render the report, and write the run folder (staged and
 * renamed into place, so an interrupted run leaves nothing half-written).
 */
import { createHash } from 'node:crypto';
import { createReadStream, readFileSync } from 'node:fs';
import { isAbsolute, relative } from 'node:path';
import { stringify } from 'yaml';
import { SurmiseError, didYouMean, wordOptionError } from '../errors.ts';
import { VERSION } from '../version.ts';
import { deriveColumn, evaluateExpression, readTable, type Table } from '../table/index.ts';
import { formatColumnName } from '../table/expr/format.ts';
import { rankFeatures, type RankOptions, type RankProgress, type RankResult } from '../attribute/rank.ts';
import { RANK_OPTIONS } from '../attribute/options.ts';
import { FIT_OPTIONS, SEARCH_OPTIONS } from '../relate/options.ts';
import { BOUND_OPTIONS } from '../bound/options.ts';
import { splitRows } from '../relate/split-option.ts';
import { configKeyOf } from '../util/option-table.ts';
import { describeProbes } from '../attribute/probes.ts';
import { residualRanking, type ResidualResult } from './residual.ts';
import { fitRelation, type FitResult, type FitSpec } from '../relate/fit.ts';
import { searchRelations, type SearchResult, type SearchSpec } from '../relate/search.ts';
import { findBound, type BoundResult, type BoundSpec } from '../bound/find.ts';
import { discoverBound, type DiscoverResult } from '../bound/discover.ts';
import { largestIndices, renderReport, sampleIndices, type ReportInput } from '../report/index.ts';
import { keyPath, optionsFromConfig, type RunConfig, type LoadedConfig } from './config.ts';
import { parseSplitSpec } from '../table/split.ts';
import { checkRunFolder, writeRunFolder, type OutputFile } from './folder.ts';

/**
 * Points handed to the report per plot at most. The report itself bins or samples them for
 * drawing (and says so on the plot); this cap only bounds memory on tables of millions of rows.
 */
const MAX_POINTS = 200_000;

export interface RunOptions {
  /** Run folder; default the configuration's `output`. */
  out?: string;
  force?: boolean;
  /** Stage messages ("reading table", …). */
  onStage?: (message: string) => void;
  /** Training/attribution progress. */
  onRankProgress?: (e: RankProgress) => void;
  /** Called when the search screens subsets. */
  onSearchProgress?: (done: number, total: number) => void;
  /** The network engine, over the configuration's `network.engine`. */
  engine?: 'auto' | 'native' | 'tfjs';
}

export interface RunResults {
  format: 'surmise-run';
  formatVersion: 1;
  tool: { name: 'surmise'; version: string };
  node: string;
  dependencies: Record<string, string>;
  createdAt: string;
  configFile: string;
  config: RunConfig;
  input: { path: string; sha256: string; bytes: number; rows: number; columns: string[] };
  rows: RankResult['rows'] | null;
  seeds: { seed: number; networks: number[] };
  timings: Record<string, number>;
  rank: RankResult | null;
  fits: FitResult[];
  search: SearchResult | null;
  /** Residual ranking (config `residual`), or null. */
  residual: ResidualResult | null;
  bounds: BoundResult[];
  /** Right-hand-side searches (config key `discover`), in order. */
  discoveries: DiscoverResult[];
  evidence: string;
}

export interface RunOutcome {
  outDir: string;
  results: RunResults;
  files: string[];
}

/** SHA-256 of a file, streamed. */
export async function sha256File(path: string): Promise<{ sha256: string; bytes: number }> {
  const h = createHash('sha256');
  let bytes = 0;
  await new Promise<void>((resolveP, reject) => {
    createReadStream(path)
      .on('data', (c) => {
        bytes += (c as Buffer).length;
        h.update(c);
      })
      .on('error', reject)
      .on('end', () => resolveP());
  });
  return { sha256: h.digest('hex'), bytes };
}

const DEPENDENCIES = ['@tensorflow/tfjs', '@tensorflow/tfjs-backend-wasm', 'vega', 'vega-lite', '@resvg/resvg-js', 'yaml', 'zod', 'commander', 'danfojs-node'];

function dependencyVersions(): Record<string, string> {
  const out: Record<string, string> = {};
  for (const d of DEPENDENCIES) {
    try {
      const url = new URL(`../../node_modules/${d}/package.json`, import.meta.url);
      out[d] = (JSON.parse(readFileSync(url, 'utf8')) as { version: string }).version;
    } catch {
      out[d] = 'unknown';
    }
  }
  return out;
}

function seconds(t0: number): number {
  return Math.round((performance.now() - t0) / 10) / 100;
}

/** A target as rank reads it: a column of that exact name, else an expression. */
function targetExpression(table: Table, target: string): string {
  return table.columns.some((c) => c.name === target) ? formatColumnName(target) : target;
}

/** Values of an expression on the given rows, real part (NaN where missing). */
function realValues(table: Table, source: string): Float64Array {
  const v = evaluateExpression(table, source);
  const out = new Float64Array(v.re.length);
  for (let i = 0; i < out.length; i++) out[i] = v.missing[i] ? NaN : v.re[i]!;
  return out;
}

/** Expression for a ranked feature group: a complex column is plotted through its real part. */
function featureExpression(table: Table, name: string): string | null {
  const col = table.columns.find((c) => c.name === name);
  if (!col || col.kind === 'label') return null;
  const q = formatColumnName(name);
  return col.kind === 'complex' ? `abs(${q})` : q;
}

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

function pick(values: Float64Array, idx: Int32Array): number[] {
  return Array.from(idx, (i) => values[i]!);
}

/**
 * Finite rows of all arrays, then a seeded sample of at most MAX_POINTS of them; with `keepLargest`
 * the rows with the 100 largest values of that array are always kept (the rows that set a bound).
 */
function finiteSample(arrays: Float64Array[], seed: number, keepLargest?: Float64Array): { idx: Int32Array; from: number } {
  const n = arrays[0]!.length;
  const ok: number[] = [];
  for (let i = 0; i < n; i++) if (arrays.every((a) => Number.isFinite(a[i]!))) ok.push(i);
  if (ok.length <= MAX_POINTS) return { idx: Int32Array.from(ok), from: ok.length };
  const keep = keepLargest ? largestIndices(Float64Array.from(ok, (i) => keepLargest[i]!), 100) : [];
  const s = sampleIndices(ok.length, MAX_POINTS, seed, keep);
  return { idx: Int32Array.from(s, (k) => ok[k]!), from: ok.length };
}

function buildReportInput(
  results: RunResults,
  table: Table,
  configText: string,
): ReportInput {
  const { config, rank, fits, search } = results;
  // each search's proposals are shown as bounds along its first quantity
  const bounds = [...results.bounds, ...results.discoveries.map(discoveryAsBounds)];
  const group = groupingLabel(table);
  const pickLabels = (idx: Int32Array) => (group ? { labels: { name: group.name, values: Array.from(idx, (i) => group.values[i]!) } } : {});
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
    // target against the top feature, coloured by the second
    const top = rank.ranking.map((r) => featureExpression(table, r.feature)).filter((e): e is string => e !== null);
    if (top.length >= 1) {
      const y = realValues(table, targetExpression(table, config.target));
      const x = realValues(table, top[0]!);
      const c = top.length >= 2 ? realValues(table, top[1]!) : null;
      const { idx, from } = finiteSample(c ? [x, y, c] : [x, y], config.seed);
      input.scatter = {
        x: pick(x, idx),
        y: pick(y, idx),
        xName: top[0]!,
        yName: config.target,
        ...(c ? { color: pick(c, idx), colorName: top[1]! } : {}),
        ...pickLabels(idx),
        ...(from > idx.length ? { sampledFrom: from } : {}),
      };
    }
  }
  if (fits.length) {
    input.fits = fits.map((f) => {
      const termCols = f.terms.filter((t) => t.term !== '1').map((t) => ({ term: t.term, v: realValues(table, t.term) }));
      const y = realValues(table, f.target);
      const resid = new Float64Array(y.length);
      const icpt = f.terms.find((t) => t.term === '1')?.coef ?? 0;
      for (let i = 0; i < y.length; i++) {
        let s = icpt;
        for (const tc of termCols) s += f.terms.find((t) => t.term === tc.term)!.coef * tc.v[i]!;
        resid[i] = y[i]! - s;
      }
      const { idx } = finiteSample([resid, ...termCols.map((t) => t.v)], config.seed);
      return {
        target: f.target,
        n: f.n,
        r2: f.r2,
        rmse: f.rmse,
        cvRmse: f.cvRmse,
        terms: f.terms.map((t) => ({ term: t.term, coef: t.coef, se: t.se, low: t.low, high: t.high, rational: t.rational ? { text: t.rational.text } : null })),
        warnings: f.warnings,
        residuals: { byTerm: termCols.map((t) => ({ term: t.term, x: pick(t.v, idx) })), residual: pick(resid, idx) },
      };
    });
  }
  if (search) {
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
    input.search = {
      candidates: search.candidates.map(conv),
      front: search.front.map(conv),
      mode: search.mode,
      target: search.target,
      nCandidateTerms: search.nCandidateTerms,
      nCandidatesTried: search.nCandidatesTried,
      selectionRows: search.selectionRows,
      heldOutRows: search.heldOutRows,
      notes: search.notes,
    };
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
      const lhs = realValues(table, b.lhs);
      return {
        lhs: b.lhs,
        ...(b.by ? { by: b.by } : {}),
        results: b.results.map((r) => {
          const rhs = realValues(table, r.rhs);
          const by = realValues(table, r.by);
          const ratio = new Float64Array(lhs.length);
          for (let i = 0; i < ratio.length; i++) ratio[i] = rhs[i]! > 0 ? lhs[i]! / rhs[i]! : NaN;
          const { idx } = finiteSample([ratio, by], config.seed, ratio);
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
            points: { by: pick(by, idx), ratio: pick(ratio, idx), ...pickLabels(idx) },
          };
        }),
      };
    });
  }
  return input;
}

function parsePowers(s: string): [number, number] {
  const [a, b] = s.split('..').map(Number);
  if (!Number.isInteger(a) || !Number.isInteger(b) || a! > b!) {
    throw new SurmiseError('config.badValue', `expected a range lo..hi with lo ≤ hi, got '${s}'`);
  }
  return [a!, b!];
}

/** The configuration key path of a ranking option (`attribution.seeds`, `network.epochs`, `seed`). */
function rankKeyPath(key: string): string | undefined {
  const o = RANK_OPTIONS.find((s) => s.key === key);
  return o ? (configKeyOf(o) ?? undefined) : undefined;
}

/** Run a stage; an error naming an option key is reworded with its configuration key path (`word`). */
function inStage<T>(word: (key: string) => string | undefined, f: () => T): T {
  const reword = (e: unknown): unknown => (e instanceof SurmiseError ? wordOptionError(e, (k) => word(k) ?? k) : e);
  try {
    const r = f();
    if (r instanceof Promise) return r.catch((e: unknown) => Promise.reject(reword(e))) as T;
    return r;
  } catch (e) {
    throw reword(e);
  }
}

/** Run `f`; a SurmiseError it throws is re-thrown naming the configuration key and its place in the file. */
function inConfig<T>(path: Array<string | number>, at: (p: Array<string | number>) => string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof SurmiseError && e.exitCode === 2) {
      const worded = wordOptionError(e, (k) => (k === e.details?.option ? keyPath(path) : k));
      throw new SurmiseError(e.code, `${at(path)}: ${keyPath(path)}: ${worded.message}`, { ...e.details, worded: true });
    }
    throw e;
  }
}

/**
 * Check every expression, column name and option of the configuration against the table before
 * any training starts, so a typo costs seconds, not a whole run.
 */
function checkAgainstTable(config: RunConfig, table: Table, at: (p: Array<string | number>) => string): void {
  if (config.split !== undefined) inConfig(['split'], at, () => parseSplitSpec(config.split!));
  const expr = (path: Array<string | number>, source: string) => inConfig(path, at, () => evaluateExpression(table, source));
  expr(['target'], targetExpression(table, config.target));
  config.fits.forEach((f, i) => {
    expr(['fits', i, 'target'], f.target);
    f.terms.forEach((t, j) => expr(['fits', i, 'terms', j], t));
    f.noisy.forEach((t, j) => {
      if (!f.terms.some((u) => u.replace(/\s+/g, '') === t.replace(/\s+/g, ''))) {
        throw new SurmiseError('config.badValue', `${at(['fits', i, 'noisy', j])}: fits[${i}].noisy[${j}]: '${t}' is not one of this fit's terms (${f.terms.join('; ')})`);
      }
    });
  });
  if (config.search) {
    expr(['search', 'target'], config.search.target);
    // search builds its terms from columns named as they are (any name), not from expressions
    const names = table.columns.map((c) => c.name);
    config.search.from.forEach((c, j) => {
      if (!names.includes(c)) {
        throw new SurmiseError('config.unknownColumn', `${at(['search', 'from', j])}: search.from[${j}]: no column '${c}' in the table${didYouMean(c, names)}`, { column: c });
      }
    });
    inConfig(['search', 'powers'], at, () => parsePowers(config.search!.powers));
  }
  config.discover.forEach((d, i) => {
    expr(['discover', i, 'lhs'], d.lhs);
    d.from.forEach((f, j) => expr(['discover', i, 'from', j], f));
  });
  if (config.residual) {
    const r = config.residual;
    expr(['residual', 'target'], r.target);
    r.terms.forEach((t, j) => expr(['residual', 'terms', j], t));
    r.from?.forEach((c, j) => expr(['residual', 'from', j], c));
    inConfig(['residual', 'powers'], at, () => parsePowers(r.powers));
  }
  config.bounds.forEach((b, i) => {
    expr(['bounds', i, 'lhs'], b.lhs);
    b.rhs.forEach((r, j) => expr(['bounds', i, 'rhs', j], r));
    if (b.by) expr(['bounds', i, 'by'], b.by);
  });
}

/** Run every stage of `loaded` and write the run folder. */
export async function executeRun(loaded: LoadedConfig, opts: RunOptions = {}): Promise<RunOutcome> {
  const { config } = loaded;
  const outDir = opts.out ?? config.output;
  checkRunFolder(outDir, opts.force ?? false);
  const stage = opts.onStage ?? (() => {});
  const timings: Record<string, number> = {};
  const tAll = performance.now();

  stage(`reading ${config.table}`);
  let t0 = performance.now();
  const table = await readTable(config.table, {
    ...(config.format ? { format: config.format } : {}),
    kinds: config.kinds,
  });
  const { sha256, bytes } = await sha256File(config.table);
  const inputColumns = table.columns.map((c) => c.name);
  const at = (path: Array<string | number>) => loaded.locate?.(path) ?? loaded.path;
  for (const [name, source] of Object.entries(config.derive)) {
    if (table.columns.some((c) => c.name === name)) {
      throw new SurmiseError('config.badValue', `${at(['derive', name])}: derive.${name}: the table already has a column '${name}'`);
    }
    table.columns.push(inConfig(['derive', name], at, () => deriveColumn(table, name, source)));
  }
  checkAgainstTable(config, table, at);
  timings.read = seconds(t0);

  stage('learning and attribution');
  t0 = performance.now();
  const rankOptions = optionsFromConfig(RANK_OPTIONS, config) as Omit<RankOptions, 'target'>;
  const rank = await inStage(rankKeyPath, () =>
    rankFeatures(table, {
      target: config.target,
      groups: config.groups,
      ...rankOptions,
      ...(opts.engine ? { engine: opts.engine } : {}),
      ...(opts.onRankProgress ? { onProgress: opts.onRankProgress } : {}),
    }),
  );
  timings.rank = seconds(t0);

  stage('fitting relations');
  t0 = performance.now();
  const fits = config.fits.map((f, i) =>
    inStage((k) => keyPath(['fits', i, k]), () => {
      const { split, ...o } = optionsFromConfig(FIT_OPTIONS, f) as { split?: string } & Omit<FitSpec, 'target' | 'terms' | 'split'>;
      const seed = f.seed ?? config.seed;
      const rows = split === undefined ? undefined : splitRows(table, split, seed);
      return fitRelation(table, { target: f.target, terms: f.terms, ...o, seed, ...(rows ? { split: { train: rows.first, test: rows.second, description: rows.description } } : {}) });
    }),
  );
  timings.fit = seconds(t0);

  let search: SearchResult | null = null;
  if (config.search) {
    stage('searching formulas');
    t0 = performance.now();
    const sc = config.search;
    search = inStage((k) => keyPath(['search', k]), () => {
      const { split, powers, lattice, ...o } = optionsFromConfig(SEARCH_OPTIONS, sc) as { split?: string; powers: string; lattice: string } & Omit<SearchSpec, 'target' | 'from' | 'split' | 'powers' | 'lattice'>;
      const seed = sc.seed ?? config.seed;
      const rows = split === undefined ? undefined : splitRows(table, split, seed);
      return searchRelations(table, {
        target: sc.target,
        from: sc.from,
        ...o,
        powers: parsePowers(powers),
        lattice: lattice === 'auto' || lattice === 'off' ? lattice : Number(lattice),
        seed,
        ...(rows ? { split: { selection: rows.first, heldOut: rows.second, description: rows.description } } : {}),
        ...(opts.onSearchProgress ? { progress: opts.onSearchProgress } : {}),
      });
    });
    timings.search = seconds(t0);
  }

  let residual: ResidualResult | null = null;
  if (config.residual) {
    const rc = config.residual;
    stage('ranking what the fit leaves over');
    t0 = performance.now();
    residual = await residualRanking(table, {
      target: rc.target,
      terms: rc.terms,
      intercept: rc.intercept,
      ...(rc.from ? { from: rc.from } : {}),
      absolute: rc.absolute,
      rank: (({ features: _f, exclude: _e, ...o }) => o)(rankOptions),
      search: { maxTerms: rc.maxTerms, powers: parsePowers(rc.powers) },
      seed: config.seed,
      ...(opts.onRankProgress ? { onProgress: opts.onRankProgress } : {}),
    });
    timings.residual = seconds(t0);
  }

  stage('testing bounds');
  t0 = performance.now();
  const bounds = config.bounds.map((b, i) =>
    inStage((k) => keyPath(['bounds', i, k]), () => findBound(table, { lhs: b.lhs, rhs: b.rhs, ...(optionsFromConfig(BOUND_OPTIONS, b) as Omit<BoundSpec, 'lhs' | 'rhs'>) })),
  );
  const discoveries = config.discover.map((d, i) => inStage((k) => keyPath(['discover', i, k]), () => discoverBound(table, { ...d, seed: d.seed ?? config.seed })));
  timings.bound = seconds(t0);

  const configText = stringify({ ...config, table: config.table, output: outDir });
  const results: RunResults = {
    format: 'surmise-run',
    formatVersion: 1,
    tool: { name: 'surmise', version: VERSION },
    node: process.version,
    dependencies: dependencyVersions(),
    createdAt: new Date().toISOString(),
    configFile: loaded.path,
    config,
    input: { path: config.table, sha256, bytes, rows: table.nRows, columns: inputColumns },
    rows: rank.rows,
    seeds: { seed: config.seed, networks: rank.seeds },
    timings,
    rank,
    fits,
    search,
    residual,
    bounds,
    discoveries,
    evidence: 'These findings are statistical evidence on this table, not a proof.',
  };

  stage('rendering the report');
  t0 = performance.now();
  const reportInput = buildReportInput(results, table, configText);
  const rendered = await renderReport(reportInput);
  timings.report = seconds(t0);
  timings.total = seconds(tAll);

  const files: OutputFile[] = [
    { path: 'results.json', data: JSON.stringify(results, jsonReplacer, 2) + '\n' },
    { path: 'report.html', data: rendered.html },
    { path: 'report.md', data: rendered.markdown },
    { path: 'config.yaml', data: configText },
  ];
  for (const p of rendered.plots) {
    files.push({ path: `plots/${p.name}.svg`, data: p.svg });
    if (p.png.length) files.push({ path: `plots/${p.name}.png`, data: p.png });
  }
  stage(`writing ${outDir}`);
  writeRunFolder(outDir, files, opts.force ?? false);
  return { outDir, results, files: files.map((f) => f.path) };
}

/** JSON has no NaN or ±Infinity: write them as strings so nothing is silently turned into null. */
export function jsonReplacer(_key: string, value: unknown): unknown {
  if (typeof value === 'number' && !Number.isFinite(value)) return String(value);
  if (ArrayBuffer.isView(value) && !(value instanceof DataView)) return Array.from(value as unknown as ArrayLike<number>);
  return value;
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
      };
    }),
  };
}
