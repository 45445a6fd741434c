import type { ReportBoundResult } from '../types.ts';
import type { PlotSpec } from '../render-plot.ts';
import { baseSpec, finitePairs, nonFiniteNote, sampleNote } from './common.ts';
import { largestIndices, sampleIndices } from '../sample.ts';
import { formatNumber } from '../format.ts';

/**
 * The ratio lhs/rhs of a bound against the `by` quantity (layer `points`, a seeded sample above
 * `maxPoints` that always keeps the largest ratios; coloured by a label column such as the family
 * when one is given), the per-stratum maximum as a horizontal segment across each stratum (layer
 * `strata`), the overall constant (layer `overall`) and the witness rows as black diamonds (layer
 * `witnesses`). Axes are logarithmic where every value drawn on them is positive: the trend is a
 * log–log slope.
 */
export function boundSpec(
  lhs: string,
  by: string,
  r: ReportBoundResult,
  maxPoints: number,
  seed: number,
  keepLargest = 25,
): PlotSpec {
  const layers: unknown[] = [];
  let subtitle = '';
  const pts = r.points;
  const witnesses = r.witnesses.filter((w) => w.by !== undefined && Number.isFinite(w.by) && Number.isFinite(w.ratio));
  const positive = (v: number[]) => v.length > 0 && v.every((x) => x > 0);
  const byValues = [...(pts ? pts.by.filter(Number.isFinite) : []), ...r.strata.flatMap((s) => [s.low, s.high])];
  const ratioValues = [...(pts ? pts.ratio.filter(Number.isFinite) : []), ...r.strata.map((s) => s.constant)];
  const logX = positive(byValues);
  const logY = positive(ratioValues);
  const xScale = logX ? { type: 'log' } : { zero: false };
  const yScale = logY ? { type: 'log' } : {};
  if (pts) {
    const n = Math.min(pts.by.length, pts.ratio.length);
    const keep = largestIndices(pts.ratio.slice(0, n), keepLargest);
    const idx = sampleIndices(n, maxPoints, seed, keep);
    const { rows, nonFinite } = finitePairs(pts.by, pts.ratio, idx);
    const total = Math.max(n, pts.sampledFrom ?? n);
    subtitle = sampleNote(idx.length, total, idx.length < total ? `, keeping the ${keep.length} largest ratios` : '') + nonFiniteNote(nonFinite);
    const lab = pts.labels;
    layers.push({
      name: 'points',
      data: { values: rows.map((p) => ({ b: p.x, q: p.y, ...(lab ? { g: lab.values[p.i] ?? '' } : {}) })) },
      mark: { type: 'circle', size: 14, opacity: 0.55, ...(lab ? {} : { color: '#4c78a8' }) },
      encoding: {
        x: { field: 'b', type: 'quantitative', title: by, scale: xScale },
        y: { field: 'q', type: 'quantitative', title: `${lhs} / (${r.rhs})`, scale: yScale },
        ...(lab ? { color: { field: 'g', type: 'nominal', title: lab.name, scale: { scheme: 'tableau10' } } } : {}),
      },
    });
  }
  const strata = r.strata.filter((s) => Number.isFinite(s.low) && Number.isFinite(s.high) && Number.isFinite(s.constant));
  if (strata.length > 0) {
    layers.push({
      name: 'strata',
      data: { values: strata.map((s) => ({ b: s.low, b2: s.high, q: s.constant })) },
      mark: { type: 'rule', color: '#d62728', strokeWidth: 2.5 },
      encoding: {
        x: { field: 'b', type: 'quantitative', title: by, scale: xScale },
        x2: { field: 'b2' },
        y: { field: 'q', type: 'quantitative', title: `${lhs} / (${r.rhs})`, scale: yScale },
      },
    });
  }
  if (Number.isFinite(r.constant)) {
    layers.push({
      name: 'overall',
      data: { values: [{ q: r.constant }] },
      mark: { type: 'rule', color: '#555', strokeDash: [4, 4] },
      encoding: { y: { field: 'q', type: 'quantitative' } },
    });
  }
  if (witnesses.length > 0) {
    layers.push({
      name: 'witnesses',
      data: { values: witnesses.map((w) => ({ b: w.by, q: w.ratio, row: w.row })) },
      mark: { type: 'point', shape: 'diamond', size: 110, filled: false, color: '#111', strokeWidth: 1.6 },
      encoding: {
        x: { field: 'b', type: 'quantitative', scale: xScale },
        y: { field: 'q', type: 'quantitative', scale: yScale },
      },
    });
  }
  const axes = logX && logY ? 'log–log axes' : logX ? `log axis for ${by} (ratios of 0 occur, so the ratio axis is linear)` : logY ? 'log axis for the ratio' : '';
  const note = `red: largest ratio within each stratum of ${by}; dashed: overall constant ${formatNumber(r.constant)}${witnesses.length ? '; diamonds: witness rows' : ''}${axes ? `; ${axes}` : ''}`;
  return {
    ...baseSpec(`${lhs} ≤ c * (${r.rhs}): ratio against ${by}`, subtitle ? [subtitle, note] : note, 560, 340),
    layer: layers,
  };
}
