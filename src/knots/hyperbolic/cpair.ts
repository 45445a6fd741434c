/**
 * Complex numbers as [re, im] pairs, for the geometric placements of ideal vertices in ℂ (2–3 / 3–2
 * moves, carried solutions, the horoball pattern of the maximal cusp). The hot solver loops keep
 * separate real and imaginary Float64Arrays instead.
 */
export type C = [number, number];

export const sub = (a: C, b: C): C => [a[0] - b[0], a[1] - b[1]];
export const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
/** a/b = a·b̄/|b|². */
export const div = (a: C, b: C): C => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
export const abs = (a: C): number => Math.hypot(a[0], a[1]);
export const abs2 = (a: C): number => a[0] * a[0] + a[1] * a[1];
