/**
 * Whole-run benchmark: `surmise run` with the demo configuration (configs/demo.yaml) on a table of
 * the demo's kind with 10⁶ rows (the demo's 1,936 rows, then random knot braids on 3–6 strands drawn
 * like its random family, every invariant computed by surmise). The table is built once, with one
 * child process per core, and kept in the system's temporary folder for later runs.
 *   npm run bench -- run [--quick] [--rows N] [--runs R] [--engine native|tfjs]
 * --quick: 100,000 rows, one run. Prints the wall time of each run, the stage timings from
 * results.json, the median, and the target (10⁶ rows under 4 minutes).
 */
import { spawn, spawnSync } from 'node:child_process';
import { createWriteStream, existsSync, mkdirSync, mkdtempSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEMO_KNOT_COLUMNS } from '../src/demo/knots.ts';

const argv = process.argv.slice(2);
const opt = (name: string): string | undefined => (argv.includes(name) ? argv[argv.indexOf(name) + 1] : undefined);
const quick = argv.includes('--quick');
const ROWS = Math.min(5_000_000, Math.max(2_000, Number(opt('--rows') ?? (quick ? 100_000 : 1_000_000))));
const RUNS = Math.min(10, Math.max(1, Number(opt('--runs') ?? (quick ? 1 : 3))));
const ENGINE = opt('--engine');
const SEED = 1;
const root = fileURLToPath(new URL('..', import.meta.url));
const load = () => os.loadavg().map((v) => v.toFixed(1)).join(' ');
const median = (v: number[]) => [...v].sort((a, b) => a - b)[Math.floor((v.length - 1) / 2)]!;

async function buildTable(file: string): Promise<void> {
  const parts = Math.max(1, os.availableParallelism());
  const dir = mkdtempSync(join(os.tmpdir(), 'surmise-bench-rows-'));
  const t0 = performance.now();
  const bounds = Array.from({ length: parts + 1 }, (_, i) => Math.round((i * ROWS) / parts));
  await Promise.all(
    bounds.slice(0, -1).map(
      (from, i) =>
        new Promise<void>((done, fail) => {
          const child = spawn(process.execPath, ['--import', 'tsx', join(root, 'bench/run-rows.ts'), String(from), String(bounds[i + 1]), String(SEED), join(dir, `part${i}.csv`)], { stdio: 'inherit', cwd: root });
          child.on('exit', (code) => (code === 0 ? done() : fail(new Error(`bench/run-rows.ts exited with ${code}`))));
        }),
    ),
  );
  const partial = `${file}.partial-${process.pid}`;
  const out = createWriteStream(partial);
  out.write(DEMO_KNOT_COLUMNS.join(',') + '\n');
  for (let i = 0; i < parts; i++) out.write(readFileSync(join(dir, `part${i}.csv`)));
  await new Promise<void>((done) => out.end(done));
  renameSync(partial, file);
  rmSync(dir, { recursive: true, force: true });
  console.log(`built ${ROWS} rows in ${((performance.now() - t0) / 1000).toFixed(1)} s with ${parts} processes (load average ${load()})`);
}

const cache = join(os.tmpdir(), 'surmise-bench');
mkdirSync(cache, { recursive: true });
const table = join(cache, `demo-kind-${ROWS}-seed${SEED}.csv`);
if (!existsSync(table)) await buildTable(table);
else console.log(`table: ${ROWS} rows from the cache of an earlier run`);

// the demo configuration with its table and output replaced
const work = mkdtempSync(join(os.tmpdir(), 'surmise-bench-run-'));
const config = readFileSync(join(root, 'configs/demo.yaml'), 'utf8')
  .replace(/^table: .*$/m, `table: ${JSON.stringify(table)}`)
  .replace(/^output: .*$/m, `output: ${JSON.stringify(join(work, 'out'))}`);
writeFileSync(join(work, 'demo.yaml'), config);
spawnSync('npm', ['run', 'build', '--silent'], { cwd: root, stdio: 'inherit' }); // time the compiled CLI, as a user runs it

const walls: number[] = [];
for (let r = 1; r <= RUNS; r++) {
  const before = load();
  const t0 = performance.now();
  const res = spawnSync(process.execPath, [join(root, 'bin/surmise.js'), 'run', join(work, 'demo.yaml'), '--force', '--no-progress', ...(ENGINE ? ['--engine', ENGINE] : [])], { cwd: work, encoding: 'utf8', maxBuffer: 1 << 26 });
  const wall = (performance.now() - t0) / 1000;
  if (res.status !== 0) {
    process.stderr.write(res.stderr);
    process.exit(1);
  }
  walls.push(wall);
  const results = JSON.parse(readFileSync(join(work, 'out', 'results.json'), 'utf8')) as { timings?: Record<string, number>; rank?: { model?: { engine?: string; epochsRun?: number[] } } };
  const stages = Object.entries(results.timings ?? {}).map(([k, v]) => `${k} ${v} s`).join(', ');
  console.log(`run ${r}: ${wall.toFixed(1)} s wall (engine ${results.rank?.model?.engine ?? '?'}, epochs run ${results.rank?.model?.epochsRun?.join(', ') ?? '?'}; ${stages}; load average before ${before}, after ${load()})`);
}
console.log(`surmise run, demo configuration, ${ROWS} rows: median ${median(walls).toFixed(1)} s of ${RUNS} run(s)` + (ROWS === 1_000_000 ? `; target < 240 s: ${median(walls) < 240 ? 'met' : 'NOT met'}` : ''));
rmSync(work, { recursive: true, force: true });
