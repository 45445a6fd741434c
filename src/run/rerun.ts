import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { SurmiseError } from '../errors.ts';
import { RunConfigSchema, defaultSearchName, singleSearchBlock, type LoadedConfig, type RunConfig } from './config.ts';
import type { SearchResult } from '../relate/search.ts';
import type { RunResults } from './run.ts';

/** Read a run folder's results.json (`run.notARun` when it is not one). */
export function readRunResults(runDir: string): RunResults {
  const file = join(runDir, 'results.json');
  if (!existsSync(file)) throw new SurmiseError('run.notARun', `${runDir} is not a surmise run folder (no results.json)`);
  let data: unknown;
  try {
    data = JSON.parse(readFileSync(file, 'utf8'));
  } catch (e) {
    throw new SurmiseError('run.badResults', `${file}: not valid JSON: ${(e as Error).message}`);
  }
  const r = data as Omit<Partial<RunResults>, 'formatVersion'> & { formatVersion?: unknown; search?: unknown };
  if (r.format !== 'surmise-run' || typeof r.config !== 'object') {
    throw new SurmiseError('run.notARun', `${file} was not written by surmise run`);
  }
  if (r.formatVersion === 1 || r.formatVersion === undefined) {
    // formatVersion 1 held one search (or null) as `search`: read it as a list of one, named as a new run names it
    const { search, ...rest } = r;
    if (search !== null && search !== undefined && typeof search !== 'object') throw new SurmiseError('run.badResults', `${file}: 'search' is not a search result`);
    return { ...rest, formatVersion: 2, searches: search ? [{ name: defaultSearchName(0), ...(search as SearchResult) }] : [] } as RunResults;
  }
  if (r.formatVersion !== 2) {
    const newer = typeof r.formatVersion === 'number' && Number.isInteger(r.formatVersion) && r.formatVersion > 2;
    throw new SurmiseError('run.badResults', `${file}: ${newer ? 'written by a newer surmise' : 'not a results format surmise wrote'} (results format ${JSON.stringify(r.formatVersion)}; this one reads 1 and 2)`);
  }
  if (!Array.isArray(r.searches)) throw new SurmiseError('run.badResults', `${file}: 'searches' is not a list`);
  return r as RunResults;
}

/**
 * The resolved configuration of an earlier run with its table replaced by `newTable`: the same
 * target, features, network, seeds, relations and bounds, so differences come from the data.
 */
export function rerunFromFolder(runDir: string, newTable: string, cwd: string): LoadedConfig {
  const prev = readRunResults(runDir);
  const table = resolve(cwd, newTable);
  if (!existsSync(table)) throw new SurmiseError('table.unreadable', `cannot read ${newTable}: no such file`);
  const parsed = RunConfigSchema.safeParse({ ...prev.config, table });
  if (!parsed.success) {
    throw new SurmiseError('run.badResults', `${join(runDir, 'results.json')}: the stored configuration is not valid: ${parsed.error.issues[0]?.message}`);
  }
  // an older run's configuration may hold one search block written as a mapping: name its keys as written
  const single = singleSearchBlock(prev.config);
  return { config: parsed.data as unknown as RunConfig, path: join(runDir, 'results.json'), searchPath: (i) => (single ? ['search'] : ['search', i]) };
}
