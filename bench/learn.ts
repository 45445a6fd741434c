/**
 * Learning-stage benchmark: prints each figure beside its target.
 *   node --import tsx bench/learn.ts            (full: about 3–6 minutes on a loaded 2-core machine)
 *   node --import tsx bench/learn.ts --quick    (smaller sizes, same figures scaled)
 *   node --import tsx bench/learn.ts --widths   (only: default widths 64 vs 128 on 20,000 rows to early stop)
 * Network 16→300→300→300→1, ReLU, batch 256, as in the targets.
 */
import { initBackend, trainNetwork, trainMany, fitRidge, type TrainData } from '../src/learn/index.ts';
import { Rng } from '../src/util/rng.ts';
import os from 'node:os';

const quick = process.argv.includes('--quick');
const P = 16;
const NET = { hidden: [300, 300, 300], batchSize: 256, maxEpochs: 1, patience: 0 };

function table(n: number, seed: number): TrainData {
  const r = new Rng(seed);
  const x = new Float64Array(n * P);
  for (let k = 0; k < x.length; k++) x[k] = r.normal();
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) y[i] = Math.sin(x[i * P]!) + x[i * P + 1]! * x[i * P + 2]! + 0.1 * r.normal();
  return { x, y, n, p: P };
}

function line(name: string, value: string, target: string): void {
  console.log(`${name.padEnd(52)} ${value.padStart(14)}   target ${target}`);
}

const rssMB = () => process.resourceUsage().maxRSS / 1024;
/** CPU seconds of this process (all threads): on a shared machine, work per CPU-second is the steadier figure. */
const cpuS = () => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
};
console.log(`learn bench (${quick ? 'quick' : 'full'}); ${os.cpus().length} cores, load average ${os.loadavg().map((v) => v.toFixed(1)).join(' ')} — timings are noisy on a shared machine`);
const val = table(2000, 99);

let lastPerCpu = NaN;
async function samplesPerSecond(d: TrainData): Promise<number> {
  const t = performance.now();
  const c = cpuS();
  await trainNetwork(d, val, NET).then((m) => m.dispose());
  lastPerCpu = d.n / (cpuS() - c);
  return d.n / ((performance.now() - t) / 1000);
}
const perCpu = () => `   (${lastPerCpu.toFixed(0)} per CPU-second)`;

// 0. the default network (early stopping) on 20,000 rows, at widths 64 and 128
if (process.argv.includes('--widths')) {
  await initBackend('wasm');
  const tr = table(20_000, 11);
  const va = table(5_000, 12);
  for (const w of [64, 128]) {
    const t0 = performance.now();
    const c = cpuS();
    const m = await trainNetwork(tr, va, { hidden: [w, w, w], seed: 1 });
    const s = (performance.now() - t0) / 1000;
    line(`hidden [${w},${w},${w}], 20,000 rows to early stop, seconds`, s.toFixed(1), 'well under 60');
    console.log(`   (${(cpuS() - c).toFixed(1)} CPU-seconds, ${m.epochs} epochs, best ${m.bestEpoch}, val loss ${m.history[m.bestEpoch - 1]!.valLoss.toFixed(4)})`);
    m.dispose();
  }
  process.exit(0);
}

// 1. cpu against wasm (short runs, after a warm-up batch)
const small = table(quick ? 1024 : 2048, 1);
await initBackend('cpu');
await trainNetwork(table(256, 2), table(64, 3), NET).then((m) => m.dispose());
const cpuRate = await samplesPerSecond(small);
const cpuPerCpu = lastPerCpu;
await initBackend('wasm');
await trainNetwork(table(256, 2), table(64, 3), NET).then((m) => m.dispose());
const wasmRate = await samplesPerSecond(small);
const wasmPerCpu = lastPerCpu;
line('cpu backend training, samples/s', cpuRate.toFixed(0), '(comparison only)');
line('wasm backend training, samples/s', wasmRate.toFixed(0), '(comparison only)');
console.log(`   per CPU-second: cpu ${cpuPerCpu.toFixed(0)}, wasm ${wasmPerCpu.toFixed(0)}`);

