/**
 * Several `search` blocks in one run configuration: each runs, is recorded under its name, is shown
 * in the report and compared by name; one block written as a mapping works as before.
 * Invented data for the machinery, with laws planted by construction (stated here):
 *   p = 1 + 2·a − 3·b            exactly
 *   q = a·b / 2 + 0.05·sin(7·i)  (a small deterministic wobble, so its best formula is not exact)
 * on a grid of a, b, c; the names are our own.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'yaml';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { readRunResults } from '../../src/run/rerun.ts';
import { compareRuns } from '../../src/run/compare.ts';
import type { RunResults } from '../../src/run/run.ts';
import { tempDir, put } from '../table/helpers.ts';

const dir = tempDir('searches');

function table(): string {
  const rows = ['name,a,b,c,p,q'];
  for (let i = 0; i < 240; i++) {
    const a = 1 + (i % 12) / 4;
    const b = 1 + ((i * 5) % 17) / 8;
    const c = ((i * 7) % 23) / 10;
    const p = 1 + 2 * a - 3 * b;
    const q = (a * b) / 2 + 0.05 * Math.sin(7 * i);
    rows.push([`r${i}`, a, b, c, p, q].join(','));
  }
  return rows.join('\n') + '\n';
}

/** A small, quick analysis (the ranking is not what these tests are about). */
const HEAD = [
  'table: t.csv',
  'target: p',
  'features: [a, b, c]',
  'network: { hidden: [4], epochs: 2 }',
  'attribution: { methods: [saliency], seeds: 1, probes: 0, resamples: 10 }',
];

const TWO = [
  ...HEAD,
  'search:',
  '  - name: product',
  '    target: q',
  '    from: [a, b, c]',
  '    maxTerms: 1',
  '    maxComplexity: 2',
  '  - target: p',             // unnamed: `search 2`
  '    from: [a, b, c]',
  '    maxTerms: 2',
  '    maxComplexity: 2',
  'output: two-run',
].join('\n') + '\n';

async function run(args: string[]): Promise<{ code: number; out: string; err: string }> {
  const io = memoryIO(dir);
  const code = await runCli([...args, ...(args[0] === 'compare' ? [] : ['--no-progress'])], io);
  return { code, out: io.out, err: io.err };
}

const best = (s: RunResults['searches'][number]) => [...s.front].sort((x, y) => x.heldOutRmse - y.heldOutRmse)[0]!;
const coef = (c: { terms: string[]; coefs: number[] }, t: string) => c.coefs[c.terms.indexOf(t)]!;

let two: RunResults;
beforeAll(async () => {
  put(dir, 't.csv', table());
  put(dir, 'two.yaml', TWO);
  const r = await run(['run', 'two.yaml']);
  expect(r.code, r.err).toBe(0);
  two = readRunResults(join(dir, 'two-run'));
}, 300_000);

