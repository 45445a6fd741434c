/**
 * The whole analysis from one configuration: read the table, derive columns, rank the inputs,
 * fit and search relations, test bounds, render the report, and write the run folder (staged and
 * renamed into place, so an interrupted run leaves nothing half-written).
 */
import { stringify } from 'yaml';
import { SurmiseError, wordOptionError } from '../errors.ts';
import { VERSION } from '../version.ts';
import { readTable, withDerived } from '../table/index.ts';
import { parseComplexPairsOption } from '../table/complex-pairs.ts';
import { rankFeatures, type RankOptions, type RankProgress, type RankResult } from '../attribute/rank.ts';
import { RANK_OPTIONS } from '../attribute/options.ts';
import { FIT_OPTIONS, SEARCH_OPTIONS } from '../relate/options.ts';
import { BOUND_OPTIONS } from '../bound/options.ts';
import { splitRows } from '../relate/split-option.ts';
import { configKeyOf } from '../util/option-table.ts';
import { residualRanking, type ResidualResult } from './residual.ts';
import { fitRelation, type FitResult, type FitSpec } from '../relate/fit.ts';
import { searchRelations, type SearchResult, type SearchSpec } from '../relate/search.ts';
import { findBound, type BoundResult, type BoundSpec } from '../bound/find.ts';
import { discoverBound, type DiscoverResult } from '../bound/discover.ts';
import { renderReport } from '../report/index.ts';
import { toJson } from '../util/json.ts';
import { keyPath, optionsFromConfig, searchPathOf, type RunConfig, type LoadedConfig } from './config.ts';
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

/** A formula search of the run under its configuration block's name (`search 1`, … unless named). */
export type NamedSearchResult = { name: string } & SearchResult;

export interface RunResults {
  format: 'surmise-run';
  /** 2: `searches` (a list); 1 (older run folders): one `search` or null, read as a list by readRunResults. */
  formatVersion: 2;
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
  /** Every search of the configuration in order, each under its block's name (formatVersion 1 held one, as `search`). */
  searches: NamedSearchResult[];
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
    complexPairs: parseComplexPairsOption(config.complexPairs),
  });
  const { sha256, bytes } = await sha256File(config.table);
  const inputColumns = table.columns.map((c) => c.name);
  const at = (path: Array<string | number>) => loaded.locate?.(path) ?? loaded.path;
  for (const [name, source] of Object.entries(config.derive)) table = inConfig(['derive', name], at, () => withDerived(table, [{ name, source }]));
  checkAgainstTable(config, table, at, (i) => searchPathOf(loaded, i));
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

  const searches: NamedSearchResult[] = [];
  if (config.search.length) {
    stage(config.search.length === 1 ? 'searching formulas' : `searching formulas (${config.search.length} searches)`);
    t0 = performance.now();
    config.search.forEach((sc, i) => {
      const result = inStage((k) => keyPath([...searchPathOf(loaded, i), k]), () => {
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
      searches.push({ name: sc.name, ...result });
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
      search: { maxTerms: rc.maxTerms, powers: parsePowers(rc.powers), columns: rc.columns },
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
    formatVersion: 2,
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
    searches,
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
