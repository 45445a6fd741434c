import { describe, it, expect } from 'vitest';
import {
  attributionSpec,
  boundSpec,
  predictionSpec,
  residualSpec,
  scatterSpec,
  specToSvg,
  svgToPng,
  bin2d,
} from '../../src/report/index.ts';
import { countMarks, decodePng, inkStats, PNG_SIGNATURE } from './helpers.ts';
import { EVIL, makeInput } from './fixture-input.ts';

const input = makeInput(5000, 11);

describe('plot specs render to SVG with the expected marks', () => {
  it('attribution: one bar and one whisker per feature, and escaped names', async () => {
    const m = input.rank!.methods.saliency!;
    const svg = await specToSvg(attributionSpec('saliency', m.ranking), 'a');
    expect(countMarks(svg, 'bars')).toBe(m.ranking.length);
    expect(countMarks(svg, 'whiskers')).toBe(m.ranking.length);
    // vega writes text content escaped (XML 1.0 §2.4: '<' and '&' must be escaped in character data)
    expect(svg).not.toContain('<img');
    expect(svg).toContain('&lt;img src=x');
  });

  it('attribution: cuts at maxBars and says so', async () => {
    const many = Array.from({ length: 40 }, (_, k) => ({ feature: `f${k}`, score: 40 - k, low: 39 - k, high: 41 - k }));
    const spec = attributionSpec('permutation', many, 30);
    const svg = await specToSvg(spec, 'b');
    expect(countMarks(svg, 'bars')).toBe(30);
    expect(svg).toContain('top 30 of 40 features');
  });

  it('scatter: every point up to maxPoints, a seeded sample or a 2-D histogram above', async () => {
    const s = input.scatter!;
    const small = { ...s, x: s.x.slice(0, 500), y: s.y.slice(0, 500), color: s.color!.slice(0, 500) };
    const all = await specToSvg(scatterSpec(small, { maxPoints: 1000, mode: 'bin', seed: 1 }), 'c');
    expect(countMarks(all, 'points')).toBe(500);
    const sampled = await specToSvg(scatterSpec(s, { maxPoints: 1000, mode: 'sample', seed: 1 }), 'd');
    expect(countMarks(sampled, 'points')).toBe(1000);
    expect(sampled).toContain('1,000 of 5,000 points (seeded random sample)');
    const binned = await specToSvg(scatterSpec(s, { maxPoints: 1000, mode: 'bin', seed: 1, grid: [40, 30] }), 'e');
    // independent count of the non-empty cells
    const ref = bin2d(s.x, s.y, 40, 30, s.color);
    expect(countMarks(binned, 'cells')).toBe(ref.cells.length);
    expect(binned).toContain('all 5,000 rows binned on a 40 by 30 grid');
  });

  it('scatter binning and sampling are deterministic', async () => {
    const s = input.scatter!;
    const a = await specToSvg(scatterSpec(s, { maxPoints: 800, mode: 'sample', seed: 9 }), 'f');
    const b = await specToSvg(scatterSpec(s, { maxPoints: 800, mode: 'sample', seed: 9 }), 'f');
    const c = await specToSvg(scatterSpec(s, { maxPoints: 800, mode: 'sample', seed: 10 }), 'f');
    expect(a === b).toBe(true);
    expect(a === c).toBe(false);
  });

  it('predicted against actual: the points and the line y = x', async () => {
    const p = input.rank!.predictions!;
    const svg = await specToSvg(predictionSpec('k', p, 700, 3), 'g');
    expect(countMarks(svg, 'points')).toBe(700);
    expect(countMarks(svg, 'identity')).toBe(1);
    // the identity line goes from the bottom-left to the top-right corner of the square plot
    const line = /role-mark identity_marks"[^>]*><path[^>]*d="M([\d.]+),([\d.]+)L([\d.]+),([\d.]+)"/.exec(svg);
    expect(line).not.toBeNull();
    const [x0, y0, x1, y1] = line!.slice(1).map(Number) as [number, number, number, number];
    expect(Math.abs(x1 - x0 - (y0 - y1))).toBeLessThan(40);
  });

  it('residuals: points and the zero line', async () => {
    const f = input.fits![0]!;
    const svg = await specToSvg(residualSpec('z', 'k', f.residuals!.byTerm[0]!.x, f.residuals!.residual, 600, 2), 'h');
    expect(countMarks(svg, 'points')).toBe(600);
    expect(countMarks(svg, 'zero')).toBe(1);
  });

  it('bound: sampled ratios keep the witness, one segment per stratum, the overall constant', async () => {
    const r = input.bounds![0]!.results[0]!;
    const spec = boundSpec('|3*k - z|', 'w', r, 400, 5);
    const svg = await specToSvg(spec, 'i');
    expect(countMarks(svg, 'points')).toBe(400);
    expect(countMarks(svg, 'strata')).toBe(r.strata.length);
    expect(countMarks(svg, 'overall')).toBe(1);
    const layer = (spec.layer as Array<{ name: string; data: { values: Array<{ q: number }> } }>).find((l) => l.name === 'points')!;
    // the largest ratio (the constant itself) is among the drawn points
    expect(Math.max(...layer.data.values.map((v) => v.q))).toBe(r.constant);
    expect(svg).toContain('keeping the 25 largest ratios');
  });

  it('bound: witness rows are ringed, and both axes are logarithmic when every value is positive', async () => {
    const r0 = input.bounds![0]!.results[0]!;
    const r = { ...r0, witnesses: r0.witnesses.map((w, k) => ({ ...w, by: r0.strata[0]!.low + k * 1e-3 })) };
    const spec = boundSpec('|3*k - z|', 'w', r, 400, 5);
    const svg = await specToSvg(spec, 'w');
    expect(countMarks(svg, 'witnesses')).toBe(r.witnesses.length);
    const layers = spec.layer as Array<{ name: string; encoding: { x: { scale: { type?: string } }; y: { scale: { type?: string } } } }>;
    const positive = r.points!.by.every((v) => v > 0) && r.points!.ratio.every((v) => !Number.isFinite(v) || v > 0);
    expect(positive).toBe(true); // the fixture: w > 0 and ratios > 0
    for (const l of layers.filter((x) => x.name !== 'overall')) expect([l.encoding.x.scale.type, l.encoding.y.scale.type]).toEqual(['log', 'log']);
    // a ratio ≤ 0 among the points switches the ratio axis back to linear
    const flat = boundSpec('|3*k - z|', 'w', { ...r, points: { by: r.points!.by, ratio: r.points!.ratio.map((v, i) => (i === 0 ? 0 : v)) } }, 400, 5);
    expect((flat.layer as typeof layers).find((l) => l.name === 'points')!.encoding.y.scale.type).toBeUndefined();
  });

  it('escapes a malicious name in every piece of SVG text (titles, axes, legend)', async () => {
    const s = { x: [1, 2, 3], y: [3, 1, 2], color: [0, 1, 2], xName: EVIL, yName: EVIL, colorName: EVIL };
    const svg = await specToSvg(scatterSpec(s, { maxPoints: 100, mode: 'bin', seed: 0 }), 'j');
    expect(svg).not.toMatch(/<img/i);
    expect((svg.match(/&lt;img src=x onerror=alert\(1\)&gt;/g) ?? []).length).toBeGreaterThanOrEqual(3);
  });
});

