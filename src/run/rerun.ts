import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { SurmiseError } from '../errors.ts';
import { RunConfigSchema, type LoadedConfig, type RunConfig } from './config.ts';
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
  const r = data as Partial<RunResults>;
  if (r.format !== 'surmise-run' || typeof r.config !== 'object') {
    throw new SurmiseError('run.notARun', `${file} was not written by surmise run`);
  }
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
  return { config: parsed.data as unknown as RunConfig, path: join(runDir, 'results.json') };
}
