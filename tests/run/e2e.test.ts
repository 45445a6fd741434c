/**
 * End to end on the bundled demo table of knots (demo-data/knots.csv, computed by surmise itself:
 * see src/demo/knots.ts). Every finding the demo shows is a theorem, so this test doubles as an
 * outside check of the whole pipeline:
 * - Murasugi, Trans. AMS 117 (1965): for a knot Δ(−1) = (−1)^(σ/2)·det, i.e. σ ≡ 0 (mod 4) exactly
 *   when Δ(−1) > 0 (the fit's coefficient must be exactly 1);
 * - Seifert's algorithm (Seifert 1935; Rolfsen, Knots and Links, 5.A): the surface of a closed braid
 *   on n strands with c crossings has 2g = c − n + 1 (the search must find genus_bound = ½ + ½c − ½n),
 *   and |σ| ≤ c − s + 1 (Murasugi 1965: |σ| ≤ 2g) with equality for T(2, 2k+1) (σ = −2k, GLM 1981);
 * - the naive |σ| ≤ c·strands fails along the T(2, q) family: σ(T(2,q)) = −(q − 1) on 2 strands;
 * - the leading quantities have known reasons: σ_ω and σ are one signature function (Levine 1969,
 *   Tristram 1969), sign Δ(−1) fixes σ mod 4 (Murasugi), and |σ| ≤ 2·deg Δ (σ_ω jumps only at roots
 *   of Δ on the unit circle, by at most twice the multiplicity);
 * - decoy_uniform is a seeded uniform draw independent of the knot: it must rank at noise level.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import type { RunResults } from '../../src/run/run.ts';

const knots = new URL('../../demo-data/knots.csv', import.meta.url);
const work = mkdtempSync(join(tmpdir(), 'surmise-e2e-'));
const demoDir = join(work, 'demo');
let results: RunResults;

function readResults(dir: string): RunResults {
  return JSON.parse(readFileSync(join(dir, 'results.json'), 'utf8')) as RunResults;
}

/** Column `name` of the committed table as numbers. */
function column(name: string): number[] {
  const [head, ...lines] = readFileSync(knots, 'utf8').trimEnd().split('\n');
  // the first field may be quoted ("T(2,3)"): drop it before splitting
  const cols = head!.split(',');
  const k = cols.indexOf(name);
  return lines.map((l) => Number(l.replace(/^"[^"]*"/, 'x').split(',')[k]));
}

beforeAll(async () => {
  const io = memoryIO(work);
  const code = await runCli(['demo', '--out', demoDir, '--no-progress'], io);
  if (code !== 0) throw new Error(`demo failed (${code}): ${io.err}`);
  expect(io.out.trim()).toBe(join(demoDir, 'report.html'));
  results = readResults(demoDir);
}, 600_000);

describe('surmise demo on the demo table of knots', () => {
  it('writes the run folder: results.json, report.html, report.md, plots as SVG and PNG', () => {
    for (const f of ['results.json', 'report.html', 'report.md', 'config.yaml', 'plots/attribution-saliency.svg', 'plots/attribution-saliency.png', 'plots/predicted-vs-actual.svg', 'plots/target-vs-top-feature.svg']) {
      expect(existsSync(join(demoDir, f)), f).toBe(true);
    }
    const sha = createHash('sha256').update(readFileSync(knots)).digest('hex');
    expect(results.input.sha256).toBe(sha);
    expect(results.input.rows).toBe(1936);
    expect(results.rank!.task).toBe('classification'); // σ takes 41 even values
    expect(results.dependencies['@tensorflow/tfjs']).toBe('4.22.0');
  });

  it("stores each repeat's fitted standardization (training-row means and sample SDs) with the run", () => {
    const st = results.rank!.repeats[0]!.standardizer;
    const k = st.names.indexOf('crossings');
    expect(k).toBeGreaterThanOrEqual(0);
    // a 70% training sample: its mean and SD land within 5 standard errors of the whole table's
    const c = column('crossings');
    const mean = c.reduce((s, x) => s + x, 0) / c.length;
    const sd = Math.sqrt(c.reduce((s, x) => s + (x - mean) ** 2, 0) / (c.length - 1));
    const se = sd / Math.sqrt(0.7 * c.length);
    expect(Math.abs(st.mean[k]! - mean)).toBeLessThan(5 * se);
    expect(Math.abs(st.std[k]! - sd)).toBeLessThan(0.1 * sd);
  });

  it('the network beats both baselines on held-out rows', () => {
    const m = results.rank!.model;
    expect(m.score).toBeGreaterThan(m.baselines.ridge.score + 0.2);
    expect(m.score).toBeGreaterThan(m.baselines.constant.score + 0.2);
  });

  it('the discovered bound is Seifert\'s |σ| ≤ c − s + 1 with c = 1, attained along T(2, 2k+1) (reference-checks: random braids; Seifert 1935)', () => {
    const d = results.discoveries[0]!;
    const top = d.proposals[0]!;
    expect(top.exponents['crossings - seifert_circles + 1']).toBe(1);
    expect(top.exponents.strands).toBe(0);
    expect(top.constant).toBe(1);
    expect(top.trend.kind).toBe('none');
    // the equality family: torus knots T(2, q) are among the witnesses (|σ| = q − 1 = c − s + 1)
    expect(top.witnesses.length).toBeGreaterThan(0);
    for (const w of top.witnesses) expect(w.ratio).toBe(1);
    expect(top.witnesses.some((w) => /^T\(2,/.test(String(w.labels.name)))).toBe(true);
  });

  it('the leading quantities are those with a theorem behind them; the decoy sits at the bottom', () => {
    const ranking = results.rank!.ranking;
    const order = ranking.map((r) => r.feature);
    for (const f of order.slice(0, 3)) expect(['levine_tristram_1_3', 'alexander_at_minus1', 'alexander_degree']).toContain(f);
    const decoy = ranking.find((r) => r.feature === 'decoy_uniform')!;
    // its interval lies below every interval of the first three
    for (const r of ranking.slice(0, 3)) expect(decoy.high).toBeLessThan(r.low);
    expect(order.indexOf('decoy_uniform')).toBeGreaterThanOrEqual(order.length - 3);
    // the noise line: the seeded decoy is at noise level, the leaders above it
    expect(decoy.aboveNoise).toBe(false);
    for (const r of ranking.slice(0, 3)) expect(r.aboveNoise).toBe(true);
    for (const method of Object.values(results.rank!.methods)) {
      const o = method!.ranking.map((r) => r.feature);
      for (const lead of order.slice(0, 2)) expect(o.indexOf('decoy_uniform')).toBeGreaterThan(o.indexOf(lead));
    }
  });

  it("Murasugi's congruence: Δ(−1) = det·cos(πσ/2) with coefficient exactly 1", () => {
    const fit = results.fits[0]!;
    expect(fit.target).toBe('alexander_at_minus1');
    const t = fit.terms[0]!;
    // an exact identity: the estimate is 1 up to rounding error and the interval shrinks to nothing
    expect(Math.abs(t.coef - 1)).toBeLessThan(1e-12);
    expect(t.high - t.low).toBeLessThan(1e-9);
    expect(fit.r2).toBeGreaterThan(1 - 1e-12);
  });

  it("the search finds Seifert's 2g = c − n + 1 (genus_bound = ½ + ½·crossings − ½·strands) with zero held-out error", () => {
    const s = results.searches[0]!;
    const best = [...s.front].sort((a, b) => a.heldOutRmse - b.heldOutRmse)[0]!;
    expect(new Set(best.terms)).toEqual(new Set(['crossings', 'strands']));
    expect(best.heldOutRmse).toBeLessThan(1e-9);
    expect(best.intercept.coef).toBeCloseTo(0.5, 9);
    const coef = (t: string) => best.coefs[best.terms.indexOf(t)]!;
    expect(coef('crossings')).toBeCloseTo(0.5, 9);
    expect(coef('strands')).toBeCloseTo(-0.5, 9);
  });

  it('|σ| ≤ c − s + 1 with constant exactly 1, attained on T(2, 2k+1); the naive |σ| ≤ c·strands grows along crossings', () => {
    const b = results.bounds[0]!;
    const seifert = b.results.find((r) => r.rhs === 'crossings - seifert_circles + 1')!;
    const naive = b.results.find((r) => r.rhs === 'strands')!;
    expect(seifert.constant).toBe(1);
    expect(seifert.trend.kind).toBe('none');
    for (const w of seifert.witnesses) {
      expect(w.ratio).toBe(1);
      expect(String(w.labels.name)).toMatch(/^T\(2,-?\d+\)$/);
    }
    expect(naive.trend.kind).toBe('up'); // grows towards long diagrams
    // attained by the longest T(2, q) of the table: |σ| = q − 1 = 40 on 2 strands
    expect(naive.constant).toBe(20);
    expect(String(naive.witnesses[0]!.labels.name)).toMatch(/^T\(2,-?41\)$/);
  });

  it('the report leads with the figures that matter: skill, leading quantities, the search\'s formula, the tightest bound', () => {
    const html = readFileSync(join(demoDir, 'report.html'), 'utf8');
    const md = readFileSync(join(demoDir, 'report.md'), 'utf8');
    const head = html.slice(html.indexOf('<section class="headline">'), html.indexOf('</section>'));
    expect(head).toContain('levine_tristram_1_3');
    expect(head).toContain('genus_bound ≈'); // the search's formula, not the fit typed in the configuration
    expect(head).not.toContain('alexander_at_minus1 ≈');
    expect(head).toContain('abs(signature) ≤ 1 * (crossings - seifert_circles + 1)');
    expect(md).toContain('Best formula found by the search: `genus_bound ≈ 0.5 + 0.5*crossings - 0.5*strands`');
    // integer target as classes: the compact confusion table and the partial dependence on the leading quantity
    expect(md).toContain('## Can the target be predicted?');
    expect(md).toContain('| actual | rows | predicted right | share | most common other prediction (rows) |');
    expect(existsSync(join(demoDir, 'plots/dependence.svg'))).toBe(true);
    expect(results.rank!.dependence!.map((d) => d.feature)).toContain(results.rank!.ranking[0]!.feature);
    const right = results.rank!.confusion!.counts.reduce((s, row, i) => s + row[i]!, 0);
    const total = results.rank!.confusion!.counts.flat().reduce((a, b) => a + b, 0);
    expect(total).toBe(results.rank!.repeats[0]!.test);
    expect(md).toContain(`${right.toLocaleString('en')} of ${total.toLocaleString('en')} predicted exactly`);
    // the bound plots: coloured by family, witnesses as diamonds, log axis for crossings
    const bound = readFileSync(join(demoDir, 'plots/bound-1-2.svg'), 'utf8');
    expect(bound).toContain('family');
    expect(bound).toContain('diamonds: witness rows');
    expect(bound).toContain('log axis for crossings');
  });

  it('report.md and results.json agree on every count', () => {
    const md = readFileSync(join(demoDir, 'report.md'), 'utf8');
    const c = (x: number) => x.toLocaleString('en');
    expect(md).toContain(`with ${c(results.input.rows)} rows`);
    expect(md).toContain(`Of ${c(results.rows!.inputRows)} rows read, ${c(results.rows!.keptRows)} were kept`);
    const s = results.searches[0]!;
    expect(md).toContain(`${c(s.nCandidatesTried)} subsets of ${c(s.nCandidateTerms)} candidate terms screened on ${c(s.selectionRows)} selection rows`);
    expect(md).toContain(`scored on ${c(s.heldOutRows)} held-out rows`);
    expect(md).toContain(`n = ${c(results.fits[0]!.n)},`);
    for (const r of results.bounds[0]!.results) for (const st of r.strata) expect(md).toContain(`| ${c(st.n)} |`);
  });

  it('report.md and report.html agree with results.json', () => {
    const md = readFileSync(join(demoDir, 'report.md'), 'utf8');
    const html = readFileSync(join(demoDir, 'report.html'), 'utf8');
    for (const doc of [md, html]) {
      expect(doc).toContain('not a proof');
      expect(doc).toContain('decoy_uniform');
    }
    const top = results.rank!.ranking[0]!.feature;
    expect(md).toContain(`\`${top}\``);
    expect(html).toContain(results.input.sha256);
  });
});

const CHROMIUM = '/usr/bin/chromium';
describe.skipIf(!existsSync(CHROMIUM))('the demo report in Chromium at 390 px and 1280 px', () => {
  it('has no horizontal overflow, readable plot text at 1280 px, and is not blank at either width', async () => {
    const { chromium } = await import('playwright-core');
    const { pathToFileURL } = await import('node:url');
    const { checkWidth } = await import('../report/helpers.ts');
    const context = await chromium.launchPersistentContext(join(work, 'profile'), {
      executablePath: CHROMIUM,
      headless: true,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
    try {
      const page = context.pages()[0] ?? (await context.newPage());
      const requests: string[] = [];
      page.on('request', (r) => void requests.push(r.url()));
      const url = pathToFileURL(join(demoDir, 'report.html')).href;
      for (const width of [390, 1280]) {
        await page.setViewportSize({ width, height: 900 });
        await page.goto(url, { waitUntil: 'load' });
        await checkWidth(page, width, expect);
        // every number cell keeps its number on one line: its text is no taller than one line
        const wrapped = await page.evaluate(() =>
          Array.from(document.querySelectorAll('td.num')).filter((td) => {
            if (td.getClientRects().length === 0) return false;
            const range = document.createRange();
            range.selectNodeContents(td);
            return range.getBoundingClientRect().height > 1.8 * parseFloat(getComputedStyle(td).fontSize);
          }).length,
        );
        expect(wrapped).toBe(0);
      }
      expect(new Set(requests)).toEqual(new Set([url]));
    } finally {
      await context.close();
    }
  }, 120_000);
});

describe('rerun and compare', () => {
  // A smaller analysis so that three runs stay quick: the first 800 rows, one seed, few epochs.
  const lines = readFileSync(knots, 'utf8').trimEnd().split('\n');
  const small = join(work, 'small.csv');
  const config = join(work, 'small.yaml');
  writeFileSync(small, lines.slice(0, 801).join('\n') + '\n');
  writeFileSync(
    config,
    [
      'table: small.csv',
      'target: signature',
      'exclude: [seifert_circles]',
      'network: { hidden: [32, 32], epochs: 6, patience: 3 }',
      'attribution: { methods: [saliency, permutation], seeds: 1 }',
      'fits: [{ target: alexander_at_minus1, terms: [determinant*cos(pi*signature/2)], intercept: false }]',
      'bounds: [{ lhs: abs(signature), rhs: [crossings - seifert_circles + 1, strands], by: crossings, bins: 5 }]',
      'discover: [{ lhs: abs(signature), from: [crossings - seifert_circles + 1, strands], proposals: 3 }]',
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
    // the config key `discover` searches the rhs; reproducible, and shown in the report. Seifert's bound
    // |σ| ≤ c − s + 1 (reference-checks: random braids) means any proposal with that quantity alone has c* ≤ 1.
    const d = a.discoveries[0]!;
    expect(same.discoveries).toEqual(a.discoveries);
    expect(d.proposals.length).toBeGreaterThan(0);
    for (const p of d.proposals) {
      if (p.exponents['crossings - seifert_circles + 1'] === 1 && p.exponents.strands === 0) expect(p.constant).toBeLessThanOrEqual(1);
    }
    expect(readFileSync(join(runA, 'report.md'), 'utf8')).toContain(`abs(signature) ≤ c * (${d.proposals[0]!.rhs})`);

    // Plant a change: one random knot's signature now breaks Seifert's bound three times over.
    const changed = lines.slice(0, 801);
    const f = changed[700]!.split(',');
    expect(f[1]).toBe('random');
    const b1 = Number(f[4]) - Number(f[6]) + 1; // crossings − seifert_circles + 1
    f[8] = String(3 * b1);
    changed[700] = f.join(',');
    const modified = join(work, 'modified.csv');
    writeFileSync(modified, changed.join('\n') + '\n');
    expect(await runCli(['rerun', runA, '--table', modified, '--out', join(work, 'changed'), '--no-progress'], io), io.err).toBe(0);

    const cmp = memoryIO(work);
    expect(await runCli(['compare', runA, join(work, 'changed'), '--json'], cmp)).toBe(0);
    const c = JSON.parse(cmp.out) as { constants: Array<{ rhs: string; constantA: number; constantB: number; flagged: boolean }>; flags: string[] };
    const seifert = c.constants.find((x) => x.rhs === 'crossings - seifert_circles + 1')!;
    expect(seifert.constantA).toBe(1);
    expect(seifert.flagged).toBe(true);
    expect(seifert.constantB).toBe(3);
    expect(c.flags.some((s) => s.includes('crossings - seifert_circles + 1') && s.includes('grew'))).toBe(true);

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
