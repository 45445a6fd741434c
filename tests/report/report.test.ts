import { describe, it, expect, beforeAll } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { max } from 'simple-statistics';
import { renderReport, writeReportFiles, formatNumber, EVIDENCE_SENTENCE } from '../../src/report/index.ts';
import type { RenderedReport, ReportInput } from '../../src/report/index.ts';
import { SurmiseError } from '../../src/errors.ts';
import { EVIL, makeInput, makeRows } from './fixture-input.ts';
import { PNG_SIGNATURE } from './helpers.ts';

const ENTITY: Record<string, string> = { '&amp;': '&', '&lt;': '<', '&gt;': '>', '&quot;': '"', '&#39;': "'" };
const unescapeHtml = (s: string) => s.replace(/&(amp|lt|gt|quot|#39);/g, (m) => ENTITY[m]!);
/**
 * Markdown outside code: fenced blocks and code spans removed. Inside them CommonMark shows text
 * literally and never forms HTML (CommonMark 0.31 §4.5, §6.1), so raw HTML can only arise outside.
 */
const outsideCode = (md: string) =>
  md.replace(/^(`{3,})[^\n]*\n[\s\S]*?\n\1$/gm, '').replace(/(`+)[^`]*?\1/g, '');
const keyed = (html: string, key: string) => {
  const m = new RegExp(`<span data-key="${key}">(?:<[^>]+>)*([^<]*)`).exec(html);
  return m ? unescapeHtml(m[1]!) : undefined;
};

let input: ReportInput;
let out: RenderedReport;

beforeAll(async () => {
  input = makeInput(2000, 7);
  out = await renderReport(input, { png: false });
});

describe('the summary', () => {
  it('names the top feature and the tightest constant, the same in report.html and report.md', () => {
    // top feature: the largest combined score in the input
    const top = [...input.rank!.ranking].sort((a, b) => b.score - a.score)[0]!.feature;
    expect(keyed(out.html, 'top-feature')).toBe(top);
    expect(out.markdown).toContain(`matter most for \`k\`: \`${top}\``);
    // the constant: the planted law |3k − z| = 0.1·(b·w)·|u|³ ≤ 0.1·b·w (by construction
    // of the invented table), so c* is the largest ratio over the rows, and below 0.1
    const rows = makeRows(2000, 7);
    const cStar = max(rows.k.map((s, i) => Math.abs(3 * s - rows.z[i]!) / (rows.b[i]! * rows.w[i]!)));
    expect(cStar).toBeLessThanOrEqual(0.1);
    const c = formatNumber(cStar);
    expect(keyed(out.html, 'bound-0-0-constant')).toBe(c);
    expect(keyed(out.html, 'bound-0-0-constant-section')).toBe(c);
    expect(out.markdown).toContain(`holds on every row with c = **${c}**`);
    expect(out.markdown).toContain(`Smallest constant that holds on every row: c = **${c}**`);
    // the witness row is the row attaining it
    const wRow = rows.k.findIndex((s, i) => Math.abs(3 * s - rows.z[i]!) / (rows.b[i]! * rows.w[i]!) === cStar) + 1;
    expect(keyed(out.html, 'bound-0-0-row')).toBe(String(wRow));
    expect(out.markdown).toContain(`attained at row ${wRow} `);
  });

  it('gives the network skill in words and the best formula with its fractions', () => {
    expect(keyed(out.html, 'network-score')).toBe('0.93');
    expect(out.markdown).toContain('k is predictable from these columns, and not only linearly');
    // the summary's best formula is the search's (smallest held-out error), not the fit the user typed
    expect(keyed(out.html, 'best-formula')).toBe('3*k + 4e-4*b');
    expect(out.markdown).toContain('Best formula found by the search: `3*k + 4e-4*b` (held-out RMSE 0.5029');
    expect(out.markdown).toContain('Fit you asked for: `z ≈ 3*k - 0.0012`');
    // the headline block carries the same figures
    expect(keyed(out.html, 'headline-skill')).toBe('0.93');
    expect(out.html).toContain('<section class="headline">');
  });

  it('flags the bound whose constant grows along the sub-family and not the one that holds', () => {
    const flags = out.markdown.split('\n').filter((l) => l.startsWith('> **Flag:**'));
    expect(flags.some((l) => l.includes('c * (b)`') && l.includes('is not stable along w'))).toBe(true);
    expect(flags.some((l) => l.includes('(b*w)'))).toBe(false);
  });

  it('says once, in both files, that this is evidence and not proof', () => {
    expect(out.markdown.split(EVIDENCE_SENTENCE).length - 1).toBe(1);
    expect(out.html.split(EVIDENCE_SENTENCE).length - 1).toBe(1);
    // it comes right after the summary, before the first section
    expect(out.markdown.indexOf(EVIDENCE_SENTENCE)).toBeLessThan(out.markdown.indexOf('## The table and the rows used'));
  });
});