describe('PNG copies', () => {
  it('start with the PNG signature and decode to the SVG size times the scale', async () => {
    const svg = await specToSvg(attributionSpec('saliency', input.rank!.ranking), 'k');
    const w = Number(/<svg[^>]*\swidth="(\d+)"/.exec(svg)![1]);
    const h = Number(/<svg[^>]*\sheight="(\d+)"/.exec(svg)![1]);
    const png = svgToPng(svg, 2);
    // PNG spec §5.2: the eight signature bytes 137 80 78 71 13 10 26 10
    expect(Array.from(png.slice(0, 8))).toEqual(PNG_SIGNATURE);
    const img = decodePng(png);
    expect(img.width).toBe(2 * w);
    expect(img.height).toBe(2 * h);
    const ink = inkStats(img);
    expect(ink.inked).toBeGreaterThan(0.02);
    expect(ink.inked).toBeLessThan(0.9);
    expect(ink.distinct).toBeGreaterThan(10);
  });

  it('the decoder reads a known image: a red rectangle on white (known answer from the SVG itself)', () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="20" height="10"><rect x="0" y="0" width="10" height="10" fill="#ff0000"/></svg>';
    const img = decodePng(svgToPng(svg, 1));
    expect([img.width, img.height]).toEqual([20, 10]);
    const px = (x: number, y: number) => Array.from(img.pixels.slice((y * 20 + x) * img.channels, (y * 20 + x) * img.channels + 3));
    expect(px(2, 5)).toEqual([255, 0, 0]);
    expect(px(17, 5)).toEqual([255, 255, 255]);
  });
});
