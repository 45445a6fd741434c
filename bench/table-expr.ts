/**
 * Expression evaluation speed on 10⁶ rows (target from the design brief: `re(p/q)` of two complex columns well under
 * 0.5 s). Run: node --import tsx bench/table-expr.ts. Timings on a shared machine are noisy.
 */
import { Rng } from '../src/util/rng.ts';
import type { Table } from '../src/table/types.ts';
import { evaluateExpression } from '../src/table/expr/index.ts';

const n = 1_000_000;
const rng = new Rng(1);
const col = (): Float64Array => Float64Array.from({ length: n }, () => rng.uniform(-5, 5));
const table: Table = {
  source: 'bench',
  nRows: n,
  columns: [
    { name: 'p', kind: 'complex', re: col(), im: col(), missing: new Uint8Array(n) },
    { name: 'q', kind: 'complex', re: col(), im: col(), missing: new Uint8Array(n) },
    { name: 'a', kind: 'real', values: col(), missing: new Uint8Array(n) },
    { name: 'b', kind: 'real', values: col(), missing: new Uint8Array(n) },
  ],
};

const cases: Array<[string, number]> = [
  ['re(p/q)', 0.5],
  ['a * b + 2 * a^2 - 1', 0.5],
  ['abs(p)^2 / (1 + a^2)', 0.5],
  ['sqrt(a)', 0.5],
  ['log(abs(a)) <= b', 0.5],
];
for (const [src, target] of cases) {
  evaluateExpression(table, src); // warm-up
  const times: number[] = [];
  for (let k = 0; k < 5; k++) {
    const t0 = performance.now();
    evaluateExpression(table, src);
    times.push((performance.now() - t0) / 1000);
  }
  times.sort((a, b) => a - b);
  console.log(`${src.padEnd(28)} 10^6 rows: median ${times[2]!.toFixed(3)} s (best ${times[0]!.toFixed(3)} s)  target < ${target} s`);
}
