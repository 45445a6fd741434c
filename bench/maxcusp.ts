/**
 * Benchmark: cost of the maximal cusp (`maxcusp.ts`) beside the whole hyperbolic row, on random
 * 20-crossing 4-strand knot braids (the batch of bench/hyperbolic.ts part B). For each hyperbolic
 * knot the geometric solution is found again and `maximalCusp` timed alone (mean of 5 calls).
 * Run: npm run bench -- maxcusp   (node --import tsx bench/maxcusp.ts [--quick])
 */
import { loadavg } from 'node:os';
import { randomKnotBraid } from '../src/knots/index.ts';
import { parseDiagram } from '../src/knots/diagram.ts';
import { hyperbolicInvariants } from '../src/knots/hyperbolic/invariants.ts';
import { findGeometricSolution } from '../src/knots/hyperbolic/search.ts';
import { maximalCusp } from '../src/knots/hyperbolic/maxcusp.ts';
import { simplifyBraid } from '../src/knots/hyperbolic/reduce.ts';
import { removeKinks } from '../src/knots/hyperbolic/kinks.ts';
import { braidClosurePD } from '../src/knots/braid.ts';
import { analysePD } from '../src/knots/pd.ts';
import { Rng, deriveSeed } from '../src/util/rng.ts';

const quick = process.argv.includes('--quick');
const count = quick ? 40 : 150;
const median = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
};
const mean = (xs: number[]): number => xs.reduce((a, b) => a + b, 0) / xs.length;
console.log(`load average ${loadavg().map((x) => x.toFixed(1)).join(' ')}`);
const rng = new Rng(deriveSeed(1, 'bench', 'hyperbolic', 'batch'));
const cusp: number[] = [];
const row: number[] = [];
const visited: number[] = [];
let offEdge = 0;
for (let i = 0; i < count; i++) {
  const b = randomKnotBraid(rng, 4, 20);
  const t0 = performance.now();
  const h = hyperbolicInvariants(parseDiagram(`${b.strands}: ${b.word.join(' ')}`));
  const t1 = performance.now();
  if (!h.maximalCusp) continue;
  row.push(t1 - t0);
  const sol = findGeometricSolution(analysePD(removeKinks(braidClosurePD(simplifyBraid(b)).pd).pd), 1);
  if (!('tri' in sol)) continue;
  const t2 = performance.now();
  for (let r = 0; r < 5; r++) maximalCusp(sol.tri, sol.cb, sol, h.cuspShape!);
  cusp.push((performance.now() - t2) / 5);
  visited.push(h.maximalCusp.visited);
  if (!h.maximalCusp.onEdge) offEdge++;
}
console.log(
  `${count} random 20-crossing knots, ${cusp.length} with a maximal cusp: maximal cusp median ${median(cusp).toFixed(2)} ms, mean ${mean(cusp).toFixed(2)} ms, max ${Math.max(...cusp).toFixed(1)} ms; ` +
    `whole row median ${median(row).toFixed(0)} ms, mean ${mean(row).toFixed(0)} ms (share of the mean ${((100 * mean(cusp)) / mean(row)).toFixed(2)} %); ` +
    `tetrahedra visited median ${median(visited)}, max ${Math.max(...visited)}; largest horoball off the edges in ${offEdge}`,
);
console.log(`load average ${loadavg().map((x) => x.toFixed(1)).join(' ')}`);
