/**
 * Child of bench/run.ts: writes rows `from`..`to` (exclusive) of the large demo-kind table as CSV
 * lines (no header) to a file. Rows below the demo's own count are the demo's rows (same seed);
 * later rows are further random knot braids drawn like the demo's random family.
 *   node --import tsx bench/run-rows.ts FROM TO SEED OUT
 */
import { writeFileSync } from 'node:fs';
import { demoDiagrams, demoRow, RANDOM_MAX_LENGTH, RANDOM_STRANDS } from '../src/demo/knots.ts';
import { randomKnotBraid } from '../src/knots/index.ts';
import { Rng, deriveSeed } from '../src/util/rng.ts';

const [from, to, seed] = process.argv.slice(2, 5).map(Number) as [number, number, number];
const out = process.argv[5]!;
const demo = demoDiagrams(seed);
const lines: string[] = [];
for (let k = from; k < to; k++) {
  const r = new Rng(deriveSeed(seed, 'bench-run-row', k)); // one stream per row: any split of rows gives the same table
  const decoy = r.next();
  if (k < demo.length) {
    lines.push(demoRow(demo[k]!, decoy));
    continue;
  }
  const n = RANDOM_STRANDS[r.int(RANDOM_STRANDS.length)]!;
  const length = n + 2 + r.int(RANDOM_MAX_LENGTH - n - 1);
  lines.push(demoRow({ name: `b${k}`, family: 'random', braid: randomKnotBraid(r, n, length) }, decoy));
}
writeFileSync(out, lines.join('\n') + (lines.length ? '\n' : ''));
