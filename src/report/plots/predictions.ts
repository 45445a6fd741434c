import type { PlotSpec } from '../render-plot.ts';
import { baseSpec, finitePairs, nonFiniteNote, sampleNote } from './common.ts';
import { sampleIndices } from '../sample.ts';

/**
 * The network's prediction against the actual value on held-out rows (layer `points`), with the
 * line y = x (layer `identity`) spanning the data. Above `maxPoints` rows a seeded sample.
 */
export function predictionSpec(
  target: string,
  p: { actual: number[]; predicted: number[] },
  maxPoints: number,
  seed: number,
  task: 'regression' | 'classification' = 'regression',
): PlotSpec {
  const idx = sampleIndices(p.actual.length, maxPoints, seed);
  const { rows, nonFinite } = finitePairs(p.actual, p.predicted, idx);
  let lo = Infinity;
  let hi = -Infinity;
  for (const r of rows) {
    lo = Math.min(lo, r.x, r.y);
    hi = Math.max(hi, r.x, r.y);
  }
  if (!(lo <= hi)) { lo = 0; hi = 1; }
  const cls = task === 'classification';
  const subtitle = [`held-out rows: ${sampleNote(idx.length, p.actual.length)}${nonFiniteNote(nonFinite)}`, 'dashed line: predicted = actual'];
  if (cls) subtitle.push('classification: the prediction drawn is the expected value Σ p_k c_k over the classes c_k with the network’s probabilities p_k, not the predicted class');
  return {
    ...baseSpec(`Predicted against actual ${target}`, subtitle, 420, 420),
    layer: [
      {
        name: 'points',
        data: { values: rows.map((r) => ({ a: r.x, p: r.y })) },
        mark: { type: 'circle', size: 10, opacity: 0.6 },
        encoding: {
          x: { field: 'a', type: 'quantitative', title: `actual ${target}`, scale: { zero: false } },
          y: { field: 'p', type: 'quantitative', title: cls ? `expected ${target} (Σ p_k c_k)` : `predicted ${target}`, scale: { zero: false } },
        },
      },
      {
        name: 'identity',
        data: { values: [{ a: lo, p: lo }, { a: hi, p: hi }] },
        mark: { type: 'line', color: '#d62728', strokeDash: [6, 4] },
        encoding: { x: { field: 'a', type: 'quantitative' }, y: { field: 'p', type: 'quantitative' } },
      },
    ],
  };
}
