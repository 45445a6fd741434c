import type { ReportBoundResult } from '../types.ts';
import type { PlotSpec } from '../render-plot.ts';
import { baseSpec, finitePairs, nonFiniteNote, sampleNote } from './common.ts';
import { largestIndices, sampleIndices } from '../sample.ts';
import { formatNumber } from '../format.ts';

/**
 * The ratio lhs/rhs of a bound against the `by` quantity (layer `points`, a seeded sample above
 * `maxPoints` that always keeps the largest ratios), the per-stratum maximum as a horizontal
 * segment across each stratum (layer `strata`), and the overall constant (layer `overall`).
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
        x: { field: 'b', type: 'quantitative', title: by, scale: { zero: false } },
        y: { field: 'q', type: 'quantitative', title: `${lhs} / (${r.rhs})` },
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
        x: { field: 'b', type: 'quantitative', title: by, scale: { zero: false } },
        x2: { field: 'b2' },
        y: { field: 'q', type: 'quantitative', title: `${lhs} / (${r.rhs})` },
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
  const note = `red: largest ratio within each stratum of ${by}; dashed: overall constant ${formatNumber(r.constant)}`;
  return {
    ...baseSpec(`${lhs} ≤ c · (${r.rhs}): ratio against ${by}`, subtitle ? [subtitle, note] : note, 560, 340),
    layer: layers,
  };
}
