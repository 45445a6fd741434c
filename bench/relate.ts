/**
 * Benchmarks of the relate stage; each figure is printed beside its target.
 * Run: node --import tsx bench/relate.ts
 */
import { performance } from 'node:perf_hooks';
import { lstsq } from '../src/relate/lstsq.ts';
import { fitRelation } from '../src/relate/fit.ts';
import { searchRelations } from '../src/relate/search.ts';
import { Rng } from '../src/util/rng.ts';
import type { Table } from '../src/table/types.ts';

function realTable(cols: Record<string, Float64Array>): Table {
  const entries = Object.entries(cols);
  const n = entries[0]![1].length;
  return {
    source: '(bench)',
    nRows: n,
    columns: entries.map(([name, values]) => ({ name, kind: 'real' as const, values, missing: new Uint8Array(n) })),
  };
}

let cpu0 = process.cpuUsage();
function start(): number {
  cpu0 = process.cpuUsage();
  return performance.now();
}
/** Wall-clock seconds against the target, and the process's CPU seconds (the machine may be shared). */
function line(what: string, seconds: number, target: number): void {
  const c = process.cpuUsage(cpu0);
  const cpu = (c.user + c.system) / 1e6;
  console.log(`${what.padEnd(68)} ${seconds.toFixed(2).padStart(6)} s wall (${cpu.toFixed(2)} s CPU)   target < ${target} s   ${seconds < target ? 'ok' : 'OVER'}`);
}

// 1. fit with 5 terms on 1,000,000 rows
{
  const n = 1_000_000;
  const rng = new Rng(1);
  const cols: Record<string, Float64Array> = {};
  for (const c of ['a', 'b', 'c', 'd', 'g']) cols[c] = Float64Array.from({ length: n }, () => rng.uniform(0.5, 2));
  cols.y = Float64Array.from({ length: n }, (_, i) => 1 + cols.a![i]! - 2 * cols.b![i]! + 0.5 * cols.c![i]! * cols.d![i]! + 0.1 * rng.normal());
  const terms = [cols.a!, cols.b!, cols.c!, cols.d!, cols.g!];
  for (const run of ['first run', 'second run']) {
    let t0 = start();
    lstsq(terms, cols.y!);
    line(`lstsq, 5 terms + intercept, 1,000,000 rows (${run})`, (performance.now() - t0) / 1000, 2);
    const table = realTable(cols);
    t0 = start();
    const r = fitRelation(table, { target: 'y', terms: ['a', 'b', 'c*d', 'g^2', 'log(a)'] });
    line(`fitRelation, 5 expression terms, 1,000,000 rows, 5-fold CV (${run})`, (performance.now() - t0) / 1000, 2);
    if (run === 'second run') console.log(`   (R² ${r.r2.toFixed(6)}, CV RMSE ${r.cvRmse.toFixed(5)})`);
  }
}

// 2. search over 3 features, powers −3..3, up to 2 terms, 100,000 rows
{
  const n = 100_000;
  const rng = new Rng(2);
  const x = Float64Array.from({ length: n }, () => rng.uniform(0.5, 2));
  const p = Float64Array.from({ length: n }, () => rng.uniform(-1, 1));
  const q = Float64Array.from({ length: n }, () => rng.uniform(-1, 1));
  const y = Float64Array.from(x, (v, i) => 3 * v * v - 2 * p[i]! * q[i]! + 0.05 * rng.normal());
  const t0 = start();
  const r = searchRelations(realTable({ x, p, q, y }), { target: 'y', from: ['x', 'p', 'q'], maxTerms: 2, powers: [-3, 3], seed: 1 });
  line('searchRelations, 3 features, powers -3..3, ≤ 2 terms, 100,000 rows', (performance.now() - t0) / 1000, 30);
  console.log(`   (${r.mode}: ${r.nCandidateTerms} terms, ${r.nCandidatesTried} subsets; best: ${r.candidates[0]!.roundedFormula})`);
}
