/**
 * Loading benchmark: a 1,000,000-row x 20-column numeric CSV (generated once in the system's temp
 * folder and reused) read with readTable. Prints rows/s, seconds and peak RSS beside the goals
 * (<= 4 s, <= 1.5 GB). With --danfo, also times danfo's readCSV on the first 200,000 rows.
 * Run: node --import tsx bench/load.ts [--runs N] [--danfo]
 */
import { closeSync, existsSync, openSync, renameSync, statSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readTable } from '../src/table/read.ts';
import { Rng } from '../src/util/rng.ts';

const ROWS = 1_000_000;
const COLS = 20;
const file = join(tmpdir(), `surmise-bench-${ROWS}x${COLS}.csv`);

function generate(path: string, rows: number): void {
  const rng = new Rng(20240607);
  const tmp = `${path}.${process.pid}.part`;
  const fd = openSync(tmp, 'w');
  writeSync(fd, Array.from({ length: COLS }, (_, j) => `x${j + 1}`).join(',') + '\n');
  let buf: string[] = [];
  for (let i = 0; i < rows; i++) {
    const cells = new Array<string>(COLS);
    for (let j = 0; j < COLS; j++) cells[j] = j % 5 === 0 ? String(rng.int(1000)) : String(rng.normal() * 10 ** (j % 4));
    buf.push(cells.join(','));
    if (buf.length === 10000) {
      writeSync(fd, buf.join('\n') + '\n');
      buf = [];
    }
  }
  if (buf.length) writeSync(fd, buf.join('\n') + '\n');
  closeSync(fd);
  renameSync(tmp, path);
}

if (!existsSync(file)) {
  const t0 = performance.now();
  generate(file, ROWS);
  console.log(`generated ${file} in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
}
const mb = statSync(file).size / 2 ** 20;
const runsAt = process.argv.indexOf('--runs');
const runs = runsAt > 0 ? Math.max(1, Number(process.argv[runsAt + 1]) || 1) : 1;
console.log(`file: ${ROWS} rows x ${COLS} columns, ${mb.toFixed(0)} MB`);
for (let run = 1; run <= runs; run++) {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  let t = await readTable(file);
  const sec = (performance.now() - t0) / 1000;
  const cu = process.cpuUsage(c0);
  const cpuSec = (cu.user + cu.system) / 1e6;
  const [load1] = (await import('node:os')).loadavg();
  const rssGB = process.resourceUsage().maxRSS / 2 ** 20; // maxRSS is in kilobytes
  if (runs > 1) console.log(`run ${run} of ${runs}`);
  console.log(`readTable: ${t.nRows} rows, kinds ${[...new Set(t.columns.map((c) => c.kind))].join('/')}`);
  console.log(`  seconds     ${sec.toFixed(2)}  (goal <= 4)  ${sec <= 4 ? 'ok' : 'OVER'}`);
  console.log(`  CPU seconds ${cpuSec.toFixed(2)}  (user + system, whole process; on a shared machine wall time also counts waiting for a core)`);
  console.log(`  rows/s      ${Math.round(t.nRows / sec).toLocaleString('en-US')}`);
  console.log(`  load average ${load1!.toFixed(1)} (1 min) on ${(await import('node:os')).cpus().length} cores`);
  console.log(`  peak RSS GB ${rssGB.toFixed(2)}  (goal <= 1.5)  ${rssGB <= 1.5 ? 'ok' : 'OVER'}${run > 1 ? ' (peak over all runs so far)' : ''}`);
  t = null as unknown as typeof t;
}

if (process.argv.includes('--danfo')) {
  const small = join(tmpdir(), `surmise-bench-200000x${COLS}.csv`);
  if (!existsSync(small)) generate(small, 200_000);
  const t1 = performance.now();
  const dfd = await import('danfojs-node');
  const tImport = (performance.now() - t1) / 1000;
  const t2 = performance.now();
  const df = await dfd.readCSV(small);
  const tRead = (performance.now() - t2) / 1000;
  const t3 = performance.now();
  await readTable(small);
  const tOurs = (performance.now() - t3) / 1000;
  console.log(`danfo (200,000 rows x ${COLS}): import ${tImport.toFixed(2)} s, readCSV ${tRead.toFixed(2)} s (${df.shape.join('x')}); readTable ${tOurs.toFixed(2)} s`);
  console.log(`  peak RSS GB after danfo ${(process.resourceUsage().maxRSS / 2 ** 20).toFixed(2)}`);
}