describe('two search blocks in one run', () => {
  it('both searches run, under their names, each finding its own planted law', () => {
    expect(two.formatVersion).toBe(2);
    expect(two.searches.map((s) => [s.name, s.target])).toEqual([['product', 'q'], ['search 2', 'p']]);
    // p = 1 + 2a − 3b exactly (planted): terms a and b, zero held-out error
    const p = best(two.searches[1]!);
    expect(new Set(p.terms)).toEqual(new Set(['a', 'b']));
    expect(coef(p, 'a')).toBeCloseTo(2, 9);
    expect(coef(p, 'b')).toBeCloseTo(-3, 9);
    expect(p.intercept.coef).toBeCloseTo(1, 9);
    expect(p.heldOutRmse).toBeLessThan(1e-9);
    // q = ab/2 + wobble of amplitude 0.05 (planted): the one term a*b with coefficient near 1/2, error of the wobble's size
    const q = best(two.searches[0]!);
    expect(q.terms).toEqual(['a*b']);
    expect(coef(q, 'a*b')).toBeCloseTo(0.5, 2);
    expect(q.heldOutRmse).toBeGreaterThan(0.01);
    expect(q.heldOutRmse).toBeLessThan(0.05);
    // the held-out spread each error is read against: the SD of the target on the held-out rows
    for (const s of two.searches) expect(s.heldOutSd).toBeGreaterThan(0.1);
  });

  it('records the options used for each block, names included, in config.yaml and results.json', () => {
    const recorded = parse(readFileSync(join(dir, 'two-run', 'config.yaml'), 'utf8')) as { search: Array<Record<string, unknown>> };
    expect(recorded.search.map((s) => s.name)).toEqual(['product', 'search 2']);
    expect(recorded.search[0]).toMatchObject({ target: 'q', maxTerms: 1, maxComplexity: 2, top: 10, powers: '-3..3' });
    expect(recorded.search[1]).toMatchObject({ target: 'p', maxTerms: 2, maxComplexity: 2, top: 10 });
    expect(two.config.search).toEqual(recorded.search);
  });

  it('the report shows each search under its name, and the summary picks the best formula across them, saying whose it is', () => {
    const md = readFileSync(join(dir, 'two-run', 'report.md'), 'utf8');
    expect(md).toContain("### Formula search 'product' for q");
    expect(md).toContain("### Formula search 'search 2' for p");
    // the exact law of the second block beats the first's wobble relative to each target's spread
    expect(md).toMatch(/Best formula found by the 2 searches: `p ≈ [^`]+` \(from search 'search 2'; held-out RMSE/);
    const html = readFileSync(join(dir, 'two-run', 'report.html'), 'utf8');
    // the headline card's text (the HTML marks numbers, such as the 2 of `search 2`, in their own spans)
    const head = html.slice(html.indexOf('<section class="headline">'), html.indexOf('</section>')).replace(/<[^>]+>/g, '').replace(/&#39;/g, "'");
    expect(head).toContain("from search 'search 2', the best of 2");
  });

  it('rerun reproduces both searches; compare matches them by name and flags a search found in one run only', async () => {
    const r = await run(['rerun', 'two-run', '--table', 't.csv', '--out', 'two-again']);
    expect(r.code, r.err).toBe(0);
    const again = readRunResults(join(dir, 'two-again'));
    expect(again.searches).toEqual(two.searches);
    const c = await run(['compare', 'two-run', 'two-again', '--json']);
    expect(c.code, c.err).toBe(0);
    const cmp = JSON.parse(c.out) as { searches: Array<{ name: string; in: string; sameTerms: boolean; flagged: boolean }>; flags: string[] };
    expect(cmp.searches.map((s) => [s.name, s.in, s.sameTerms, s.flagged])).toEqual([['product', 'both', true, false], ['search 2', 'both', true, false]]);
    expect(cmp.flags).toEqual([]);
    // B without the first search and with the second renamed: nothing matches by name
    const b = { ...again, searches: [{ ...again.searches[1]!, name: 'linear' }] };
    const moved = compareRuns(two, b);
    expect(moved.searches.map((s) => [s.name, s.in])).toEqual([['product', 'A'], ['search 2', 'A'], ['linear', 'B']]);
    expect(moved.flags).toContain("search 'product' for q: in run A only (searches are matched by name)");
    expect(moved.flags).toContain("search 'linear' for p: in run B only (searches are matched by name)");
  }, 300_000);

  it('an older run folder (results format 1, one `search`) is read as one search named `search 1`, reruns and compares', async () => {
    const { searches, ...rest } = JSON.parse(readFileSync(join(dir, 'two-run', 'results.json'), 'utf8')) as RunResults & Record<string, unknown>;
    const old = { ...rest, formatVersion: 1, search: { ...searches[1], name: undefined }, config: { ...rest.config, search: { target: 'p', from: ['a', 'b', 'c'] } } };
    mkdirSync(join(dir, 'old-run'));
    writeFileSync(join(dir, 'old-run', 'results.json'), JSON.stringify(old));
    const read = readRunResults(join(dir, 'old-run'));
    expect(read.formatVersion).toBe(2);
    expect(read.searches.map((s) => [s.name, s.target])).toEqual([['search 1', 'p']]);
    expect(best(read.searches[0]!).terms).toEqual(best(searches[1]!).terms);
    // rerun of the older folder: its one block runs again, under the same name
    const again = await run(['rerun', 'old-run', '--table', 't.csv', '--out', 'old-again']);
    expect(again.code, again.err).toBe(0);
    const rerun = readRunResults(join(dir, 'old-again'));
    expect(rerun.searches.map((s) => [s.name, s.target])).toEqual([['search 1', 'p']]);
    expect(compareRuns(read, rerun).searches.map((s) => [s.name, s.in])).toEqual([['search 1', 'both']]);
    // a newer format than this reader knows is refused, not misread
    writeFileSync(join(dir, 'old-run', 'results.json'), JSON.stringify({ ...old, formatVersion: 3 }));
    expect(() => readRunResults(join(dir, 'old-run'))).toThrow(/written by a newer surmise \(results format 3; this one reads 1 and 2/);
    // and a version no surmise wrote is not called newer
    writeFileSync(join(dir, 'old-run', 'results.json'), JSON.stringify({ ...old, formatVersion: '2' }));
    expect(() => readRunResults(join(dir, 'old-run'))).toThrow(/not a results format surmise wrote \(results format "2"; this one reads 1 and 2\)/);
  }, 300_000);
});

describe('one search block written as a mapping, as configurations were first written', () => {
  it('runs unchanged: one search named `search 1`, the report as before', async () => {
    const text = [...HEAD, 'search:', '  target: p', '  from: [a, b]', '  maxTerms: 2', '  maxComplexity: 2', 'output: one-run'].join('\n') + '\n';
    put(dir, 'one.yaml', text);
    const r = await run(['run', 'one.yaml']);
    expect(r.code, r.err).toBe(0);
    const one = readRunResults(join(dir, 'one-run'));
    expect(one.searches.map((s) => s.name)).toEqual(['search 1']);
    expect(new Set(one.searches[0]!.candidates[0]!.terms)).toEqual(new Set(['a', 'b']));
    const md = readFileSync(join(dir, 'one-run', 'report.md'), 'utf8');
    expect(md).toContain('### Formula search\n');
    expect(md).toContain('Best formula found by the search: `p ≈');
  }, 300_000);
});

