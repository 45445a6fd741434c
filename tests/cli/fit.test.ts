import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';

let dir = '';
const nist = JSON.parse(readFileSync(new URL('../fixtures/nist-strd-linear.json', import.meta.url), 'utf8')) as {
  datasets: Record<string, { x: number[]; y: number[]; certified: { beta: string[]; sd: string[]; R2: string } }>;
};

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'surmise-fit-'));
  // Anscombe's quartet, set 1 (Anscombe 1973, The American Statistician 27)
  const x = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5];
  const y = [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68];
  writeFileSync(join(dir, 'anscombe1.csv'), 'name,x,y\n' + x.map((v, i) => `p${i + 1},${v},${y[i]}`).join('\n') + '\n');
  const n1 = nist.datasets.NoInt1!;
  writeFileSync(join(dir, 'noint1.csv'), 'x,y\n' + n1.x.map((v, i) => `${v},${n1.y[i]}`).join('\n') + '\n');
  writeFileSync(join(dir, 'cx.csv'), 'w,y\n1+0.5j,1\n2+0j,2\n3+1j,3\n4-2j,4\n');
});

describe('surmise fit (CLI)', () => {
  it("Anscombe set 1 → --json intercept 3.000091, slope 0.500091, R² 0.666542 (Anscombe 1973; shared reference checks)", async () => {
    const io = memoryIO(dir);
    const code = await runCli(['fit', 'anscombe1.csv', '--target', 'y', '--terms', 'x', '--json'], io);
    expect(code).toBe(0);
    const j = JSON.parse(io.out);
    expect(j.n).toBe(11);
    expect(j.terms.map((t: { term: string }) => t.term)).toEqual(['1', 'x']);
    expect(j.terms[0].coef).toBeCloseTo(3.000091, 5);
    expect(j.terms[1].coef).toBeCloseTo(0.500091, 5);
    expect(j.r2).toBeCloseTo(0.666542, 5);
    for (const key of ['rmse', 'cvRmse', 'adjR2', 'mae', 'maxAbsResidual', 'aic', 'bic', 'condition', 'rank', 'warnings', 'dropped'])
      expect(j).toHaveProperty(key);
    expect(j.terms[1]).toHaveProperty('se');
    expect(j.terms[1].low).toBeLessThan(0.5);
    expect(j.terms[1].high).toBeGreaterThan(0.5);
    // 11 points leave the slope's interval ≈ [0.233, 0.767]: 1/2, 1/3, 2/3, 3/5, … all lie inside, so none is singled out (fraction rule)
    expect(j.terms[1].rational).toBeNull();
    expect(j.terms[1].fraction.status).toBe('several');
    expect(j.terms[1].fraction.text).toMatch(/^several simple fractions \(/);
    // one term: the orthogonal slope is offered beside the ordinary one, and is steeper (|b_TLS| ≥ |b_OLS|, Van Huffel & Vandewalle 1991)
    expect(Math.abs(j.orthogonal.slope)).toBeGreaterThan(Math.abs(j.terms[1].coef));
    // the largest residual is Anscombe's point (13, 7.58), residual −1.92 (from memory; recomputed here)
    expect(j.maxAbsResidualRow.labels.name).toBe('p3');
  });
  it('human output is an aligned table with the rational column', async () => {
    const io = memoryIO(dir);
    expect(await runCli(['fit', 'anscombe1.csv', '--target', 'y', '--terms', 'x'], io)).toBe(0);
    expect(io.out).toMatch(/^term\s+estimate\s+std\. error\s+95% interval\s+simple fraction \(denominator ≤ 12\)$/m);
    expect(io.out).toMatch(/^x\s+0\.50009091\s+0\.1179\s+\[/m);
    expect(io.out).toMatch(/max \|residual\|\s+1\.92127 at data row 3 \(line 4\) name=p3/);
  });
  it('--no-intercept on NIST NoInt1 gives the certified coefficient 2.07438016528926 and uncentred R² 0.999365492298663 (NIST StRD)', async () => {
    const io = memoryIO(dir);
    expect(await runCli(['fit', 'noint1.csv', '--target', 'y', '--terms', 'x', '--no-intercept', '--json'], io)).toBe(0);
    const j = JSON.parse(io.out);
    expect(j.terms).toHaveLength(1);
    expect(j.terms[0].coef).toBeCloseTo(2.07438016528926, 12);
    expect(j.terms[0].se).toBeCloseTo(0.0165289256198347, 13);
    expect(j.r2).toBeCloseTo(0.999365492298663, 12);
  });
  it('a bad expression exits 2 with a caret under the place', async () => {
    const io = memoryIO(dir);
    expect(await runCli(['fit', 'anscombe1.csv', '--target', 'y', '--terms', 'x; x +* 2'], io)).toBe(2);
    expect(io.err).toContain('x +* 2\n');
    expect(io.err).toMatch(/\n {2}x \+\* 2\n {2} {3}\^/);
    expect(io.err).toMatch(/\[expr\.parse\]/);
    expect(io.out).toBe('');
  });
  it('an unknown column exits 2 naming it with a suggestion', async () => {
    const io = memoryIO(dir);
    expect(await runCli(['fit', 'anscombe1.csv', '--target', 'y', '--terms', 'xx'], io)).toBe(2);
    expect(io.err).toMatch(/unknown column 'xx'.*did you mean 'x'/);
  });
  it('a complex-valued term exits 2 asking for re()/im()/abs()', async () => {
    const io = memoryIO(dir);
    expect(await runCli(['fit', 'cx.csv', '--target', 'y', '--terms', 'w'], io)).toBe(2);
    expect(io.err).toMatch(/complex-valued.*re\(w\), im\(w\) or abs\(w\).*\[relate\.complexTerm\]/s);
  });
  it('bad options exit 2 naming the option', async () => {
    const io = memoryIO(dir);
    expect(await runCli(['fit', 'anscombe1.csv', '--target', 'y', '--terms', 'x', '--folds', '1'], io)).toBe(2);
    expect(io.err).toMatch(/--folds to be an integer ≥ 2, got 1 \[option\.badValue\]/);
    const io2 = memoryIO(dir);
    expect(await runCli(['fit', 'anscombe1.csv', '--target', 'y', '--terms', 'x;;x'], io2)).toBe(2);
    expect(io2.err).toMatch(/--terms: term 2 is empty/);
    const io3 = memoryIO(dir);
    expect(await runCli(['fit', 'anscombe1.csv', '--target', 'y', '--terms', 'x', '--split', 'kfold:3'], io3)).toBe(2);
    expect(io3.err).toMatch(/--split kfold:3: a k-fold split is not one fitting part and one held-out part; use --folds 3/);
    const io4 = memoryIO(dir);
    expect(await runCli(['fit', 'anscombe1.csv', '--target', 'y', '--terms', 'x', '--split', 'random:0.5,0.6,0.1'], io4)).toBe(2);
    expect(io4.err).toMatch(/\[split\.badSpec\]/);
  });
  it('--split reports a held-out RMSE and --derive adds a column', async () => {
    const io = memoryIO(dir);
    const code = await runCli(['fit', 'anscombe1.csv', '--target', 'y', '--terms', 'u', '--derive', 'u=x/2', '--split', 'where:x <= 11', '--folds', '2', '--json'], io);
    expect(code).toBe(0);
    const j = JSON.parse(io.out);
    expect(j.n).toBe(8); // x ∈ {10, 8, 9, 11, 6, 4, 7, 5}
    expect(j.heldOut.n).toBe(3); // x ∈ {13, 14, 12}
    expect(j.split).toMatch(/fit where x <= 11 \(8 rows\), held out where not \(3 rows\)/);
    expect(j.terms[1].term).toBe('u');
  });
});
