/**
 * Benchmark of `bound` on 1,000,000 rows (target: under 2 s for one rhs, expressions included).
 * Run: node --import tsx bench/bound.ts   (timings on a shared machine are noisy: the best of 3 is shown)
 */
import { findBound } from '../src/bound/find.ts';
import { boundArrays } from '../src/bound/core.ts';
import type { Table } from '../src/table/types.ts';
import { Rng } from '../src/util/rng.ts';

const N = 1_000_000;
const rng = new Rng(1);
const col = (f: () => number) => Float64Array.from({ length: N }, f);
const k = col(() => 2 * (rng.int(21) - 10));
const b = col(() => rng.uniform(2, 20));
const w = col(() => rng.uniform(0.02, 1));
const pRe = col(() => rng.uniform(0.5, 1.5));
const pIm = col(() => rng.uniform(-1, 1));
const q = Float64Array.from(k, (s, i) => (2 * s + 0.1 * (b[i]! / w[i]!) * (2 * rng.next() - 1) ** 3) * 1.7);
const none = () => new Uint8Array(N);
const table: Table = {
  source: 'bench (in memory)',
  nRows: N,
  columns: [
    { name: 'rec', kind: 'label', values: Array.from({ length: N }, (_, i) => `R${i}`), missing: none() },
    { name: 'k', kind: 'integer', values: k, missing: none() },
    { name: 'b', kind: 'real', values: b, missing: none() },
    { name: 'w', kind: 'real', values: w, missing: none() },
    { name: 'p', kind: 'complex', re: pRe, im: pIm, missing: none() },
    { name: 'q', kind: 'real', values: q, missing: none() },
  ],
};

function best(label: string, target: number, f: () => void): void {
  let t = Infinity;
  for (let k = 0; k < 3; k++) {
    const t0 = performance.now();
    f();
    t = Math.min(t, performance.now() - t0);
  }
  console.log(`${label.padEnd(72)} ${(t / 1000).toFixed(3)} s   (target < ${target} s)`);
}

console.log(`bound on ${N.toLocaleString('en')} rows, best of 3`);
best('findBound, lhs abs(2*k - re(q/p)), rhs b/w, by w', 2, () => {
  findBound(table, { lhs: 'abs(2*k - re(q/p))', rhs: 'b/w', by: 'w' });
});
best('findBound, same lhs, 3 rhs candidates (b/w, b, b/w^2)', 6, () => {
  findBound(table, { lhs: 'abs(2*k - re(q/p))', rhs: ['b/w', 'b', 'b/w^2'], by: 'w' });
});
const ratio = Float64Array.from(b, (v, i) => v / w[i]!);
const rows = Int32Array.from({ length: N }, (_, i) => i);
best('boundArrays (numerical core only: top-5, 4 quantiles, 10 strata, trend)', 1, () => {
  boundArrays(ratio, w, rows, { bins: 10, top: 5, upper: true, byName: 'w' });
});
