import type { Dataset } from '../table/dataset.ts';
import { formatColumnName } from '../table/expr/format.ts';
import { PLOT_POINTS, sampleIndices } from '../util/sample.ts';

/** The target against the leading ranked groups on the rows used, for plotting. */
export interface RankPoints {
  /** 1-based data rows of the points. */
  rows: number[];
  target: number[];
  /** Up to two groups, best ranked first: the group, the quantity plotted (an expression) and its values. */
  groups: Array<{ group: string; expression: string; values: number[] }>;
  /** Rows used in all (the points are a seeded sample of at most PLOT_POINTS of them). */
  sampledFrom: number;
}

/**
 * The plotted quantity of a group, or null: a group of one feature is that feature; the group of a
 * complex column X (features X.re, X.im) is |X| = hypot(re, im); other groups have no one value.
 */
function groupValues(ds: Dataset, group: { name: string; members: number[] }): { expression: string; values: (i: number) => number } | null {
  const names = group.members.map((j) => ds.featureNames[j]!);
  if (names.length === 1 && names[0] === group.name) {
    const x = ds.x[group.members[0]!]!;
    return { expression: formatColumnName(group.name), values: (i) => x[i]! };
  }
  if (names.length === 2 && names[0] === `${group.name}.re` && names[1] === `${group.name}.im`) {
    const re = ds.x[group.members[0]!]!;
    const im = ds.x[group.members[1]!]!;
    return { expression: `abs(${formatColumnName(group.name)})`, values: (i) => Math.hypot(re[i]!, im[i]!) };
  }
  return null;
}

/**
 * The target and the first two plottable groups of `ranked` (group names, best first) on the
 * dataset's rows: all of them up to PLOT_POINTS, else a seeded sample (sampleIndices).
 */
export function rankPoints(ds: Dataset, ranked: readonly string[], seed: number): RankPoints {
  const chosen: Array<{ group: string; expression: string; values: (i: number) => number }> = [];
  for (const name of ranked) {
    const g = ds.groups.find((x) => x.name === name);
    const v = g ? groupValues(ds, g) : null;
    if (v) chosen.push({ group: name, ...v });
    if (chosen.length === 2) break;
  }
  const idx = sampleIndices(ds.y.length, PLOT_POINTS, seed);
  return {
    rows: Array.from(idx, (i) => ds.rows[i]! + 1),
    target: Array.from(idx, (i) => ds.y[i]!),
    groups: chosen.map((c) => ({ group: c.group, expression: c.expression, values: Array.from(idx, (i) => c.values(i)) })),
    sampledFrom: ds.y.length,
  };
}
