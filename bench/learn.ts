/**
 * Learning benchmark: the network on both engines (native, tfjs) and, when `python3` with `torch`
 * imports, the same network in PyTorch (the peer a user would otherwise run), in one process
 * order and one sitting; every figure is the median of --runs runs (default 3), engines
 * interleaved within each run, with the ratio to the peer.
 *   npm run bench -- learn [--quick] [--json] [--runs N]
 * --json prints one line per figure: {"figure", "engine", "value", "unit", "peer"}.
 * Figures (network 16→H→H→H→1, ReLU, MSE, Adam, batch 256, float32):
 *   train-h300, train-h64   samples/s of a training epoch (the second one: set-up excluded)
 *   gradients-100k          seconds for input gradients of 100,000 rows, H = 300
 *   startup                 seconds: `surmise --version`, `--help`, `inspect` of a 200-row table
 * Targets (ratios to the peer): train-h300 ≥ 1.3, train-h64 ≥ 1.5, gradients ≥ 1.0; startup
 * --version and --help < 0.3 s, inspect < 0.6 s. PyTorch is looked for as SURMISE_PYTHON, then
 * python3, then the system's /usr/bin/python3; its fast BLAS needs
 * LD_LIBRARY_PATH=/usr/lib/x86_64-linux-gnu/openblas-openmp (set here when that folder exists);
 * its OpenMP threads are told not to spin (below).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadEngine, trainNetwork, type EngineName, type TrainData } from '../src/learn/index.ts';
import { Rng } from '../src/util/rng.ts';

const argv = process.argv.slice(2);
const quick = argv.includes('--quick');
const json = argv.includes('--json');
const runsAt = argv.indexOf('--runs');
const RUNS = runsAt >= 0 ? Math.max(1, Math.min(20, Number(argv[runsAt + 1]) || 3)) : 3;
const P = 16;
const THREADS = os.availableParallelism();
const ROWS = { h300: quick ? 8_000 : 20_000, h64: quick ? 30_000 : 100_000, grad: 100_000 };

function table(n: number, seed: number): TrainData {
  const r = new Rng(seed);
  const x = new Float64Array(n * P);
  for (let k = 0; k < x.length; k++) x[k] = r.normal();
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) y[i] = Math.sin(x[i * P]!) + x[i * P + 1]! * x[i * P + 2]! + 0.1 * r.normal();
  return { x, y, n, p: P };
}

const median = (v: number[]) => {
  const s = [...v].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
};
const load = () => os.loadavg().map((v) => v.toFixed(1)).join(' ');

// ---- the peer: PyTorch in a child process -------------------------------------------------
const BLAS = '/usr/lib/x86_64-linux-gnu/openblas-openmp';
// OpenMP threads sleep when idle (OMP_WAIT_POLICY=PASSIVE), as the native engine's do: on a shared
// machine the default spinning made the peer 20× slower (one epoch at H = 300: 50.7 s against
// 2.5 s, load average 20), which would flatter every ratio
const pyEnv = {
  ...process.env,
  OMP_WAIT_POLICY: process.env.OMP_WAIT_POLICY ?? 'PASSIVE',
  ...(existsSync(BLAS) ? { LD_LIBRARY_PATH: [BLAS, process.env.LD_LIBRARY_PATH].filter(Boolean).join(':') } : {}),
};
const PY_SCRIPT = fileURLToPath(new URL('./learn_torch.py', import.meta.url));
const python = [process.env.SURMISE_PYTHON, 'python3', '/usr/bin/python3'].find(
  (py) => py && spawnSync(py, ['-c', 'import torch'], { env: pyEnv, stdio: 'ignore' }).status === 0,
);
function torch(what: 'train' | 'gradients', hidden: number, rows: number): Record<string, number> {
  const r = spawnSync(python!, [PY_SCRIPT, JSON.stringify({ what, hidden, rows, p: P, threads: THREADS })], { env: pyEnv, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`PyTorch peer failed: ${r.stderr}`);
  return JSON.parse(r.stdout) as Record<string, number>;
}

// ---- surmise's engines ----------------------------------------------------------------------
const engines: EngineName[] = [];
for (const e of ['native', 'tfjs'] as const) {
  try {
    await loadEngine(e);
    engines.push(e);
  } catch (err) {
    console.error(`engine ${e} unavailable: ${(err as Error).message}`);
  }
}
const val = table(256, 99);

/** Samples per second of the second epoch (session and graph set-up excluded, as for the peer). */
async function trainRate(engine: EngineName, hidden: number, d: TrainData): Promise<number> {
  const stamps: number[] = [];
  const t0 = performance.now();
  const net = await trainNetwork(d, val, { hidden: [hidden, hidden, hidden], batchSize: 256, maxEpochs: 2, patience: 5, seed: 1, engine }, () => stamps.push(performance.now()));
  net.dispose();
  return d.n / ((stamps[1]! - (stamps[0] ?? t0)) / 1000);
}

async function gradientSeconds(engine: EngineName, x: Float64Array): Promise<number> {
  const net = await trainNetwork(table(512, 5), val, { hidden: [300, 300, 300], maxEpochs: 1, seed: 1, engine });
  net.inputGradients(x.subarray(0, 10 * P), 10); // warm-up: the gradient graph is built on first use
  const t = performance.now();
  net.inputGradients(x, x.length / P);
  const s = (performance.now() - t) / 1000;
  net.dispose();
  return s;
}

