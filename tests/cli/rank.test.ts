import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync, readFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { Rng } from '../../src/util/rng.ts';

let dir: string;
let csv: string;
beforeAll(() => {
  // a small Friedman #1 table (Friedman 1991, Ann. Statist. 19): y depends on x1..x5 only
  dir = mkdtempSync(join(tmpdir(), 'surmise-rank-'));
  csv = join(dir, 'friedman.csv');
  const rng = new Rng(12);
  const lines = ['x1,x2,x3,x4,x5,x6,x7,y'];
  for (let i = 0; i < 800; i++) {
    const x = Array.from({ length: 7 }, () => rng.next());
    const y = 10 * Math.sin(Math.PI * x[0]! * x[1]!) + 20 * (x[2]! - 0.5) ** 2 + 10 * x[3]! + 5 * x[4]! + rng.normal();
    lines.push([...x.map((v) => v.toFixed(6)), y.toFixed(6)].join(','));
  }
  writeFileSync(csv, lines.join('\n') + '\n');
});

const FAST = ['--workers', '0', '--hidden', '16,16', '--epochs', '15', '--seeds', '2', '--method', 'saliency,permutation'];

describe('surmise rank', () => {
  it('--json prints one object with the documented fields', async () => {
    const io = memoryIO(dir);
    const code = await runCli(['rank', 'friedman.csv', '--target', 'y', '--json', ...FAST], io);
    expect(code, io.err).toBe(0);
    const r = JSON.parse(io.out);
    expect(r.target).toBe('y');
    expect(r.task).toBe('regression');
    expect(r.model.metric).toBe('r2');
    expect(typeof r.model.score).toBe('number');
    expect(typeof r.model.baselines.constant.score).toBe('number');
    expect(typeof r.model.baselines.ridge.score).toBe('number');
    // second figure, RMSE, for the network and both baselines. On the same held-out rows
    // R² = 1 − SSE/SST with one SST, so (1 − R²_a)/(1 − R²_b) = RMSE_a²/RMSE_b² exactly (definitions of R² and RMSE)
    expect(r.model.secondary.metric).toBe('rmse');
    for (const b of [r.model.baselines.ridge, r.model.baselines.constant]) {
      expect(b.secondary.metric).toBe('rmse');
      b.secondary.perRepeat.forEach((rmseB: number, k: number) => {
        const rmseN = r.model.secondary.perRepeat[k];
        expect((1 - r.model.perRepeat[k]) / (1 - b.perRepeat[k])).toBeCloseTo((rmseN / rmseB) ** 2, 8);
      });
    }
    expect(r.ranking).toHaveLength(7);
    for (const e of r.ranking) expect(Object.keys(e).sort()).toEqual(['aboveNoise', 'feature', 'high', 'low', 'noiseReference', 'score']);
    // the noise level: six probes (default), their reference on every entry, probes never ranked
    expect(r.noise.probes).toHaveLength(6);
    for (const e of r.ranking) expect(e.noiseReference).toBe(r.noise.reference);
    expect(r.ranking.some((e: { feature: string }) => e.feature.startsWith('probe'))).toBe(false);
    // sorted best first
    for (let i = 1; i < r.ranking.length; i++) expect(r.ranking[i - 1].score).toBeGreaterThanOrEqual(r.ranking[i].score);
    expect(Object.keys(r.methods).sort()).toEqual(['permutation', 'saliency']);
    expect(r.rankingMethod).toBe('consensus');
    expect(r.rows.inputRows).toBe(800);
    expect(r.seeds).toEqual([1, 2]);
    // which engine ran is said: auto picks native when it loads (SURMISE_ENGINE may force one)
    expect(r.model.engine).toBe(process.env.SURMISE_ENGINE === 'tfjs' ? 'tfjs' : 'native');
    // x6, x7 are inert in Friedman #1: both rank below x4 (largest total effect, fixture attribution-benchmarks.json)
    const pos = (f: string) => r.ranking.findIndex((e: { feature: string }) => e.feature === f);
    expect(pos('x6')).toBeGreaterThan(pos('x4'));
    expect(pos('x7')).toBeGreaterThan(pos('x4'));
    // progress went to stderr as plain lines (not a TTY), stdout is the JSON alone
    expect(io.out.trim().split('\n')).toHaveLength(1);
  }, 120_000);

  it('text report: skill beside baselines, row report, aligned ranking with bars', async () => {
    const io = memoryIO(dir);
    const code = await runCli(['rank', 'friedman.csv', '--target', 'y', '--no-progress', ...FAST, '--seeds', '1'], io);
    expect(code, io.err).toBe(0);
    expect(io.err).toBe('');
    expect(io.out).toMatch(/ridge baseline +-?\d\.\d{3}/);
    expect(io.out).toMatch(/constant baseline +-?\d\.\d{3}/);
    expect(io.out).toMatch(/rows: kept 800 of 800 rows; nothing dropped/);
    expect(io.out).toMatch(/network 16×16 \((native|tfjs) engine\)/);
    expect(io.out).toMatch(/ {4}1 {2}x\d +0\.\d{3} {2}\[0\.\d{3}, 0\.\d{3}\] +(above|at noise) +█+/);
    expect(io.out).toMatch(/ {2}--- {2}noise level 0\.\d{3} \(probes' upper reference\) -+\n/);
    expect(io.out).toMatch(/noise level: 3 permuted copies \(of x\d, x\d, x\d\) and 3 Gaussian columns trained and attributed in every repeat/);
  }, 120_000);

  it('a bad target exits 2 with the table layer’s message', async () => {
    const io = memoryIO(dir);
    const code = await runCli(['rank', 'friedman.csv', '--target', 'yy', ...FAST], io);
    expect(code).toBe(2);
    expect(io.err).toMatch(/^surmise: .*'yy'.*did you mean 'y'\?.*\[dataset\.unknownColumn\]\n$/);
    expect(io.err.split('\n')).toHaveLength(2); // one line, no stack trace
  });

  it('bad options exit 2 naming the option', async () => {
    const cases: Array<[string[], RegExp]> = [
      [['--method', 'shapley'], /--method shapley: 'shapley' is not an attribution method/],
      [['--seeds', '0'], /expected --seeds to be an integer ≥ 1, got 0 \[option\.badValue\]/],
      [['--folds', '1'], /--folds to be 0 \(one random split\) or at least 2, got 1/],
      [['--hidden', '16,x'], /expected --hidden \(each layer width\) to be an integer, got 'x'/],
      [['--task', 'regresion'], /--task regresion: expected auto, regression or classification \(did you mean 'regression'\?\)/],
      [['--split', 'kfold:1'], /kfold needs a whole number of folds >= 2/],
      [['--permutation-loss', 'entropy'], /--permutation-loss entropy: expected error or cross-entropy/],
      [['--workers', '-1'], /expected --workers to be an integer ≥ 0, got -1/],
      [['--probes', '51'], /expected --probes to be at most 50 \(its ceiling\), got 51/],
      [['--engine', 'gpu'], /--engine gpu: expected auto, native or tfjs \[option\.badValue\]/],
    ];
    for (const [args, re] of cases) {
      const io = memoryIO(dir);
      expect(await runCli(['rank', 'friedman.csv', '--target', 'y', ...args], io), args.join(' ')).toBe(2);
      expect(io.err, args.join(' ')).toMatch(re);
    }
  });

  it('--out writes rank.json and refuses to overwrite it without --force', async () => {
    const out = join(dir, 'results');
    const io = memoryIO(dir);
    expect(await runCli(['rank', 'friedman.csv', '--target', 'y', '--out', 'results', '--no-progress', ...FAST, '--seeds', '1', '--method', 'saliency'], io), io.err).toBe(0);
    const saved = readFileSync(join(out, 'rank.json'), 'utf8');
    expect(JSON.parse(saved).target).toBe('y');
    const again = memoryIO(dir);
    expect(await runCli(['rank', 'friedman.csv', '--target', 'y', '--out', 'results', ...FAST], again)).toBe(2);
    expect(again.err).toMatch(/results\/rank\.json already exists; pass --force to replace it \[output\.exists\]/);
    expect(readFileSync(join(out, 'rank.json'), 'utf8')).toBe(saved);
    expect(existsSync(join(out, 'rank.json'))).toBe(true);
  }, 120_000);
});
