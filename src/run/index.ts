export { RunConfigSchema, parseConfig, loadConfig, type RunConfig, type LoadedConfig } from './config.ts';
export { executeRun, sha256File, jsonReplacer, type RunOptions, type RunResults, type RunOutcome } from './run.ts';
export { rerunFromFolder, readRunResults } from './rerun.ts';
export { compareRuns, formatComparison, type Comparison } from './compare.ts';
export { writeRunFolder, checkRunFolder, type OutputFile } from './folder.ts';