// ---- start-up of the CLI ------------------------------------------------------------------------
const BIN = fileURLToPath(new URL('../bin/surmise.js', import.meta.url));
const tmp = mkdtempSync(join(os.tmpdir(), 'surmise-bench-'));
const small = join(tmp, 'small.csv');
{
  const r = new Rng(3);
  const lines = ['a,b,c,d,y'];
  for (let i = 0; i < 200; i++) lines.push(Array.from({ length: 5 }, () => r.normal().toFixed(5)).join(','));
  writeFileSync(small, lines.join('\n') + '\n');
}
function wall(args: string[]): number {
  const t = performance.now();
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`surmise ${args.join(' ')} failed: ${r.stderr}`);
  return (performance.now() - t) / 1000;
}

// ---- the runs -----------------------------------------------------------------------------------
type Key = string; // figure|engine
const samples = new Map<Key, number[]>();
const add = (figure: string, engine: string, v: number) => {
  const k = `${figure}|${engine}`;
  samples.set(k, [...(samples.get(k) ?? []), v]);
};
const d300 = table(ROWS.h300, 1);
const d64 = table(ROWS.h64, 2);
const xg = table(ROWS.grad, 3).x as Float64Array;
const loads: string[] = [load()];
console.error(`learn bench: ${RUNS} run(s), ${THREADS} cores, ${engines.join(' + ')}${python ? ' + PyTorch' : ' (PyTorch not importable: no peer)'}; load average ${load()}`);
for (let run = 0; run < RUNS; run++) {
  // rotate the order each run so no engine always goes first
  const order = [...engines, ...(python ? ['torch' as const] : [])];
  for (let k = 0; k < run; k++) order.push(order.shift()!);
  for (const e of order) {
    if (e === 'torch') {
      add('train-h300', e, ROWS.h300 / torch('train', 300, ROWS.h300).epochSeconds!);
      add('train-h64', e, ROWS.h64 / torch('train', 64, ROWS.h64).epochSeconds!);
      add('gradients-100k', e, torch('gradients', 300, ROWS.grad).seconds!);
    } else {
      add('train-h300', e, await trainRate(e, 300, d300));
      add('train-h64', e, await trainRate(e, 64, d64));
      add('gradients-100k', e, await gradientSeconds(e, xg));
    }
  }
  add('startup-version', 'cli', wall(['--version']));
  add('startup-help', 'cli', wall(['--help']));
  add('startup-inspect', 'cli', wall(['inspect', small]));
  loads.push(load());
  console.error(`  run ${run + 1}/${RUNS} done; load average ${load()}`);
}
rmSync(tmp, { recursive: true, force: true });

// ---- report ------------------------------------------------------------------------------------
const FIG: Record<string, { unit: string; higherIsBetter: boolean; target: string }> = {
  'train-h300': { unit: 'samples/s', higherIsBetter: true, target: 'ratio ≥ 1.3' },
  'train-h64': { unit: 'samples/s', higherIsBetter: true, target: 'ratio ≥ 1.5' },
  'gradients-100k': { unit: 's', higherIsBetter: false, target: 'ratio ≥ 1.0' },
  'startup-version': { unit: 's', higherIsBetter: false, target: '< 0.3 s' },
  'startup-help': { unit: 's', higherIsBetter: false, target: '< 0.3 s' },
  'startup-inspect': { unit: 's', higherIsBetter: false, target: '< 0.6 s' },
};
if (!json) console.log(`learn bench, medians of ${RUNS} run(s); load average at the start and after each run: ${loads.join(' | ')}`);
for (const [figure, f] of Object.entries(FIG)) {
  const peerRuns = samples.get(`${figure}|torch`);
  const peer = peerRuns ? median(peerRuns) : null;
  for (const [k, v] of samples) {
    const [fig, engine] = k.split('|') as [string, string];
    if (fig !== figure) continue;
    const value = median(v);
    const isPeer = engine === 'torch';
    const name = figure.startsWith('startup') ? 'startup' : figure;
    if (json) {
      const what = figure.startsWith('startup') ? { what: figure.slice('startup-'.length) } : {};
      console.log(JSON.stringify({ figure: name, ...what, engine, value: Number(value.toPrecision(4)), unit: f.unit, peer: isPeer || peer === null ? null : Number(peer.toPrecision(4)), runs: v.map((x) => Number(x.toPrecision(4))) }));
      continue;
    }
    const ratio = peer !== null && !isPeer ? (f.higherIsBetter ? value / peer : peer / value) : null;
    const shown = f.unit === 's' ? `${value.toFixed(3)} s` : `${Math.round(value).toLocaleString('en')} ${f.unit}`;
    console.log(`${figure.padEnd(16)} ${engine.padEnd(7)} ${shown.padStart(18)}${ratio !== null ? `   ${ratio.toFixed(2)}× the peer` : isPeer ? '   (peer)' : ''}   target ${f.target}   runs ${v.map((x) => x.toPrecision(3)).join(', ')}`);
  }
}
