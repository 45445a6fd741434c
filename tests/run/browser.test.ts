/**
 * A real `surmise run` on a table with a hostile column name, its report.html opened in headless
 * Chromium (Debian's package, driven by playwright-core). Chromium's HTML parser is the outside
 * reference for "self-contained, shows the user's strings as text, runs nothing". The report
 * stage's own browser test (tests/report/browser.test.ts) covers a constructed input; this one
 * covers what the whole pipeline writes. Skipped only when /usr/bin/chromium is absent.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { Rng } from '../../src/util/rng.ts';
import { decodePng, inkStats } from '../report/helpers.ts';

const CHROMIUM = '/usr/bin/chromium';
const EVIL = '<img src=x onerror=alert(1)>';

describe.skipIf(!existsSync(CHROMIUM))('report.html of a real run, in a real browser', () => {
  const dir = mkdtempSync(join(tmpdir(), 'surmise-run-browser-'));
  let context: BrowserContext;
  let page: Page;
  const consoleErrors: string[] = [];
  const requests: string[] = [];
  const dialogs: string[] = [];

  beforeAll(async () => {
    // y = 2x + 0.5·w + noise, with w in the hostile column (quoted in the CSV header per RFC 4180)
    const rng = new Rng(5);
    const lines = [`id,x,"${EVIL}",y`];
    for (let i = 0; i < 600; i++) {
      const x = rng.uniform(1, 3);
      const w = rng.uniform(1, 2);
      lines.push(`r${i},${x},${w},${2 * x + 0.5 * w + 0.05 * rng.normal()}`);
    }
    writeFileSync(join(dir, 't.csv'), lines.join('\n') + '\n');
    writeFileSync(
      join(dir, 'c.yaml'),
      [
        'table: t.csv',
        'target: y',
        'network: { hidden: [16, 16], epochs: 5, patience: 2 }',
        'attribution: { methods: [saliency, permutation], seeds: 1 }',
        `fits: [{ target: y, terms: [x, "\`${EVIL}\`"] }]`,
        `bounds: [{ lhs: y, rhs: [x], by: "\`${EVIL}\`", bins: 4 }]`,
        'output: out',
      ].join('\n') + '\n',
    );
    const io = memoryIO(dir);
    const code = await runCli(['run', 'c.yaml', '--no-progress'], io);
    if (code !== 0) throw new Error(`run failed (${code}): ${io.err}`);

    context = await chromium.launchPersistentContext(join(dir, 'profile'), {
      executablePath: CHROMIUM,
      headless: true,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
    page = context.pages()[0] ?? (await context.newPage());
    page.on('console', (m) => void (m.type() === 'error' && consoleErrors.push(m.text())));
    page.on('pageerror', (e) => void consoleErrors.push(String(e)));
    page.on('request', (r) => void requests.push(r.url()));
    page.on('dialog', (d) => {
      dialogs.push(d.message());
      void d.dismiss();
    });
    await page.goto(pathToFileURL(join(dir, 'out', 'report.html')).href, { waitUntil: 'load' });
  }, 300_000);

  afterAll(async () => {
    await context?.close();
  });

  it('loads with no console errors, no script run and no request but the file itself', () => {
    expect(consoleErrors).toEqual([]);
    expect(dialogs).toEqual([]);
    expect(requests).toEqual([pathToFileURL(join(dir, 'out', 'report.html')).href]);
  });

  it('shows the hostile column name as text and creates no element from it', async () => {
    expect(await page.locator('img').count()).toBe(0);
    expect(await page.locator('[onerror]').count()).toBe(0);
    expect(await page.locator('body').innerText()).toContain(EVIL);
  });

  it('every plot is a visible, non-empty SVG (folded sections opened); the page is not blank', async () => {
    await page.evaluate(() => document.querySelectorAll('details').forEach((d) => (d.open = true)));
    const svgs = page.locator('svg');
    const n = await svgs.count();
    expect(n).toBeGreaterThanOrEqual(4); // attribution ×2, predictions, residuals, bound, scatter
    for (let k = 0; k < n; k++) {
      const s = svgs.nth(k);
      await s.scrollIntoViewIfNeeded();
      expect(await s.isVisible()).toBe(true);
      const box = await s.boundingBox();
      expect(box!.width * box!.height).toBeGreaterThan(1000);
      expect(await s.locator('*').count()).toBeGreaterThan(5);
    }
    const shot = decodePng(new Uint8Array(await page.screenshot({ fullPage: false })));
    const ink = inkStats(shot);
    expect(ink.inked).toBeGreaterThan(0.02); // fraction of non-white pixels
    expect(ink.distinct).toBeGreaterThan(8);
  });

  it('report.md and results.json of the same run agree with the page', async () => {
    const results = JSON.parse(readFileSync(join(dir, 'out', 'results.json'), 'utf8')) as {
      fits: Array<{ terms: Array<{ term: string; coef: number }> }>;
      bounds: Array<{ results: Array<{ constant: number }> }>;
    };
    const md = readFileSync(join(dir, 'out', 'report.md'), 'utf8');
    const text = await page.locator('body').innerText();
    const c = Number(results.bounds[0]!.results[0]!.constant.toPrecision(4)).toString();
    expect(md).toContain(c);
    expect(text).toContain(c);
    // least squares recovers the planted coefficients y = 2x + 0.5w (noise SD 0.05, 600 rows)
    const coef = (t: string) => results.fits[0]!.terms.find((q) => q.term === t)!.coef;
    expect(coef('x')).toBeCloseTo(2, 1);
    expect(coef(`\`${EVIL}\``)).toBeCloseTo(0.5, 1);
  });
});
