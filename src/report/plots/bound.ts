import type { ReportBoundResult } from '../types.ts';
import type { PlotSpec } from '../render-plot.ts';
import { baseSpec, finitePairs, nonFiniteNote, sampleNote } from './common.ts';
import { largestIndices, sampleIndices } from '../sample.ts';
import { formatNumber } from '../format.ts';

/**
 * The ratio lhs/rhs of a bound against the `by` quantity (layer `points`, a seeded sample above
 * `maxPoints` that always keeps the largest ratios), the witness rows ringed (layer `witnesses`),
 * the per-stratum maximum as a horizontal segment across each stratum (layer `strata`), and the
 * overall constant (layer `overall`). Both axes are logarithmic when every value drawn on them is
 * positive, as the trend is fitted log–log there.
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
  const strata = r.strata.filter((s) => Number.isFinite(s.low) && Number.isFinite(s.high) && Number.isFinite(s.constant));
  const wits = r.witnesses.filter((w) => w.by !== undefined && Number.isFinite(w.by) && Number.isFinite(w.ratio));
  const positive = (xs: ArrayLike<number>) => Array.from(xs).every((v) => !Number.isFinite(v) || v > 0);
  const logX = (!pts || positive(pts.by)) && strata.every((s) => s.low > 0) && wits.every((w) => w.by! > 0);
  const logY = (!pts || positive(pts.ratio)) && strata.every((s) => s.constant > 0) && wits.every((w) => w.ratio > 0) && r.constant > 0;
  const xScale = logX ? { type: 'log' } : { zero: false };
  const yScale = logY ? { type: 'log' } : { zero: false };
  if (pts) {
    const n = Math.min(pts.by.length, pts.ratio.length);
    const keep = largestIndices(pts.ratio.slice(0, n), keepLargest);
    const idx = sampleIndices(n, maxPoints, seed, keep);
    const { rows, nonFinite } = finitePairs(pts.by, pts.ratio, idx);
    subtitle = sampleNote(idx.length, n, idx.length < n ? `, keeping the ${keep.length} largest ratios` : '') + nonFiniteNote(nonFinite);
    layers.push({
      name: 'points',
      data: { values: rows.map((p) => ({ b: p.x, q: p.y })) },
      mark: { type: 'circle', size: 10, opacity: 0.5, color: '#4c78a8' },
      encoding: {
        x: { field: 'b', type: 'quantitative', title: by, scale: xScale },
        y: { field: 'q', type: 'quantitative', title: `${lhs} / (${r.rhs})`, scale: yScale },
      },
    });
  }
  if (wits.length > 0) {
    layers.push({
      name: 'witnesses',
      data: { values: wits.map((w) => ({ b: w.by!, q: w.ratio, row: w.row })) },
      mark: { type: 'point', size: 90, filled: false, strokeWidth: 2, color: '#d62728' },
      encoding: {
        x: { field: 'b', type: 'quantitative', title: by, scale: xScale },
        y: { field: 'q', type: 'quantitative', title: `${lhs} / (${r.rhs})`, scale: yScale },
      },
    });
  }
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
  const axes = logX && logY ? '; log–log axes' : logX ? `; log axis for ${by}` : logY ? '; log axis for the ratio' : '';
  const note = `red: largest ratio within each stratum of ${by}${wits.length ? ', rings: witness rows' : ''}; dashed: overall constant ${formatNumber(r.constant)}${axes}`;
  return {
    ...baseSpec(`${lhs} ≤ c · (${r.rhs}): ratio against ${by}`, subtitle ? [subtitle, note] : note, 560, 340),
    layer: layers,
  };
}
