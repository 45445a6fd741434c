/**
 * Deterministic thinning of large point sets for plots: a seeded sample that always keeps the
 * rows that matter (e.g. the witnesses of a bound), and a 2-D histogram that keeps every row.
 */

export { sampleIndices, largestIndices } from '../util/sample.ts';

export interface Bin2d {
  nx: number;
  ny: number;
  xMin: number;
  xMax: number;
  yMin: number;
  yMax: number;
  /** Non-empty cells only, in row-major order. */
  cells: Array<{ x0: number; x1: number; y0: number; y1: number; count: number; mean: number | null }>;
  /** Rows counted into cells. */
  binned: number;
  /** Rows left out because x or y (or the colour value, when given) was not finite. */
  nonFinite: number;
}

/**
 * A 2-D histogram of (x, y) on an nx × ny grid spanning the finite data; a point on the upper
 * edge falls into the last cell. With `color`, each cell also carries the mean colour value of
 * its rows (Neumaier-compensated sum, A. Neumaier, ZAMM 54, 1974). Every finite row is counted.
 */
export function bin2d(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  nx: number,
  ny: number,
  color?: ArrayLike<number>,
): Bin2d {
  const n = x.length;
  let xMin = Infinity, xMax = -Infinity, yMin = Infinity, yMax = -Infinity;
  const ok = (i: number) =>
    Number.isFinite(x[i]!) && Number.isFinite(y[i]!) && (color === undefined || Number.isFinite(color[i]!));
  let nonFinite = 0;
  for (let i = 0; i < n; i++) {
    if (!ok(i)) {
      nonFinite++;
      continue;
    }
    if (x[i]! < xMin) xMin = x[i]!;
    if (x[i]! > xMax) xMax = x[i]!;
    if (y[i]! < yMin) yMin = y[i]!;
    if (y[i]! > yMax) yMax = y[i]!;
  }
  if (!(xMin <= xMax)) return { nx, ny, xMin: 0, xMax: 0, yMin: 0, yMax: 0, cells: [], binned: 0, nonFinite };
  if (xMin === xMax) { xMin -= 0.5; xMax += 0.5; }
  if (yMin === yMax) { yMin -= 0.5; yMax += 0.5; }
  const count = new Float64Array(nx * ny);
  const sum = new Float64Array(nx * ny);
  const comp = new Float64Array(nx * ny);
  const wx = (xMax - xMin) / nx;
  const wy = (yMax - yMin) / ny;
  for (let i = 0; i < n; i++) {
    if (!ok(i)) continue;
    const cx = Math.min(nx - 1, Math.floor((x[i]! - xMin) / wx));
    const cy = Math.min(ny - 1, Math.floor((y[i]! - yMin) / wy));
    const c = cy * nx + cx;
    count[c]!++;
    if (color !== undefined) {
      const v = color[i]!;
      const s = sum[c]!;
      const t = s + v;
      comp[c]! += Math.abs(s) >= Math.abs(v) ? s - t + v : v - t + s;
      sum[c] = t;
    }
  }
  const cells: Bin2d['cells'] = [];
  let binned = 0;
  for (let cy = 0; cy < ny; cy++) {
    for (let cx = 0; cx < nx; cx++) {
      const c = cy * nx + cx;
      if (count[c] === 0) continue;
      binned += count[c]!;
      cells.push({
        x0: xMin + cx * wx,
        x1: cx === nx - 1 ? xMax : xMin + (cx + 1) * wx,
        y0: yMin + cy * wy,
        y1: cy === ny - 1 ? yMax : yMin + (cy + 1) * wy,
        count: count[c]!,
        mean: color === undefined ? null : (sum[c]! + comp[c]!) / count[c]!,
      });
    }
  }
  return { nx, ny, xMin, xMax, yMin, yMax, cells, binned, nonFinite };
}
