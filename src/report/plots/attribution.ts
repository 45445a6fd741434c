import type { Interval } from '../types.ts';
import type { PlotSpec } from '../render-plot.ts';
import { baseSpec } from './common.ts';

/**
 * Horizontal bars of each feature's attribution score, largest first, with a whisker from the
 * interval's low to high end. Shows at most `maxBars` features and says so when it cuts.
 * Marks: layer `bars` (one rect per feature), layer `whiskers` (one rule per feature).
 */
export function attributionSpec(method: string, ranking: readonly Interval[], maxBars = 30): PlotSpec {
  const sorted = [...ranking].sort((a, b) => b.score - a.score);
  const shown = sorted.slice(0, maxBars);
  const subtitle =
    shown.length < sorted.length
      ? `top ${shown.length} of ${sorted.length} features; whiskers: interval low to high`
      : 'whiskers: interval low to high';
  const values = shown.map((r, k) => ({ f: `${k + 1}. ${r.feature}`, s: r.score, lo: r.low, hi: r.high }));
  const y = { field: 'f', type: 'nominal', sort: null, title: null };
  return {
    ...baseSpec(`Attribution by ${method}`, subtitle, 520, Math.max(80, 22 * shown.length)),
    data: { values },
    layer: [
      {
        name: 'bars',
        mark: { type: 'bar', color: '#4c78a8' },
        encoding: { y, x: { field: 's', type: 'quantitative', title: 'score' } },
      },
      {
        name: 'whiskers',
        mark: { type: 'rule', color: '#222', strokeWidth: 1.5 },
        encoding: { y, x: { field: 'lo', type: 'quantitative' }, x2: { field: 'hi' } },
      },
    ],
  };
}
