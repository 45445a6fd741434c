/**
 * Numbers as a reader sees them in the report: a few significant figures, plain decimals for
 * ordinary magnitudes, scientific notation for very small or very large ones.
 */

/**
 * `x` rounded to `digits` significant figures (ECMAScript `toPrecision`, round half away from
 * zero on the decimal expansion), trailing zeros dropped; integers below 10⁶ are shown whole;
 * |x| < 10⁻³ or ≥ 10⁶ in scientific notation (`1.5e-7`); NaN → `NaN`, ±∞ → `∞`/`-∞`; −0 → `0`.
 * @example formatNumber(Math.PI) // '3.142'
 * @example formatNumber(6.02214076e23) // '6.022e23'
 */
export function formatNumber(x: number, digits = 4): string {
  if (!Number.isInteger(digits) || digits < 1 || digits > 21) {
    throw new RangeError(`formatNumber: digits must be an integer in 1..21, got ${digits}`);
  }
  if (Number.isNaN(x)) return 'NaN';
  if (x === Infinity) return '∞';
  if (x === -Infinity) return '-∞';
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (Number.isInteger(x) && a < 1e6) return String(x);
  if (a >= 1e-3 && a < 1e6) {
    const p = Number(x.toPrecision(digits));
    if (Math.abs(p) >= 1e6) return sci(x, digits);
    if (Math.abs(p) >= 10 ** digits) return String(Math.round(p));
    return stripZeros(x.toPrecision(digits));
  }
  return sci(x, digits);
}

function sci(x: number, digits: number): string {
  const [m, e] = x.toExponential(digits - 1).split('e') as [string, string];
  return `${stripZeros(m)}e${e.startsWith('+') ? e.slice(1) : e}`;
}

function stripZeros(s: string): string {
  if (!s.includes('.') || s.includes('e')) return s;
  return s.replace(/0+$/, '').replace(/\.$/, '');
}

/**
 * A count with comma thousands separators; non-integers fall back to formatNumber.
 * @example formatCount(20000) // '20,000'
 */
export function formatCount(n: number): string {
  if (!Number.isInteger(n)) return formatNumber(n);
  const s = String(Math.abs(n)).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return n < 0 ? `-${s}` : s;
}

/** "low to high" with both ends formatted; a missing end is '—'. @example formatInterval(0.1, 0.25) // '0.1 to 0.25' */
export function formatInterval(low: number | null, high: number | null, digits = 4): string {
  return `${formatMaybe(low, digits)} to ${formatMaybe(high, digits)}`;
}

/** formatNumber, or '—' for null (a value the stage could not determine). */
export function formatMaybe(x: number | null | undefined, digits = 4): string {
  return x === null || x === undefined ? '—' : formatNumber(x, digits);
}
