/**
 * Benchmark of the report stage on a demo-sized input: 100,000 rows behind the scatter, the
 * predictions, the residuals and two bounds (targets: render in a few seconds — say under 5 s —
 * and every SVG under 2 MB). Run: node --import tsx bench/report.ts
 * Timings on a shared machine are noisy: the best of 3 is shown.
 */
import { renderReport } from '../src/report/index.ts';
import { makeInput } from '../tests/report/fixture-input.ts';

const N = 100_000;
const input = makeInput(N, 7);
let best = Infinity;
let last: Awaited<ReturnType<typeof renderReport>> | undefined;
for (let k = 0; k < 3; k++) {
  const t0 = performance.now();
  last = await renderReport(input);
  best = Math.min(best, performance.now() - t0);
}
let bestNoPng = Infinity;
for (let k = 0; k < 3; k++) {
  const t0 = performance.now();
  await renderReport(input, { png: false });
  bestNoPng = Math.min(bestNoPng, performance.now() - t0);
}
const r = last!;
const biggest = Math.max(...r.plots.map((p) => p.svg.length));
const pngTotal = r.plots.reduce((s, p) => s + p.png.length, 0);
console.log(`renderReport, ${N.toLocaleString('en-US')} rows, ${r.plots.length} plots: ${(best / 1000).toFixed(2)} s (target < 5 s)`);
console.log(`  of which without PNG copies (HTML, Markdown, SVG only): ${(bestNoPng / 1000).toFixed(2)} s`);
console.log(`largest SVG: ${(biggest / 1e6).toFixed(2)} MB (target < 2 MB)`);
console.log(`report.html: ${(r.html.length / 1e6).toFixed(2)} MB; report.md: ${(r.markdown.length / 1e3).toFixed(1)} kB; PNGs: ${(pngTotal / 1e6).toFixed(2)} MB`);
