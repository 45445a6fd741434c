import type { PlotSpec } from '../render-plot.ts';
import { baseSpec } from './common.ts';

/**
 * Partial dependence of the network on one quantity (Friedman 2001, §8.2): the mean prediction
 * over held-out rows when the quantity is set to each grid value (layer `curve`, points joined).
 */
export function dependenceSpec(target: string, d: { feature: string; x: number[]; mean: number[] }, task: 'regression' | 'classification'): PlotSpec {
  const values = d.x.map((x, k) => ({ x, m: d.mean[k]! })).filter((v) => Number.isFinite(v.x) && Number.isFinite(v.m));
  const what = task === 'classification' ? `mean expected ${target} (Σ p_k c_k)` : `mean predicted ${target}`;
  return {
    ...baseSpec(`${target} as ${d.feature} varies`, [`${what} over held-out rows, with ${d.feature} set to each value and every other input kept`], 480, 300),
    data: { values },
    layer: [
      {
        name: 'curve',
        mark: { type: 'line', point: { size: 30 }, color: '#4c78a8' },
        encoding: {
          x: { field: 'x', type: 'quantitative', title: d.feature, scale: { zero: false } },
          y: { field: 'm', type: 'quantitative', title: what, scale: { zero: false } },
        },
      },
    ],
  };
}