describe('the sections', () => {
  it('list every drop with its reason and the duplicates', () => {
    for (const d of input.drops!.dropped) {
      expect(out.markdown).toContain(`| ${d.reason} | ${d.rows} |`);
      expect(out.html).toContain(`<td>${d.reason}</td>`);
    }
    expect(out.markdown).toContain('exact duplicate (identical in every column; first copy kept) | 3 |');
  });

  it('show the configuration verbatim', () => {
    const pre = /<pre><code>([\s\S]*?)<\/code><\/pre>/.exec(out.html)!;
    expect(unescapeHtml(pre[1]!)).toBe(input.configText);
    expect(out.markdown).toContain('```\n' + input.configText + '```');
  });

  it('carry every plot in both files and give each an own id space', () => {
    const names = [...out.html.matchAll(/<figure class="plot" data-plot="([^"]+)">/g)].map((m) => m[1]!);
    expect(names).toEqual(out.plots.map((p) => p.name));
    for (const n of names) expect(out.markdown).toContain(`](plots/${n}.svg)`);
    expect(names).toContain('target-vs-top-feature');
    expect(names).toContain('predicted-vs-actual');
    expect(names.filter((n) => n.startsWith('attribution-')).length).toBe(4); // combined + 3 methods
    expect(names[names.indexOf('attribution-combined') + 1]).toMatch(/^attribution-/);
    const ids = [...out.html.matchAll(/\sid="([^"]+)"/g)].map((m) => m[1]!);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('is deterministic', async () => {
    const again = await renderReport(input, { png: false });
    expect(again.html === out.html).toBe(true);
    expect(again.markdown === out.markdown).toBe(true);
  });
});

