/**
 * Benchmark: signature, determinant and Alexander polynomial of 10,000 random closed braids on 4
 * strands of length 40 (target: under 30 s on 2 cores), split over worker threads; then single long
 * diagrams of 200 and 1,000 crossings (target: 1,000 crossings well under 2 s), as braids and as PD codes
 * (σ and det by Gordon–Litherland), median of 3 runs each.
 * Run: node --import tsx bench/knots.ts [count] [workers]   (--quick: 1,000 short braids)
 */
import { Worker, isMainThread, parentPort, workerData } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import { Rng, deriveSeed } from '../src/util/rng.ts';
import { randomBraid, computeInvariants, diagramFrom, type Braid, type InvariantName } from '../src/knots/index.ts';

const TARGET_S = 30;

function work(braids: Braid[]): { n: number; sigSum: number; detMax: number; knots: number } {
  let sigSum = 0;
  let detMax = 0;
  let knots = 0;
  for (const b of braids) {
    const r = computeInvariants(diagramFrom({ kind: 'braid', braid: b }), { invariants: ['signature', 'determinant', 'alexander', 'components'] });
    sigSum += r.signature!;
    detMax = Math.max(detMax, Number(r.determinant));
    if (r.components === 1) knots++;
  }
  return { n: braids.length, sigSum, detMax, knots };
}

if (!isMainThread) {
  parentPort!.postMessage(work(workerData as Braid[]));
} else {
  const args = process.argv.slice(2).filter((a) => !a.startsWith('--'));
  const count = Number(args[0] ?? (process.argv.includes('--quick') ? 1000 : 10000));
  const nWorkers = Number(args[1] ?? Math.min(2, availableParallelism()));
  const rng = new Rng(deriveSeed(1, 'bench', 'knots'));
  const braids = Array.from({ length: count }, () => randomBraid(rng, 4, 40));
  const t0 = performance.now();
  let result: { n: number; sigSum: number; detMax: number; knots: number };
  if (nWorkers <= 1) result = work(braids);
  else {
    const chunks = Array.from({ length: nWorkers }, (_, w) => braids.filter((_, i) => i % nWorkers === w));
    const parts = await Promise.all(
      chunks.map(
        (chunk) =>
          new Promise<ReturnType<typeof work>>((res, rej) => {
            const w = new Worker(new URL('./knots-worker.mjs', import.meta.url), { workerData: chunk });
            w.once('message', res);
            w.once('error', rej);
          }),
      ),
    );
    result = parts.reduce((a, b) => ({ n: a.n + b.n, sigSum: a.sigSum + b.sigSum, detMax: Math.max(a.detMax, b.detMax), knots: a.knots + b.knots }));
  }
  const s = (performance.now() - t0) / 1000;
  console.log(`knots: ${result.n} braids (4 strands, length 40), ${nWorkers} worker(s): ${s.toFixed(2)} s  [target < ${TARGET_S} s] ${s < TARGET_S ? 'OK' : 'SLOW'}`);
  console.log(`  per diagram: ${((1000 * s) / result.n).toFixed(3)} ms; knots among them: ${result.knots}; max determinant ${result.detMax}; mean signature ${(result.sigSum / result.n).toFixed(3)}`);

  // long diagrams, one at a time (the main thread)
  const median = (f: () => void): number => {
    const ts: number[] = [];
    for (let k = 0; k < 3; k++) {
      const t = performance.now();
      f();
      ts.push(performance.now() - t);
    }
    return ts.sort((a, b) => a - b)[1]! / 1000;
  };
  const all = { invariants: ['signature', 'determinant', 'alexander'] as InvariantName[] };
  for (const n of [200, 1000]) {
    const families: Array<[string, Braid]> = [
      ['random 3-braid', randomBraid(new Rng(deriveSeed(2, 'bench', 'knots', n)), 3, n)],
      ['(σ1σ2⁻¹)^' + n / 2, { strands: 3, word: Array.from({ length: n }, (_, k) => (k % 2 ? -2 : 1)) }],
      ['random 5-braid', randomBraid(new Rng(deriveSeed(3, 'bench', 'knots', n)), 5, n)],
    ];
    for (const [name, b] of families) {
      const s1 = median(() => computeInvariants(diagramFrom({ kind: 'braid', braid: b }), all));
      const pd = diagramFrom({ kind: 'braid', braid: b });
      const s2 = median(() => computeInvariants({ ...pd, braid: undefined, kind: 'pd' }, { invariants: ['signature', 'determinant'] }));
      console.log(`knots: ${n} crossings, ${name}: σ, det, Δ from the braid ${s1.toFixed(3)} s; σ, det from the PD code ${s2.toFixed(3)} s${n === 1000 ? `  [target < 2 s] ${s1 < 2 ? 'OK' : 'SLOW'}` : ''}`);
    }
  }
}
