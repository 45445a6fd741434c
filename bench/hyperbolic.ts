/**
 * Benchmark: hyperbolic invariants (status, volume, cusp shape).
 *  A. one diagram at a time, up to 50 crossings (target: under 1 s each): the twist family
 *     σ1^(2k+1) σ2 σ1⁻¹ σ2, twist knots as plat PD codes (4..50 crossings) and random 4-strand
 *     knot braids of 30 and 50 letters; PD codes of 5-strand 45-letter knot braids with 0–5 kinks;
 *  B. 1,000 random 20-crossing knots (4-strand braids of length 20) through `invariantsMany`
 *     with 2 worker threads and with 1 (target: under 60 s on 2 cores).
 * Run: npm run bench -- hyperbolic   (node --import tsx bench/hyperbolic.ts [--quick])
 */
import { loadavg } from 'node:os';
import { Rng, deriveSeed } from '../src/util/rng.ts';
import { diagramFrom, randomKnotBraid, type Braid } from '../src/knots/index.ts';
import { hyperbolicInvariants } from '../src/knots/hyperbolic/index.ts';
import { invariantsMany } from '../src/knots/many.ts';
import type { DiagramSource } from '../src/knots/parse.ts';
import { twistKnotPD } from '../src/knots/plat.ts';
import { braidClosurePD } from '../src/knots/braid.ts';
import { addKink, relabelPD } from '../src/knots/generate.ts';
import type { Crossing } from '../src/knots/pd.ts';

const quick = process.argv.includes('--quick');
const median = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
};
const braidCode = (b: Braid): string => `${b.strands}: ${b.word.join(' ')}`;

console.log(`load average ${loadavg().map((x) => x.toFixed(1)).join(' ')}`);
// A
const rngA = new Rng(deriveSeed(1, 'bench', 'hyperbolic', 'single'));
const groups: Array<[string, Braid[]]> = [
  ['twist family, 8..50 crossings', Array.from({ length: 22 }, (_, k) => ({ strands: 3, word: [...Array(2 * k + 5).fill(1), 2, -1, 2] }))],
  ['random 4-strand knot braids, 30 crossings', Array.from({ length: quick ? 5 : 20 }, () => randomKnotBraid(rngA, 4, 30))],
  ['random 4-strand knot braids, 50 crossings', Array.from({ length: quick ? 5 : 20 }, () => randomKnotBraid(rngA, 4, 50))],
];
// PD codes as `knots generate pd --strands 5 --length 45 --kinks 0..5` draws them: closed random knot braids with kinks, relabelled
const rngP = new Rng(deriveSeed(1, 'bench', 'hyperbolic', 'pd'));
const kinked = Array.from({ length: quick ? 5 : 20 }, (_, k) => {
  let pd = braidClosurePD(randomKnotBraid(rngP, 5, 45)).pd;
  for (let j = 0; j < k % 6; j++) pd = addKink(pd, pd[j]![j % 4]!, j);
  return relabelPD(pd, rngP);
});
const plats: Array<[string, Crossing[][]]> = [
  ['twist knots as plat PD codes, 4..50 crossings', Array.from({ length: 47 }, (_, k) => twistKnotPD(k + 2))],
  ['PD codes of 5-strand 45-letter knot braids with 0..5 kinks, 46..50 crossings', kinked],
];
for (const [label, diagrams] of [...groups, ...plats] as Array<[string, Array<Braid | Crossing[]>]>) {
  const times: number[] = [];
  const status = new Map<string, number>();
  for (const b of diagrams) {
    const t0 = performance.now();
    const h = hyperbolicInvariants(diagramFrom(Array.isArray(b) ? { kind: 'pd', pd: b } : { kind: 'braid', braid: b }));
    times.push(performance.now() - t0);
    status.set(h.geometry, (status.get(h.geometry) ?? 0) + 1);
  }
  console.log(
    `A. ${label}: ${diagrams.length} diagrams, median ${median(times).toFixed(0)} ms, max ${Math.max(...times).toFixed(0)} ms [target < 1000 ms each]; ` +
      [...status].map(([k, v]) => `${k} ${v}`).join(', '),
  );
}
// B
const count = quick ? 200 : 1000;
const rngB = new Rng(deriveSeed(1, 'bench', 'hyperbolic', 'batch'));
const sources: DiagramSource[] = Array.from({ length: count }, (_, k) => ({ name: `r${k}`, code: braidCode(randomKnotBraid(rngB, 4, 20)), line: k + 1, column: 1 }));
for (const workers of [2, 1]) {
  const t0 = performance.now();
  const res = await invariantsMany(sources, '(bench)', 'braid', { invariants: ['hyperbolic'] }, { workers });
  const s = (performance.now() - t0) / 1000;
  const status = new Map<string, number>();
  for (const r of res) status.set(r.hyperbolic!.geometry, (status.get(r.hyperbolic!.geometry) ?? 0) + 1);
  console.log(`B. ${count} random 20-crossing knots, ${workers} worker(s): ${s.toFixed(1)} s [target < 60 s for 1,000 on 2 cores]; ` + [...status].map(([k, v]) => `${k} ${v}`).join(', '));
}
console.log(`load average ${loadavg().map((x) => x.toFixed(1)).join(' ')}`);
