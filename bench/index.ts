/**
 * `npm run bench`: every benchmark script, one child process each (so each peak RSS is its own),
 * in pipeline order. Each script prints its figures beside its targets.
 *   npm run bench                 all of them
 *   npm run bench -- load learn   only these (names as in bench/<name>.ts)
 *   npm run bench -- --quick      pass --quick to the scripts that have a smaller variant
 * Benchmarks are never tests: a slow shared machine cannot fail the build.
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const ALL = ['load', 'table-expr', 'table-rows', 'learn', 'attribute', 'relate', 'search', 'bound', 'knots', 'hyperbolic', 'maxcusp', 'report'];
const args = process.argv.slice(2);
const flags = args.filter((a) => a.startsWith('--'));
const chosen = args.filter((a) => !a.startsWith('--'));
const unknown = chosen.filter((c) => !ALL.includes(c));
if (unknown.length) {
  process.stderr.write(`unknown benchmark(s): ${unknown.join(', ')}; choose from ${ALL.join(', ')}\n`);
  process.exit(2);
}
const names = chosen.length ? chosen : ALL;
let failed = 0;
for (const name of names) {
  const script = fileURLToPath(new URL(`./${name}.ts`, import.meta.url));
  process.stdout.write(`\n=== bench/${name}.ts ${flags.join(' ')} (load average ${(await import('node:os')).loadavg().map((x) => x.toFixed(1)).join(' ')}) ===\n`);
  const r = spawnSync(process.execPath, ['--import', 'tsx', script, ...flags], { stdio: 'inherit' });
  if (r.status !== 0) {
    failed++;
    process.stdout.write(`bench/${name}.ts exited with ${r.status ?? r.signal}\n`);
  }
}
process.exit(failed ? 1 : 0);
