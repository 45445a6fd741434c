import type { CliIO } from './io.ts';
import type { LoadedConfig } from '../run/config.ts';
import { executeRun, type RunOutcome } from '../run/run.ts';
import { makeProgress } from './progress.ts';
import { toJson } from '../util/json.ts';

/** Run with stage lines and a training progress bar on stderr; print the report's path on stdout. */
export async function runWithProgress(
  io: CliIO,
  loaded: LoadedConfig,
  o: { out?: string; force?: boolean; progress: boolean; json?: boolean; engine?: 'auto' | 'native' | 'tfjs' },
): Promise<RunOutcome> {
  const bar = makeProgress(io, 'training', o.progress);
  const outcome = await executeRun(loaded, {
    ...(o.out ? { out: o.out } : {}),
    force: o.force ?? false,
    ...(o.engine ? { engine: o.engine } : {}),
    onStage: (m) => {
      bar.stop();
      if (o.progress) io.stderr(`surmise: ${m}\n`);
    },
    onRankProgress: (e) => bar.update(e.done, e.total, e.message),
  });
  bar.stop();
  const t = outcome.results.timings;
  if (o.json) {
    io.stdout(toJson({ outDir: outcome.outDir, report: `${outcome.outDir}/report.html`, files: outcome.files, timings: t, engine: outcome.results.rank?.model.engine ?? null }) + '\n');
  } else {
    io.stdout(`${outcome.outDir}/report.html\n`);
    const engine = outcome.results.rank ? `; network on the ${outcome.results.rank.model.engine} engine` : '';
    if (o.progress) io.stderr(`surmise: done in ${t.total} s${engine} (report also as report.md; everything in results.json)\n`);
  }
  return outcome;
}
