/**
 * Row policy, standardization and splits on 10⁶ rows × 20 numeric columns (+ one complex pair).
 * Run: node --import tsx bench/table-rows.ts. Timings on a shared 2-core machine are noisy.
 * Targets are our own (common practice: a step of the pipeline should not dominate the loading time
 * of ~4 s for such a table).
 */
import { Rng } from '../src/util/rng.ts';
import type { Column, Table } from '../src/table/types.ts';
import { buildDataset } from '../src/table/dataset.ts';
import { Standardizer } from '../src/table/standardize.ts';
import { makeSplits, parseSplitSpec } from '../src/table/split.ts';

const n = 1_000_000;
const rng = new Rng(2);
const columns: Column[] = [];
for (let j = 0; j < 20; j++) {
  const v = Float64Array.from({ length: n }, () => rng.normal());
  const missing = new Uint8Array(n);
  for (let k = 0; k < 100; k++) {
    const i = rng.int(n);
    missing[i] = 1;
    v[i] = NaN;
  }
  columns.push({ name: `c${j}`, kind: 'real', values: v, missing });
}
columns.push({ name: 'xings', kind: 'integer', values: Float64Array.from({ length: n }, () => 3 + rng.int(15)), missing: new Uint8Array(n) });
columns.push({
  name: 'czb',
  kind: 'complex',
  re: Float64Array.from({ length: n }, () => rng.normal()),
  im: Float64Array.from({ length: n }, () => rng.normal()),
  missing: new Uint8Array(n),
});
const table: Table = { source: 'bench', nRows: n, columns };

function time<T>(label: string, target: number, f: () => T): T {
  const t0 = performance.now();
  const r = f();
  const s = (performance.now() - t0) / 1000;
  console.log(`${label.padEnd(52)} ${s.toFixed(3)} s  target < ${target} s`);
  return r;
}
const ds = time('buildDataset (dedupe all, 24 features, derive 1)', 2, () =>
  buildDataset(table, { target: 'c0', derive: [{ name: 'slope', source: 're(czb/c1)' }] }),
);
console.log(`  kept ${ds.drops.keptRows} of ${n}; ${ds.drops.invalidRows} invalid, ${ds.drops.duplicates} duplicates`);
time('buildDataset (dedupe none)', 1.5, () => buildDataset(table, { target: 'c0', dedupe: 'none' }));
const split = time('makeSplits random 70/15/15', 0.5, () => makeSplits(ds, table, parseSplitSpec('random'), 1)[0]!);
time('makeSplits where:xings <= 12', 0.5, () => makeSplits(ds, table, parseSplitSpec('where:xings <= 12'), 1));
time('makeSplits kfold:5', 1, () => makeSplits(ds, table, parseSplitSpec('kfold:5'), 1));
const st = time('Standardizer.fit on the training rows', 1, () => new Standardizer().fit(ds.x, ds.featureNames, split.train));
time('Standardizer.transform all rows (row-major)', 1, () => st.transform(ds.x));