describe('safety of report.html', () => {
  it('shows the malicious name as text everywhere and loads nothing', () => {
    for (const doc of [out.html, outsideCode(out.markdown)]) {
      expect(doc).not.toMatch(/<img/i);
      expect(doc).not.toMatch(/<script/i);
    }
    expect(outsideCode(out.markdown)).not.toContain('<');
    expect(out.html).toContain('&lt;img src=x onerror=alert(1)&gt;');
    const tags = [...out.html.matchAll(/<[a-zA-Z][^>]*>/g)].map((m) => m[0]);
    for (const t of tags) expect(t).not.toMatch(/^<link|\ssrc=|\son[a-z]+=|\shref="(?!#)/i);
    expect(out.html).not.toContain('@import');
    // the only absolute URLs are SVG/XLink namespace names, which are never fetched (XML Namespaces 1.0 §2.3)
    const urls = [...out.html.matchAll(/https?:\/\/[^"'\s)]+/g)].map((m) => m[0]);
    expect(new Set(urls)).toEqual(new Set(['http://www.w3.org/2000/svg', 'http://www.w3.org/1999/xlink']));
  });

  it('uses only known elements (anything from the data would show up here)', () => {
    const allowed = new Set(
      'html head meta title style body h1 h2 h3 p ul li strong code span table thead tbody tr th td figure figcaption pre svg g path rect line text tspan defs lineargradient stop clippath nav a section div details summary'.split(' '),
    );
    const tags = new Set([...out.html.matchAll(/<([a-zA-Z][a-zA-Z0-9]*)/g)].map((m) => m[1]!.toLowerCase()));
    for (const t of tags) expect(allowed.has(t), `unexpected element <${t}>`).toBe(true);
  });

  it('escapes a malicious string in every place a user string lands', async () => {
    const e = makeInput(300, 3);
    e.title = EVIL;
    e.input.path = EVIL;
    e.rank!.target = EVIL;
    e.rank!.model.metric = EVIL;
    e.rank!.methods = { [EVIL]: e.rank!.methods.saliency! };
    e.scatter = { ...e.scatter!, xName: EVIL, yName: EVIL, colorName: EVIL };
    e.fits![0]!.target = EVIL;
    e.fits![0]!.terms[0]!.term = EVIL;
    e.fits![0]!.terms[0]!.rational = { text: EVIL };
    e.fits![0]!.residuals!.byTerm[0]!.term = EVIL;
    e.search!.mode = EVIL;
    e.search!.front[0]!.terms = [EVIL];
    e.bounds![0]!.lhs = EVIL;
    e.bounds![0]!.by = EVIL;
    e.bounds![0]!.results[0]!.rhs = EVIL;
    e.bounds![0]!.results[0]!.trend!.verdict = EVIL;
    e.bounds![0]!.results[0]!.quantiles = { [EVIL]: 1 };
    e.bounds![0]!.results[0]!.witnesses[0]!.labels = { [EVIL]: EVIL };
    e.drops!.duplicateRule = EVIL;
    e.drops!.dropped[0]!.reason = EVIL;
    e.createdAt = EVIL;
    e.tool.version = EVIL;
    e.input.sha256 = EVIL;
    const r = await renderReport(e, { png: false });
    expect(r.html).not.toMatch(/<img/i);
    expect(outsideCode(r.markdown)).not.toContain('<');
    for (const p of r.plots) expect(p.svg).not.toMatch(/<img/i);
    // every one of them is still shown, as text
    expect(r.html.split('&lt;img src=x onerror=alert(1)&gt;').length - 1).toBeGreaterThan(25);
    expect(r.markdown).toContain('&lt;img src=x onerror=alert(1)&gt;');
    expect(r.plots.every((p) => /^[a-z0-9-]+$/.test(p.name))).toBe(true);
  });
});

describe('bad input and options', () => {
  it('names the field whose arrays disagree', async () => {
    const e = makeInput(100, 1);
    e.scatter!.y = e.scatter!.y.slice(1);
    await expect(renderReport(e)).rejects.toMatchObject({
      code: 'report.badInput',
      message: 'report input scatter.x: has 100 values but scatter.y has 99',
    });
    const f = makeInput(100, 1);
    f.bounds![0]!.results[1]!.points!.ratio.pop();
    await expect(renderReport(f)).rejects.toThrow(/bounds\[0\]\.results\[1\]\.points\.by: has 100 values but .*ratio has 99/);
  });

  it('names the bad option', async () => {
    const e = makeInput(50, 1);
    await expect(renderReport(e, { maxPoints: 0 })).rejects.toBeInstanceOf(SurmiseError);
    await expect(renderReport(e, { maxPoints: 0 })).rejects.toMatchObject({
      code: 'report.badOption',
      message: 'report option maxPoints: expected an integer from 10 to 200000, got 0',
    });
    await expect(renderReport(e, { scatterMode: 'hex' as 'bin' })).rejects.toMatchObject({ code: 'report.badOption' });
  });

  it('renders a report with only the header (every stage optional)', async () => {
    const r = await renderReport({
      title: 't',
      createdAt: '2026-01-01',
      tool: { name: 'surmise', version: '0.1.0' },
      input: { path: 'x.csv', sha256: '0'.repeat(64), rows: 3 },
    });
    expect(r.plots).toEqual([]);
    expect(r.markdown).toContain('This report holds no results');
    expect(r.markdown).toContain(EVIDENCE_SENTENCE);
  });
});

describe('writeReportFiles', () => {
  it('writes every file by rename, leaving no partial file behind', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'surmise-report-'));
    try {
      const r = await renderReport(makeInput(200, 2));
      const files = await writeReportFiles(dir, r);
      expect(files).toContain('report.html');
      for (const f of files) expect(existsSync(join(dir, f))).toBe(true);
      const debris = (d: string) => readdirSync(d).filter((f) => f.endsWith('.tmp') || f.includes('surmise-partial'));
      expect(debris(dir)).toEqual([]);
      expect(debris(join(dir, 'plots'))).toEqual([]);
      const png = readFileSync(join(dir, 'plots', `${r.plots[0]!.name}.png`));
      expect(Array.from(png.subarray(0, 8))).toEqual(PNG_SIGNATURE); // PNG spec §5.2
      expect(readFileSync(join(dir, 'report.md'), 'utf8')).toBe(r.markdown);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
  it('a write that fails says which file and leaves no partial file behind', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'surmise-report-'));
    try {
      mkdirSync(join(dir, 'report.md')); // a folder where the file should go: the rename fails
      const r = await renderReport(makeInput(50, 1));
      const e = await writeReportFiles(dir, r).then(() => null, (x: unknown) => x);
      expect(e).toBeInstanceOf(SurmiseError);
      expect((e as SurmiseError).code).toBe('output.unwritable');
      expect((e as SurmiseError).message).toMatch(/cannot write report\.md/);
      expect(readdirSync(dir).filter((f) => f.includes('surmise-partial'))).toEqual([]);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

/** Every number rounded to 3 significant figures, so the comparison ignores last-digit noise. */
function roundNumbers(s: string): string {
  return s.replace(/-?\d+(?:\.\d+)?(?:e-?\d+)?/g, (m) => {
    const x = Number(m);
    return Number.isFinite(x) && !Number.isInteger(x) ? String(Number(x.toPrecision(3))) : m;
  });
}

describe('stored expected report.md', () => {
  it('matches tests/report/expected/report.md (numbers rounded)', async () => {
    const expectedPath = fileURLToPath(new URL('./expected/report.md', import.meta.url));
    const changedPath = fileURLToPath(new URL('./expected/report-changed.md', import.meta.url));
    const r = await renderReport(makeInput(300, 3), { png: false });
    const expected = readFileSync(expectedPath, 'utf8');
    const same = roundNumbers(r.markdown) === roundNumbers(expected);
    if (!same) writeFileSync(changedPath, r.markdown);
    else if (existsSync(changedPath)) rmSync(changedPath);
    expect(same, 'report.md changed: see tests/report/expected/report-changed.md').toBe(true);
  });
});
