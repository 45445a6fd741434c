/**
 * Orthogonal (total least squares) line through points (x_i, y_i): the line minimising the sum of
 * squared perpendicular distances, i.e. errors of equal variance in x and in y. With centred sums
 * s_xx, s_yy, s_xy the slope is b = (s_yy − s_xx + √((s_yy − s_xx)² + 4 s_xy²)) / (2 s_xy) and the
 * line passes through the means (Deming regression with variance ratio 1; Van Huffel & Vandewalle,
 * "The Total Least Squares Problem", SIAM 1991, §2.3; Golub & Van Loan, Matrix Computations, §6.3).
 * Without an intercept the sums are taken about 0 and the line passes through the origin.
 * Unlike ordinary least squares it depends on the units of x and y. s_xy = 0 gives NaN (no
 * preferred direction when s_xx = s_yy; otherwise slope 0 or vertical: returned as NaN too).
 * @example orthogonalLine([0, 1, 2], [0, 2, 4]) // { slope: 2, intercept: 0 }
 */
export function orthogonalLine(x: ArrayLike<number>, y: ArrayLike<number>, intercept = true): { slope: number; intercept: number } {
  const n = x.length;
  let mx = 0;
  let my = 0;
  if (intercept) {
    for (let i = 0; i < n; i++) {
      mx += x[i]!;
      my += y[i]!;
    }
    mx /= n;
    my /= n;
  }
  let sxx = 0;
  let syy = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i]! - mx;
    const dy = y[i]! - my;
    sxx += dx * dx;
    syy += dy * dy;
    sxy += dx * dy;
  }
  if (sxy === 0) return { slope: NaN, intercept: NaN };
  const d = syy - sxx;
  const r = Math.hypot(d, 2 * sxy);
  // the two algebraically equal forms, chosen so that nothing cancels: (d + r)/(2 s_xy) = 2 s_xy/(r − d)
  const slope = d >= 0 ? (d + r) / (2 * sxy) : (2 * sxy) / (r - d);
  return { slope, intercept: intercept ? my - slope * mx : 0 };
}
