import { describe, it, expect } from 'vitest';
import { renderReport } from '../../src/report/index.ts';
import type { ReportInput, ReportRank } from '../../src/report/index.ts';
import { leadingGroup } from '../../src/report/summary.ts';
import { wrapSubtitle, baseSpec, subtitleChars } from '../../src/report/plots/common.ts';
import { predictionSpec } from '../../src/report/plots/predictions.ts';

const header = (): ReportInput => ({
  title: 't',
  createdAt: '2026-01-01',
  tool: { name: 'surmise', version: '0.1.0' },
  input: { path: 'x.csv', sha256: '0'.repeat(64), rows: 100 },
});
const iv = (feature: string, score: number, low: number, high: number) => ({ feature, score, low, high });
const rank = (ranking: ReportRank['ranking'], extra: Partial<ReportRank> = {}): ReportRank => ({
  target: 'k',
  task: 'regression',
  model: { metric: 'r2', score: 0.9, baselines: { constant: 0, ridge: 0.4 } },
  methods: {},
  ranking,
  ...extra,
});
const summaryLine = (md: string) => md.split('\n').find((l) => l.includes('matter most for'))!;

describe('leading quantities up to the first clear gap (non-overlapping intervals — common practice)', () => {
  it('names only the head whose intervals lie above every later one', async () => {
    // a: [0.5, 0.6]; b: [0.45, 0.55] overlaps a; c: [0.1, 0.2] lies below both: the head is {a, b}
    const r = rank([iv('a', 0.55, 0.5, 0.6), iv('b', 0.5, 0.45, 0.55), iv('c', 0.15, 0.1, 0.2), iv('d', 0.1, 0.05, 0.15)]);
    expect(leadingGroup([...r.ranking])!.map((f) => f.feature)).toEqual(['a', 'b']);
    const md = (await renderReport({ ...header(), rank: r }, { png: false })).markdown;
    const line = summaryLine(md);
    expect(line).toContain('`a`');
    expect(line).toContain('`b`');
    expect(line).not.toContain('`c`');
    expect(line).toContain('These 2 are clearly ahead of the rest');
  });

  it('names the first alone when its interval is above all others', async () => {
    const r = rank([iv('a', 0.7, 0.65, 0.75), iv('b', 0.2, 0.1, 0.3), iv('c', 0.1, 0.05, 0.25)]);
    const line = summaryLine((await renderReport({ ...header(), rank: r }, { png: false })).markdown);
    expect(line).toContain('`a` is clearly ahead');
    expect(line).not.toContain('`b`');
  });

  it('says the top ones cannot be told apart when no gap falls among the first three', async () => {
    // a chain of overlapping intervals: every interval overlaps the next, so no head separates
    const r = rank([iv('a', 0.3, 0.25, 0.35), iv('b', 0.27, 0.22, 0.32), iv('c', 0.24, 0.19, 0.29), iv('d', 0.21, 0.16, 0.26)]);
    expect(leadingGroup([...r.ranking])).toBeNull();
    const line = summaryLine((await renderReport({ ...header(), rank: r }, { png: false })).markdown);
    expect(line).toContain('cannot be told apart');
    expect(line).toContain('`c`');
    expect(line).not.toContain('`d`');
  });

  it('needs the head’s lowest low above the rest’s highest high, not only the neighbour’s', () => {
    // b.low 0.3 > c.high 0.29, but a.low 0.2 < c.high: {a, b} is not separated from c; nor is {a}
    expect(leadingGroup([iv('a', 0.5, 0.2, 0.8), iv('b', 0.4, 0.3, 0.5), iv('c', 0.25, 0.21, 0.29)])).toBeNull();
  });
});

