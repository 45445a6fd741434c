import type { PlotSpec } from '../render-plot.ts';
import { baseSpec, finitePairs, nonFiniteNote, sampleNote } from './common.ts';
import { sampleIndices } from '../sample.ts';

/**
 * Residuals of a fitted relation against one of its terms (layer `points`) with the zero line
 * (layer `zero`). Above `maxPoints` rows a seeded sample; `sampledFrom`: the rows the points
 * handed in were already sampled from (the note counts those).
 */
export function residualSpec(
  target: string,
  term: string,
  x: number[],
  residual: number[],
  maxPoints: number,
  seed: number,
  sampledFrom?: number,
): PlotSpec {
  const n = Math.min(x.length, residual.length);
  const idx = sampleIndices(n, maxPoints, seed);
  const { rows, nonFinite } = finitePairs(x, residual, idx);
  return {
    ...baseSpec(`Residuals of ${target} against ${term}`, `${sampleNote(idx.length, Math.max(n, sampledFrom ?? n))}${nonFiniteNote(nonFinite)}`, 520, 300),
    layer: [
      {
        name: 'points',
        data: { values: rows.map((r) => ({ x: r.x, r: r.y })) },
        mark: { type: 'circle', size: 10, opacity: 0.6 },
        encoding: {
          x: { field: 'x', type: 'quantitative', title: term, scale: { zero: false } },
          y: { field: 'r', type: 'quantitative', title: 'residual' },
        },
      },
      {
        name: 'zero',
        data: { values: [{ r: 0 }] },
        mark: { type: 'rule', color: '#d62728', strokeDash: [6, 4] },
        encoding: { y: { field: 'r', type: 'quantitative' } },
      },
    ],
  };
}
