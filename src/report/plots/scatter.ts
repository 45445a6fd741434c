import type { ReportScatter } from '../types.ts';
import type { PlotSpec } from '../render-plot.ts';
import { baseSpec, finitePairs, nonFiniteNote, sampleNote } from './common.ts';
import { bin2d, sampleIndices } from '../sample.ts';
import { formatCount } from '../format.ts';

export interface ScatterSettings {
  maxPoints: number;
  mode: 'bin' | 'sample';
  seed: number;
  /** Grid of the 2-D histogram (default 80 × 60). */
  grid?: [number, number];
}

/**
 * The target (y) against the top feature (x), coloured by a label column (e.g. the family) when
 * one is given, else by the second feature. Up to `maxPoints`
 * rows are drawn as points (layer `points`); above that either a 2-D histogram of every row whose
 * cells are coloured by the mean of the colour variable (layer `cells`), or a seeded sample.
 * The subtitle says which.
 */
export function scatterSpec(s: ReportScatter, set: ScatterSettings): PlotSpec {
  const n = s.x.length;
  const total = s.sampledFrom !== undefined && s.sampledFrom > n ? s.sampledFrom : n;
  const pre = total > n ? ` (the input was already a sample of ${formatCount(total)} rows)` : '';
  const title = `${s.yName} against ${s.xName}`;
  const colorTitle = s.colorName ?? 'colour';
  if (n > set.maxPoints && set.mode === 'bin') {
    const [nx, ny] = set.grid ?? [80, 60];
    const b = bin2d(s.x, s.y, nx, ny, s.color);
    const what = s.color ? `colour: mean ${colorTitle} per cell` : 'colour: rows per cell';
    const subtitle = [`all ${formatCount(b.binned)} rows binned on a ${nx} by ${ny} grid${pre}${nonFiniteNote(b.nonFinite)}`, what];
    const values = b.cells.map((c) => ({ x0: c.x0, x1: c.x1, y0: c.y0, y1: c.y1, n: c.count, c: c.mean ?? c.count }));
    return {
      ...baseSpec(title, subtitle),
      data: { values },
      layer: [
        {
          name: 'cells',
          mark: { type: 'rect' },
          encoding: {
            x: { field: 'x0', type: 'quantitative', title: s.xName, scale: { zero: false } },
            x2: { field: 'x1' },
            y: { field: 'y0', type: 'quantitative', title: s.yName, scale: { zero: false } },
            y2: { field: 'y1' },
            color: {
              field: 'c',
              type: 'quantitative',
              title: s.color ? `mean ${colorTitle}` : 'rows',
              scale: { scheme: 'viridis' },
            },
          },
        },
      ],
    };
  }
  const idx = sampleIndices(n, set.maxPoints, set.seed);
  const { rows, nonFinite } = finitePairs(s.x, s.y, idx);
  const lab = s.labels;
  const values = rows.map((r) => ({ x: r.x, y: r.y, c: lab ? (lab.values[r.i] ?? '') : s.color ? s.color[r.i] : null }));
  const subtitle = [`${sampleNote(idx.length, n)}${pre}${nonFiniteNote(nonFinite)}`];
  if (lab) subtitle.push(`colour: ${lab.name}`);
  else if (s.color) subtitle.push(`colour: ${colorTitle}`);
  const encoding: Record<string, unknown> = {
    x: { field: 'x', type: 'quantitative', title: s.xName, scale: { zero: false } },
    y: { field: 'y', type: 'quantitative', title: s.yName, scale: { zero: false } },
  };
  if (lab) encoding.color = { field: 'c', type: 'nominal', title: lab.name, scale: { scheme: 'tableau10' } };
  else if (s.color) encoding.color = { field: 'c', type: 'quantitative', title: colorTitle, scale: { scheme: 'viridis' } };
  return {
    ...baseSpec(title, subtitle),
    data: { values },
    layer: [{ name: 'points', mark: { type: 'circle', size: 10, opacity: 0.7 }, encoding }],
  };
}
