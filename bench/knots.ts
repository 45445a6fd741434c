/**
 * Benchmark: signature, determinant and Alexander polynomial of 10,000 random closed braids on 4
 * strands of length 40 (target: under 30 s on 2 cores). Work is split over worker threads.
 * Run: node --import tsx bench/knots.ts [count] [workers]
 */
import { Worker, isMainThread, parentPort, workerData } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import { Rng, deriveSeed } from '../src/util/rng.ts';
import { randomBraid, computeInvariants, diagramFrom, type Braid } from '../src/knots/index.ts';

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
  const count = Number(process.argv[2] ?? 10000);
  const nWorkers = Number(process.argv[3] ?? Math.min(2, availableParallelism()));
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
}
