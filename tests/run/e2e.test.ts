/**
 * End to end on the demo census: the documented random model (src/demo/census.ts) plants
 *   slope = re(lon/mer) = 2·sig + e,  |e| ≤ 0.1·vol/inj,
 * and a twisted sub-family where inj → 0. The run must find what was planted. The model is ours
 * (invented data), so these checks test recovery of a known answer, not outside facts; the outside
 * checks of each stage live in that stage's tests.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import type { RunResults } from '../../src/run/run.ts';
import { PLANTED_BOUND_CONSTANT, PLANTED_SLOPE_COEFFICIENT } from '../../src/demo/census.ts';

const census = new URL('../../demo-data/census.csv', import.meta.url);
const work = mkdtempSync(join(tmpdir(), 'surmise-e2e-'));
const demoDir = join(work, 'demo');
let results: RunResults;

function readResults(dir: string): RunResults {
  return JSON.parse(readFileSync(join(dir, 'results.json'), 'utf8')) as RunResults;
}

beforeAll(async () => {
  const io = memoryIO(work);
  const code = await runCli(['demo', '--out', demoDir, '--no-progress'], io);
  if (code !== 0) throw new Error(`demo failed (${code}): ${io.err}`);
  expect(io.out.trim()).toBe(join(demoDir, 'report.html'));
  results = readResults(demoDir);
}, 600_000);

describe('surmise demo on the demo census', () => {
  it('writes the run folder: results.json, report.html, report.md, plots as SVG and PNG', () => {
    for (const f of ['results.json', 'report.html', 'report.md', 'config.yaml', 'plots/attribution-saliency.svg', 'plots/attribution-saliency.png', 'plots/predicted-vs-actual.svg', 'plots/target-vs-top-feature.svg']) {
      expect(existsSync(join(demoDir, f)), f).toBe(true);
    }
    const sha = createHash('sha256').update(readFileSync(census)).digest('hex');
    expect(results.input.sha256).toBe(sha);
    expect(results.input.rows).toBe(20000);
    expect(results.rows!.duplicates).toBe(10); // the model appends 10 exact duplicates
    expect(results.dependencies['@tensorflow/tfjs']).toBe('4.22.0');
  });

  it('stores each repeat\'s fitted standardization (training-row means and sample SDs) with the run', () => {
    const st = results.rank!.repeats[0]!.standardizer;
    expect(st.names).toContain('vol');
    const k = st.names.indexOf('vol');
    // the census' vol has mean 7.526 and SD 3.011 over all rows (surmise inspect; a 70% training
    // sample must land close: 5 standard errors ≈ 0.13 and 0.1)
    expect(Math.abs(st.mean[k]! - 7.526)).toBeLessThan(0.13);
    expect(Math.abs(st.std[k]! - 3.011)).toBeLessThan(0.1);
  });

  it('the network beats both baselines on held-out rows', () => {
    const m = results.rank!.model;
    expect(m.score).toBeGreaterThan(m.baselines.ridge.score + 0.2);
    expect(m.score).toBeGreaterThan(m.baselines.constant.score + 0.2);
  });

  it("the planted law's features (lon, mer) lead the ranking, above every pure distractor", () => {
    const order = results.rank!.ranking.map((r) => r.feature);
    expect(new Set(order.slice(0, 2))).toEqual(new Set(['lon', 'mer']));
    for (const method of Object.values(results.rank!.methods)) {
      const o = method!.ranking.map((r) => r.feature);
      for (const d of ['d_noise', 'd_unif', 'd_count']) {
        expect(o.indexOf(d)).toBeGreaterThan(o.indexOf('lon'));
        expect(o.indexOf(d)).toBeGreaterThan(o.indexOf('mer'));
      }
    }
  });

  it('fit recovers the planted coefficients within their intervals (slope = 2·sig, intercept 0)', () => {
    const fit = results.fits[0]!;
    const sig = fit.terms.find((t) => t.term === 'sig')!;
    const one = fit.terms.find((t) => t.term === '1')!;
    expect(sig.low).toBeLessThanOrEqual(PLANTED_SLOPE_COEFFICIENT);
    expect(sig.high).toBeGreaterThanOrEqual(PLANTED_SLOPE_COEFFICIENT);
    expect(sig.rational?.text).toBe('2');
    expect(one.low).toBeLessThanOrEqual(0);
    expect(one.high).toBeGreaterThanOrEqual(0);
  });

  it('finds the planted bound constant and flags the failing sub-family', () => {
    const b = results.bounds[0]!;
    const planted = b.results.find((r) => r.rhs === 'vol/inj')!;
    const naive = b.results.find((r) => r.rhs === 'vol')!;
    expect(planted.constant).toBeLessThanOrEqual(PLANTED_BOUND_CONSTANT * (1 + 1e-8));
    expect(planted.constant).toBeGreaterThan(PLANTED_BOUND_CONSTANT * 0.99);
    expect(planted.trend.kind).toBe('none');
    expect(naive.trend.kind).toBe('down'); // increasing towards low inj
    // the naive constant is attained on the twisted family
    expect(naive.witnesses[0]!.labels.family).toBe('twisted');
  });

  it('report.md and report.html agree with results.json', () => {
    const md = readFileSync(join(demoDir, 'report.md'), 'utf8');
    const html = readFileSync(join(demoDir, 'report.html'), 'utf8');
    const planted = results.bounds[0]!.results.find((r) => r.rhs === 'vol/inj')!;
    const shown = Number(planted.constant.toPrecision(4)).toString();
    expect(md).toContain(shown);
    expect(html).toContain(shown);
    expect(md).toContain('not a proof');
    expect(html).toContain('not a proof');
    const top = results.rank!.ranking[0]!.feature;
    expect(md).toContain(`\`${top}\``);
    expect(html).toContain(results.input.sha256);
  });
});

describe('rerun and compare', () => {
  // A smaller analysis so that three runs stay quick: the first 4,000 rows, one seed, few epochs.
  const lines = readFileSync(census, 'utf8').trimEnd().split('\n');
  const small = join(work, 'small.csv');
  const config = join(work, 'small.yaml');
  writeFileSync(small, lines.slice(0, 4001).join('\n') + '\n');
  writeFileSync(
    config,
    [
      'table: small.csv',
      'derive: { slope: re(lon / mer) }',
      'target: sig',
      'exclude: [slope, twist]',
      'network: { hidden: [32, 32], epochs: 6, patience: 3 }',
      'attribution: { methods: [saliency, permutation], seeds: 1 }',
      'fits: [{ target: slope, terms: [sig] }]',
      'bounds: [{ lhs: abs(2*sig - slope), rhs: [vol, vol/inj], by: inj, bins: 5 }]',
      'output: small-run',
    ].join('\n') + '\n',
  );

  it('reproduces identical results for identical input and seed, and compare flags a planted change', async () => {
    const io = memoryIO(work);
    expect(await runCli(['run', config, '--no-progress'], io), io.err).toBe(0);
    const runA = join(work, 'small-run');
    expect(await runCli(['rerun', runA, '--table', small, '--out', join(work, 'same'), '--no-progress'], io), io.err).toBe(0);
    const a = readResults(runA);
    const same = readResults(join(work, 'same'));
    expect(same.rank!.ranking).toEqual(a.rank!.ranking);
    expect(same.rank!.model.score).toBe(a.rank!.model.score);
    expect(same.fits).toEqual(a.fits);
    expect(same.bounds).toEqual(a.bounds);

    // Plant a change: one row now breaks the planted bound three times over.
    const changed = lines.slice(0, 4001);
    const f = changed[100]!.split(',');
    const m = /^([-+]?[0-9.e]+)([-+][0-9.e]+)j$/.exec(f[5]!)!;
    const a_ = Number(m[1]);
    const b_ = Number(m[2]);
    const slope = 2 * Number(f[13]) + 0.3 * (Number(f[4]) / Number(f[7]));
    f[6] = String((slope * (a_ * a_ + b_ * b_)) / a_);
    changed[100] = f.join(',');
    const modified = join(work, 'modified.csv');
    writeFileSync(modified, changed.join('\n') + '\n');
    expect(await runCli(['rerun', runA, '--table', modified, '--out', join(work, 'changed'), '--no-progress'], io), io.err).toBe(0);

    const cmp = memoryIO(work);
    expect(await runCli(['compare', runA, join(work, 'changed'), '--json'], cmp)).toBe(0);
    const c = JSON.parse(cmp.out) as { constants: Array<{ rhs: string; constantA: number; constantB: number; flagged: boolean }>; flags: string[] };
    const planted = c.constants.find((x) => x.rhs === 'vol/inj')!;
    expect(planted.flagged).toBe(true);
    expect(planted.constantB).toBeCloseTo(0.3, 6);
    expect(c.flags.some((s) => s.includes('vol/inj') && s.includes('grew'))).toBe(true);

    const same2 = memoryIO(work);
    expect(await runCli(['compare', runA, join(work, 'same')], same2)).toBe(0);
    expect(same2.out).toContain('nothing flagged');
  }, 600_000);

  it('refuses to overwrite an existing run folder without --force, naming it', async () => {
    const io = memoryIO(work);
    const code = await runCli(['run', config, '--out', demoDir, '--no-progress'], io);
    expect(code).toBe(2);
    expect(io.err).toBe(`surmise: ${demoDir} already exists; pass --force to replace it, or choose another --out [output.exists]\n`);
  });
});