describe('second figure, integrated-gradients gaps and classification predictions', () => {
  it('shows RMSE beside R² for the network and both baselines', async () => {
    const r = rank([iv('a', 1, 0.9, 1)], { model: { metric: 'r2', score: 0.9, baselines: { constant: 0, ridge: 0.4 }, secondary: { metric: 'rmse', score: 0.25, baselines: { constant: 1.5, ridge: 0.9 } } } });
    const md = (await renderReport({ ...header(), rank: r }, { png: false })).markdown;
    expect(md).toContain('| model | R² | RMSE |');
    expect(md).toMatch(/\| network \| 0\.9 \| 0\.25 \|/);
    expect(md).toMatch(/\| constant prediction \| 0 \| 1\.5 \|/);
    expect(md).toContain('RMSE 0.25 against 1.5 and 0.9');
  });

  it('flags integration error when the largest row gap exceeds 10% of the mean change, and not otherwise', async () => {
    const base = [iv('a', 1, 0.9, 1)];
    // the audit's demo figures: mean gap 0.21, largest 7.83, mean |Δf| 5.53 — the largest is 142% of the mean change
    const bad = (await renderReport({ ...header(), rank: rank(base, { completeness: [{ meanAbsGap: 0.21, maxAbsGap: 7.83, meanAbsDelta: 5.53 }] }) }, { png: false })).markdown;
    expect(bad).toContain('largest gap on one row 141.6%');
    expect(bad.split('integration error on some rows').length - 1).toBe(2); // the summary flag and the section flag
    const good = (await renderReport({ ...header(), rank: rank(base, { completeness: [{ meanAbsGap: 0.01, maxAbsGap: 0.5, meanAbsDelta: 5.53 }] }) }, { png: false })).markdown;
    expect(good).toContain('largest gap on one row 9.0%');
    expect(good).not.toContain('integration error on some rows');
  });

  it('says a classification plot shows the expected value Σ p_k c_k', () => {
    const spec = predictionSpec('k', { actual: [0, 1, 2], predicted: [0.2, 1.1, 1.7] }, 100, 0, 'classification') as unknown as {
      title: { subtitle: string[] };
      layer: Array<{ encoding: { y: { title?: string } } }>;
    };
    expect(spec.title.subtitle.join(' ')).toContain('expected value Σ p_k c_k');
    expect(spec.layer[0]!.encoding.y.title).toBe('expected k (Σ p_k c_k)');
    const reg = predictionSpec('k', { actual: [0, 1, 2], predicted: [0.2, 1.1, 1.7] }, 100, 0) as unknown as { layer: Array<{ encoding: { y: { title?: string } } }> };
    expect(reg.layer[0]!.encoding.y.title).toBe('predicted k');
  });
});

describe('fit notes and the formula search', () => {
  it('shows dropped duplicate rows in the fit but raises no flag for them; real warnings still flag', async () => {
    const fit = (warnings: Array<{ kind: string; text: string }>) => ({
      target: 'z', n: 19990, r2: 0.99, rmse: 0.5, cvRmse: 0.5,
      terms: [{ term: 'k', coef: 2, se: 0.001, low: 1.99, high: 2.01, rational: { text: '2' } }],
      warnings,
    });
    const drop = '10 of 20000 rows dropped (10 repeats of an earlier row in every column used)';
    const md = (await renderReport({ ...header(), fits: [fit([{ kind: 'rows', text: drop }])] }, { png: false })).markdown;
    expect(md).toContain(drop);
    expect(md).not.toContain('**Flag:**');
    expect(md).not.toContain('**Warning:**');
    const ill = 'the design is ill-conditioned (condition number 3.1e+09)';
    const md2 = (await renderReport({ ...header(), fits: [fit([{ kind: 'rows', text: drop }, { kind: 'warning', text: ill }])] }, { png: false })).markdown;
    const flag = md2.split('\n').find((l) => l.includes('**Flag:**'))!;
    expect(flag).toContain(ill);
    expect(flag).not.toContain('rows dropped');
  });

  it('writes target ≈ intercept + Σ coef·term, fractions, both errors, complexity, counts and the warning', async () => {
    const c = { terms: ['z'], coefs: [0.491], intercept: 0.12, heldOutRmse: 0.31, selectionRmse: 0.3, complexity: 1, rationalFormula: '1/8 + 1/2*z', rationalHeldOutRmse: 0.33 };
    const md = (await renderReport({
      ...header(),
      search: { mode: 'exhaustive', target: 'k', candidates: [c], front: [c], nCandidateTerms: 65, nCandidatesTried: 2145, selectionRows: 600, heldOutRows: 400, notes: [{ kind: 'screened', text: '2145 subsets screened (exhaustive) …' }, { kind: 'collinear', text: 'greedy: none' }] },
    }, { png: false })).markdown;
    expect(md).toContain('`k ≈ 0.12 + 0.491*z`');
    expect(md).toContain('`k ≈ 1/8 + 1/2*z`');
    expect(md).toContain('2,145 subsets of 65 candidate terms screened on 600 selection rows');
    expect(md).toContain('| complexity | held-out RMSE | selection RMSE |');
    expect(md).toMatch(/\| 1 \| 0\.31 \| 0\.3 \|/);
    expect(md).toContain('Complexity counts 1 per column occurrence');
    expect(md).toContain('some overfit by luck');
    expect(md).toContain('- greedy: none'); // other notes are listed, the screened-count note is not repeated
    expect(md).not.toContain('2145 subsets screened (exhaustive)');
  });
});

describe('plot subtitles wrap instead of being cut', () => {
  it('keeps every word and no line is longer than the limit allows', () => {
    const long = 'all 20,000 rows binned on a 60 × 40 grid, keeping the 25 largest ratios; colour: number of rows in the cell, with more words';
    const lines = wrapSubtitle(long, 40);
    expect(lines.join(' ')).toBe(long);
    for (const l of lines) expect(l.length).toBeLessThanOrEqual(40);
    const spec = baseSpec('t', [long, 'short'], 420, 300) as unknown as { title: { subtitle: string[]; limit: number } };
    expect(spec.title.subtitle.join(' ')).toBe(`${long} short`);
    for (const l of spec.title.subtitle) expect(l.length).toBeLessThanOrEqual(subtitleChars(420));
  });
});

