/**
 * Log relative error, the accuracy measure NIST uses for StRD (McCullough, "Assessing the
 * reliability of statistical software", The American Statistician 52, 1998):
 * LRE = −log10(|q − c| / |c|), or −log10|q − c| when c = 0; capped at 15 (agreement to the digits given).
 */
export function lre(q: number, c: number): number {
  if (q === c) return 15;
  const e = c === 0 ? Math.abs(q) : Math.abs(q - c) / Math.abs(c);
  return Math.min(15, -Math.log10(e));
}