// 2. one core, 200,000 rows, one epoch
const big = table(quick ? 40_000 : 200_000, 4);
const oneCore = await samplesPerSecond(big);
line(`one-core training on ${big.n} rows, samples/s`, oneCore.toFixed(0), '≥ 18,000');
console.log(perCpu());

// 3. aggregate over 2 workers: 4 jobs (seeds) of one epoch each
const jobRows = quick ? 20_000 : 100_000;
const jobData = { ...big, x: big.x.subarray(0, jobRows * P), y: big.y.subarray(0, jobRows), n: jobRows };
const jobs = [1, 2, 3, 4].map((seed) => ({ train: jobData, validation: val, options: { ...NET, seed } }));
let t = performance.now();
let c0 = cpuS();
const firstDone: number[] = [];
const rep = await trainMany(jobs, { workers: 2, onJobDone: () => firstDone.push(performance.now()) });
const wall = (performance.now() - t) / 1000;
line(`2 workers, 4 jobs × ${jobRows} rows, samples/s (wall, incl. start-up)`, ((4 * jobRows) / wall).toFixed(0), '≥ 32,000');
// steady state: the last two jobs ran after both workers were warm
const steady = firstDone.length === 4 ? (2 * jobRows) / ((firstDone[3]! - firstDone[1]!) / 1000) : NaN;
line('2 workers, samples/s after start-up (jobs 3–4)', steady.toFixed(0), '≥ 32,000');
console.log(`   (${((4 * jobRows) / (cpuS() - c0)).toFixed(0)} per CPU-second of the process, start-up included)`);
console.log(`   (ran in: ${rep.ranIn}${rep.fallbackReason ? ', ' + rep.fallbackReason : ''})`);

// 4. input gradients for 100,000 rows
const net = await trainNetwork({ ...big, x: big.x.subarray(0, 5000 * P), y: big.y.subarray(0, 5000), n: 5000 }, val, NET);
const g100 = table(100_000, 5);
net.inputGradients(g100.x.subarray(0, 1000 * P), 1000); // warm-up
t = performance.now();
c0 = cpuS();
net.inputGradients(g100.x, g100.n);
line('input gradients, 100,000 rows, seconds', ((performance.now() - t) / 1000).toFixed(2), '< 4');
console.log(`   (${(cpuS() - c0).toFixed(2)} CPU-seconds)`);
t = performance.now();
c0 = cpuS();
net.predict(g100.x, g100.n);
line('predict, 100,000 rows, seconds', ((performance.now() - t) / 1000).toFixed(2), '(no target)');
console.log(`   (${(cpuS() - c0).toFixed(2)} CPU-seconds)`);

// 5. a 1,000,000-row table: ridge, one training epoch, predictions and gradients over every row
const millionRows = quick ? 200_000 : 1_000_000;
const million = table(millionRows, 6);
t = performance.now();
fitRidge(million.x, million.y, million.n, P, 1);
line(`ridge on ${millionRows} rows × 16, seconds`, ((performance.now() - t) / 1000).toFixed(2), '(no target)');
t = performance.now();
c0 = cpuS();
const netM = await trainNetwork(million, val, NET);
line(`one epoch on ${millionRows} rows, samples/s`, (millionRows / ((performance.now() - t) / 1000)).toFixed(0), '(as one-core)');
console.log(`   (${(millionRows / (cpuS() - c0)).toFixed(0)} per CPU-second)`);
netM.predict(million.x, million.n);
netM.inputGradients(million.x, million.n);
netM.dispose();
net.dispose();
line(`peak RSS with a ${millionRows}-row table, MB`, rssMB().toFixed(0), '< 1,500');
