/**
 * The real-browser check: report.html opened from disk in headless Chromium (via playwright-core).
 * Chromium's HTML parser is the outside reference for "the page is self-contained, shows the
 * user's strings as text and runs nothing". Skipped only when /usr/bin/chromium is absent.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { renderReport } from '../../src/report/index.ts';
import { EVIL, makeInput } from './fixture-input.ts';
import { checkWidth, decodePng, inkStats } from './helpers.ts';

const CHROMIUM = '/usr/bin/chromium';
const haveChromium = existsSync(CHROMIUM);
if (!haveChromium) console.warn(`report browser test skipped: ${CHROMIUM} is not installed (CI installs it)`);

describe.skipIf(!haveChromium)('report.html in a real browser', () => {
  let dir: string;
  let context: BrowserContext;
  let page: Page;
  let url: string;
  let plotCount = 0;
  const consoleErrors: string[] = [];
  const pageErrors: string[] = [];
  const requests: string[] = [];
  const dialogs: string[] = [];

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'surmise-browser-'));
    const rendered = await renderReport(makeInput(5000, 5), { png: false });
    plotCount = rendered.plots.length;
    const file = join(dir, 'report.html');
    writeFileSync(file, rendered.html);
    url = pathToFileURL(file).href;
    context = await chromium.launchPersistentContext(join(dir, 'profile'), {
      executablePath: CHROMIUM,
      headless: true,
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    });
    page = context.pages()[0] ?? (await context.newPage());
    page.on('console', (m) => void (m.type() === 'error' && consoleErrors.push(m.text())));
    page.on('pageerror', (e) => void pageErrors.push(String(e)));
    page.on('request', (r) => void requests.push(r.url()));
    page.on('dialog', (d) => {
      dialogs.push(d.message());
      void d.dismiss();
    });
    await page.goto(url, { waitUntil: 'load' });
    await page.waitForTimeout(300);
  });

  afterAll(async () => {
    await context?.close();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('loads nothing but the file, logs no error and opens no dialog', () => {
    expect(requests).toEqual([url]);
    expect(consoleErrors).toEqual([]);
    expect(pageErrors).toEqual([]);
    expect(dialogs).toEqual([]);
  });

  it('draws every plot as a visible SVG with content (folded sections opened)', async () => {
    await page.evaluate(() => document.querySelectorAll('details').forEach((d) => (d.open = true)));
    const figs = await page.evaluate(() =>
      Array.from(document.querySelectorAll('figure.plot > svg')).map((svg) => {
        const r = svg.getBoundingClientRect();
        const st = getComputedStyle(svg);
        return {
          w: r.width,
          h: r.height,
          visible: svg.checkVisibility() && st.visibility === 'visible' && st.display !== 'none' && Number(st.opacity) > 0,
          items: svg.querySelectorAll('path, line, rect, text').length,
        };
      }),
    );
    expect(figs.length).toBe(plotCount);
    for (const f of figs) {
      expect(f.visible).toBe(true);
      expect(f.w).toBeGreaterThan(100);
      expect(f.h).toBeGreaterThan(50);
      expect(f.items).toBeGreaterThan(10);
    }
    // and the last one really is on screen when scrolled to (Playwright's own visibility test)
    const last = page.locator('figure.plot > svg').last();
    await last.scrollIntoViewIfNeeded();
    expect(await last.isVisible()).toBe(true);
  });

  it('shows the malicious name as text and creates no element from it', async () => {
    expect(await page.locator('img').count()).toBe(0);
    expect(await page.locator('script').count()).toBe(0);
    expect(await page.locator('[onerror]').count()).toBe(0);
    const text = await page.evaluate(() => document.body.textContent ?? '');
    expect(text).toContain(EVIL);
    expect(await page.getByText(EVIL, { exact: false }).count()).toBeGreaterThan(0);
    // inside the plots too: vega's axis label of the feature holds it as SVG text
    const svgText = await page.evaluate(() => Array.from(document.querySelectorAll('svg text')).map((t) => t.textContent).join('\n'));
    expect(svgText).toContain('<img src=x');
  });

  it('shows the same key figures the Markdown has (read back from the rendered page)', async () => {
    const top = await page.locator('[data-key="top-feature"]').textContent();
    expect(top).toBe('p');
    const c = await page.locator('[data-key="bound-0-0-constant"]').textContent();
    const cSection = await page.locator('[data-key="bound-0-0-constant-section"]').textContent();
    expect(c).toBe(cSection);
    expect(Number(c)).toBeLessThanOrEqual(0.1); // the invented table's planted law: ratio ≤ 0.1 on every row
  });

  it('the listeners do catch an unsafe page (control: raw markup, no escaping)', async () => {
    const control = join(dir, 'control.html');
    writeFileSync(control, `<!DOCTYPE html><html><body><p>${EVIL}</p></body></html>`);
    const p2 = await context.newPage();
    const seen: string[] = [];
    const asked: string[] = [];
    p2.on('dialog', (d) => {
      seen.push(d.message());
      void d.dismiss();
    });
    p2.on('request', (r) => void asked.push(r.url()));
    await p2.goto(pathToFileURL(control).href, { waitUntil: 'load' });
    await p2.waitForTimeout(300);
    expect(await p2.locator('img').count()).toBe(1);
    expect(seen).toEqual(['1']);
    expect(asked.length).toBeGreaterThan(1);
    await p2.close();
  });

  it('fits the page at 390 px and 1280 px (no horizontal overflow), with tick labels of at least 11 px at 1280 px', async () => {
    for (const width of [390, 1280]) await checkWidth(page, width, expect);
    // the table of contents points at sections that exist
    const targets = await page.evaluate(() => Array.from(document.querySelectorAll('nav.toc a')).map((a) => document.getElementById(a.getAttribute('href')!.slice(1)) !== null));
    expect(targets.length).toBeGreaterThan(3);
    expect(targets.every(Boolean)).toBe(true);
    await page.setViewportSize({ width: 1280, height: 720 });
  });

  it('renders a screenshot that is not blank', async () => {
    await page.evaluate(() => window.scrollTo(0, 0));
    const shot = await page.screenshot({ fullPage: false });
    const img = decodePng(new Uint8Array(shot));
    expect(img.width).toBeGreaterThan(300);
    const ink = inkStats(img);
    expect(ink.inked).toBeGreaterThan(0.01);
    expect(ink.distinct).toBeGreaterThan(20);
    const plot = await page.locator('figure.plot > svg').first().screenshot();
    const p = inkStats(decodePng(new Uint8Array(plot)));
    expect(p.inked).toBeGreaterThan(0.02);
  });
});