describe('noise level in the report (probes: Stoppiglia et al., JMLR 3, 2003)', () => {
  it('marks each quantity above or at noise and states the probes and their reference', async () => {
    const mark = (f: ReturnType<typeof iv>, aboveNoise: boolean) => ({ ...f, aboveNoise });
    const r = rank([mark(iv('a', 0.6, 0.55, 0.65), true), mark(iv('b', 0.3, 0.25, 0.35), true), mark(iv('c', 0.1, 0.02, 0.12), false)], {
      noise: { probes: '3 permuted copies (of a, b, c) and 3 Gaussian columns', reference: 0.05 },
    });
    const md = (await renderReport({ ...header(), rank: r }, { png: false })).markdown;
    expect(md).toContain('| rank | quantity | score | low | high | vs noise |');
    expect(md).toMatch(/\| 3 \| `c` \| 0\.1 \| 0\.02 \| 0\.12 \| at noise \|/);
    expect(md).toMatch(/\| 1 \| `a` \| 0\.6 \| 0\.55 \| 0\.65 \| above \|/);
    expect(md).toContain('Noise level: 3 permuted copies (of a, b, c) and 3 Gaussian columns were trained');
    expect(md).toContain('2 of 3 quantities have their whole interval above it');
    // without probes the table keeps its five columns
    const plain = (await renderReport({ ...header(), rank: rank([iv('a', 1, 0.9, 1)]) }, { png: false })).markdown;
    expect(plain).toContain('| rank | quantity | score | low | high |\n');
    expect(plain).not.toContain('Noise level');
  });
});

describe('residual section (what the first fit leaves over)', () => {
  it('shows the fit, the residual ranking with its noise line, |residual|, and the next term', async () => {
    const above = (f: ReturnType<typeof iv>, aboveNoise: boolean) => ({ ...f, aboveNoise });
    const md = (
      await renderReport(
        {
          ...header(),
          residual: {
            target: 'y',
            fit: 'y ≈ 0.1 + 3·a^2',
            r2: 0.999,
            rmse: 0.02,
            residualName: 'residual',
            features: ['b', 'c'],
            ranking: [above(iv('b', 0.9, 0.85, 0.95), true), above(iv('c', 0.1, 0.05, 0.15), false)],
            noise: { probes: '1 permuted copy (of b) and 1 Gaussian column', reference: 0.16 },
            absolute: { ranking: [above(iv('b', 0.8, 0.7, 0.9), true), above(iv('c', 0.2, 0.1, 0.3), false)] },
            next: { from: ['b'], formula: '-0.1 + 0.05*b^2', heldOutRmse: 0.005, nextTerms: ['a^2', 'b^2'] },
            notes: [],
          },
        },
        { png: false },
      )
    ).markdown;
    expect(md).toContain('## What the fit leaves over');
    expect(md).toContain('After the fit `y ≈ 0.1 + 3·a^2` (R² 0.999, RMSE 0.02)');
    expect(md).toMatch(/\| 1 \| `b` \| 0\.9 \| 0\.85 \| 0\.95 \| above \|/);
    expect(md).toContain('1 of 2 quantities have their whole interval above it');
    expect(md).toContain('The size of the error, `|residual|`');
    expect(md).toContain('Fit next with the terms `a^2; b^2`.');
  });
});

describe('bound notes', () => {
  it('lists the bound stage’s notes as given (the report never reads their words)', async () => {
    const note = { kind: 'extremeStratum', text: 'the overall maximum ratio sits in the highest stratum of w (3 ≤ w ≤ 4)' };
    const result = { rhs: 'b', constant: 2, witnesses: [], quantiles: {}, strata: [], trend: null, notes: [note] };
    const md = (await renderReport({ ...header(), bounds: [{ lhs: 'a', by: 'w', results: [result] }] }, { png: false })).markdown;
    expect(md).toContain(`Note: ${note.text}`);
    const without = (await renderReport({ ...header(), bounds: [{ lhs: 'a', by: 'w', results: [{ ...result, notes: [] }] }] }, { png: false })).markdown;
    expect(without).not.toContain('Note:');
  });
});

describe('methods named by their registered labels', () => {
  it('titles each method by the label of its strategy (src/attribute/methods), keeping the name in the plot file', async () => {
    const ranking = [iv('a', 0.6, 0.5, 0.7), iv('b', 0.4, 0.3, 0.5)];
    const methods = { integrated: { ranking, kendallTau: 1 }, smoothgrad: { ranking, kendallTau: 1 }, other: { ranking, kendallTau: 1 } };
    const md = (await renderReport({ ...header(), rank: rank(ranking, { methods }) }, { png: false })).markdown;
    expect(md).toContain('**Method: integrated gradients**');
    expect(md).toContain('![Attribution by integrated gradients](plots/attribution-integrated.svg)');
    expect(md).toContain('**Method: SmoothGrad**');
    expect(md).toContain('**Method: other**'); // a name no strategy has is shown as given
  });
});