describe('key paths in refusals name the block as the file writes it', () => {
  const refused = async (name: string, text: string) => {
    put(dir, name, text);
    const r = await run(['run', name]);
    expect(r.code).toBe(2);
    expect(r.err.trimEnd().split('\n')).toHaveLength(1); // one line, no stack trace
    return r.err;
  };
  const block = (extra: string[] = []) => ['  - target: p', '    from: [a, b]', ...extra];

  it('search[2].top over its ceiling (1,000): exit 2, option.tooLarge, naming the key', async () => {
    const err = await refused('top.yaml', [...HEAD, 'search:', ...block(), ...block(), ...block(['    top: 1001'])].join('\n') + '\n');
    expect(err).toBe('surmise: top.yaml:13:10: search[2].top: expected at most 1,000 (its ceiling), got 1001 [option.tooLarge]\n');
  });

  it('more than 20 search blocks: option.tooLarge on `search`', async () => {
    const many = Array.from({ length: 21 }, () => block()).flat();
    const err = await refused('many.yaml', [...HEAD, 'search:', ...many].join('\n') + '\n');
    expect(err).toBe('surmise: many.yaml:7:3: search: expected at most 20 search blocks (its ceiling), got 21 [option.tooLarge]\n');
  });

  it('two blocks of the same name, the second one named by its key path', async () => {
    const err = await refused('same.yaml', [...HEAD, 'search:', ...block(['    name: s']), ...block(['    name: s'])].join('\n') + '\n');
    expect(err).toBe("surmise: same.yaml:12:11: search[1].name: expected a name no other search block has (search[0] is also named 's') [config.badValue]\n");
  });

  it('a default name taken by a named block is a clash too (`search 2`)', async () => {
    const err = await refused('clash.yaml', [...HEAD, 'search:', ...block(['    name: search 2']), ...block()].join('\n') + '\n');
    expect(err).toBe("surmise: clash.yaml:10:5: search[1]: this block has no name, so it would be named 'search 2', which search[0] is already named; give it a name [config.badValue]\n");
  });

  it('a column of the second block checked against the table before training: search[1].from[1]', async () => {
    const err = await refused('col.yaml', [...HEAD, 'search:', ...block(), '  - target: p', '    from: [a, bb]'].join('\n') + '\n');
    expect(err).toBe("surmise: col.yaml:10:15: search[1].from[1]: no column 'bb' in the table (did you mean 'b'?) [config.unknownColumn]\n");
  });

  it("an option the search stage refuses while running is worded as the block's key path", async () => {
    const err = await refused('powers.yaml', [...HEAD, 'search:', ...block(), ...block(['    powers: 0..0']), 'output: powers-run'].join('\n') + '\n');
    expect(err).toMatch(/search\[1\]\.powers/);
    expect(err).not.toMatch(/`powers`|--powers/);
  }, 300_000);

  it('one block written as a mapping keeps its key paths (search.top)', async () => {
    const err = await refused('single.yaml', [...HEAD, 'search:', '  target: p', '  from: [a]', '  top: 1001'].join('\n') + '\n');
    expect(err).toBe('surmise: single.yaml:9:8: search.top: expected at most 1,000 (its ceiling), got 1001 [option.tooLarge]\n');
  });
});
