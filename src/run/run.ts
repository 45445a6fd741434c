/**
 * The whole analysis from one configuration: read the table, derive columns, rank the inputs,
 * fit and search relations, test bounds, render the report, and write the run folder (staged and
 * renamed into place, so an interrupted run leaves nothing half-written).
 */
import { stringify } from 'yaml';
import { SurmiseError } from '../errors.ts';
import { VERSION } from '../version.ts';
import { readTable, withDerived } from '../table/index.ts';
import { rankFeatures, type RankProgress, type RankResult } from '../attribute/rank.ts';
import { residualRanking, type ResidualResult } from './residual.ts';
import { fitRelation, type FitResult } from '../relate/fit.ts';
import { searchRelations, type SearchResult } from '../relate/search.ts';
import { findBound, type BoundResult } from '../bound/find.ts';
import { discoverBound, type DiscoverResult } from '../bound/discover.ts';
import { renderReport } from '../report/index.ts';
import { toJson } from '../util/json.ts';
import type { RunConfig, LoadedConfig } from './config.ts';
import { checkRunFolder, writeRunFolder, type OutputFile } from './folder.ts';
import { dependencyVersions, sha256File } from './provenance.ts';
import { checkAgainstTable, inConfig, parsePowers } from './check.ts';
import { buildReportInput } from './report-input.ts';

export { sha256File } from './provenance.ts';
export { jsonReplacer } from '../util/json.ts';

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

function seconds(t0: number): number {
  return Math.round((performance.now() - t0) / 10) / 100;
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
  let table = await readTable(config.table, {
    ...(config.format ? { format: config.format } : {}),
    kinds: config.kinds,
  });
  const { sha256, bytes } = await sha256File(config.table);
  const inputColumns = table.columns.map((c) => c.name);
  const at = (path: Array<string | number>) => loaded.locate?.(path) ?? loaded.path;
  for (const [name, source] of Object.entries(config.derive)) table = inConfig(['derive', name], at, () => withDerived(table, [{ name, source }]));
  checkAgainstTable(config, table, at);
  timings.read = seconds(t0);

  stage('learning and attribution');
  t0 = performance.now();
  const rank = await rankFeatures(table, {
    target: config.target,
    ...(config.features ? { features: config.features } : {}),
    exclude: config.exclude,
    groups: config.groups,
    methods: config.attribution.methods,
    seeds: config.attribution.seeds,
    folds: config.attribution.folds,
    split: config.split,
    ...(config.network.task !== 'auto' ? { task: config.network.task } : {}),
    hidden: config.network.hidden,
    epochs: config.network.epochs,
    activation: config.network.activation,
    loss: config.network.loss,
    patience: config.network.patience,
    learningRate: config.network.learningRate,
    ...(config.network.batchSize !== undefined ? { batchSize: config.network.batchSize } : {}),
    engine: opts.engine ?? config.network.engine,
    seed: config.seed,
    dropTop: config.attribution.dropTop,
    probes: config.attribution.probes,
    ...(opts.onRankProgress ? { onProgress: opts.onRankProgress } : {}),
  });
  timings.rank = seconds(t0);

  stage('fitting relations');
  t0 = performance.now();
  const fits = config.fits.map((f) => fitRelation(table, { target: f.target, terms: f.terms, intercept: f.intercept, seed: config.seed, noisyTerms: f.noisy }));
  timings.fit = seconds(t0);

  let search: SearchResult | null = null;
  if (config.search) {
    stage('searching formulas');
    t0 = performance.now();
    search = searchRelations(table, {
      target: config.search.target,
      from: config.search.from,
      maxTerms: config.search.maxTerms,
      powers: parsePowers(config.search.powers),
      top: config.search.top,
      seed: config.seed,
      ...(opts.onSearchProgress ? { progress: opts.onSearchProgress } : {}),
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
      rank: {
        methods: config.attribution.methods,
        seeds: config.attribution.seeds,
        folds: config.attribution.folds,
        split: config.split,
        hidden: config.network.hidden,
        epochs: config.network.epochs,
        probes: config.attribution.probes,
      },
      search: { maxTerms: rc.maxTerms, powers: parsePowers(rc.powers) },
      seed: config.seed,
      ...(opts.onRankProgress ? { onProgress: opts.onRankProgress } : {}),
    });
    timings.residual = seconds(t0);
  }

  stage('testing bounds');
  t0 = performance.now();
  const bounds = config.bounds.map((b) =>
    findBound(table, { lhs: b.lhs, rhs: b.rhs, ...(b.by ? { by: b.by } : {}), bins: b.bins, top: b.top, skipInvalid: b.skipInvalid }),
  );
  const discoveries = config.discover.map((d) => discoverBound(table, { ...d, seed: config.seed }));
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
    { path: 'results.json', data: toJson(results, 2) + '\n' },
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
