/**
 * Strict parsing of one table cell: missing markers, real numbers in decimal or scientific
 * notation (checked after `Number()`, so `12abc`, `0x10` and `1_000` are text), the words for
 * non-finite values, and complex numbers written in one cell.
 */

/** Cell texts read as a missing value (case-insensitive, surrounding blanks ignored): empty, `NA`, `null`. */
export function isMissingText(s: string): boolean {
  const n = s.length;
  if (n === 0) return true;
  if (n > 6) return false;
  const t = s.trim().toLowerCase();
  return t === '' || t === 'na' || t === 'null';
}

const NONFINITE: Record<string, number> = {
  nan: NaN,
  '+nan': NaN,
  '-nan': NaN,
  inf: Infinity,
  '+inf': Infinity,
  '-inf': -Infinity,
  infinity: Infinity,
  '+infinity': Infinity,
  '-infinity': -Infinity,
};

/** true when the text is a decimal or scientific literal, digits only (no hex, octal, binary, separators). */
function isDecimalLiteral(t: string): boolean {
  // Number() already accepted the text; reject the non-decimal forms it also accepts.
  const c0 = t.charCodeAt(0);
  const first = c0 === 43 || c0 === 45 ? 1 : 0; // + or -
  if (t.length > first + 1 && t.charCodeAt(first) === 48) {
    const c1 = t.charCodeAt(first + 1) | 32;
    if (c1 === 120 || c1 === 111 || c1 === 98) return false; // 0x 0o 0b
  }
  const cl = t.charCodeAt(t.length - 1);
  // last char must be a digit or '.', which excludes 'Infinity' and trailing letters
  return (cl >= 48 && cl <= 57) || cl === 46;
}

/**
 * The number written in `s`, or undefined when `s` is not a number. Accepts decimal and
 * scientific notation and (case-insensitively) nan, inf, +inf, -inf, infinity. Blanks around the
 * number are ignored. Missing markers are NOT numbers here: test `isMissingText` first.
 * @example parseNumberText('1.5e3') // 1500
 * @example parseNumberText('12abc') // undefined
 */
export function parseNumberText(s: string): number | undefined {
  const x = Number(s);
  if (x === x && s.length > 0) {
    // x is not NaN; Number() also accepts hex, 'Infinity', and blanks
    const c0 = s.charCodeAt(0);
    if (((c0 >= 48 && c0 <= 57) || c0 === 45 || c0 === 43 || c0 === 46) && isDecimalLiteral(s)) return x;
    const t = s.trim();
    if (t.length === 0) return undefined;
    if (x === Infinity || x === -Infinity) {
      const v = NONFINITE[t.toLowerCase()];
      return v;
    }
    return isDecimalLiteral(t) ? x : undefined;
  }
  if (s.length > 10) return undefined;
  const v = NONFINITE[s.trim().toLowerCase()];
  return v;
}

const NUM = String.raw`(?:(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?|[nN][aA][nN]|[iI][nN][fF](?:[iI][nN][iI][tT][yY])?)`;
const SNUM = String.raw`[+-]?${NUM}`;
// a+bj, a-bi, with optional surrounding parentheses and blanks around the sign
const RE_RECT = new RegExp(String.raw`^\(?\s*(${SNUM})\s*([+-])\s*(${NUM})?\s*\*?\s*[ijIJ]\s*\)?$`);
// bj, -i, +2.5j
const RE_IMAG = new RegExp(String.raw`^\(?\s*([+-])?\s*(${NUM})?\s*\*?\s*[ijIJ]\s*\)?$`);
// (a, b)
const RE_PAIR = new RegExp(String.raw`^\(\s*(${SNUM})\s*,\s*(${SNUM})\s*\)$`);

/** a matched numeric part (decimal or nan/inf word) as a number */
function word(t: string): number {
  const v = parseNumberText(t);
  return v === undefined ? NaN : v;
}

/**
 * The complex number written in one cell, or undefined when the text is not one.
 * Forms: `1.5+2.25j`, `1.5-2.25i`, `(1.5+2.25j)`, `(1.5,2.25)`, `2.25j`, `-i`, and a plain real `3`.
 * @example parseComplexText('1.5-2.25i') // { re: 1.5, im: -2.25 }
 */
export function parseComplexText(s: string): { re: number; im: number } | undefined {
  const x = parseNumberText(s);
  if (x !== undefined) return { re: x, im: 0 };
  const t = s.trim();
  let m = RE_RECT.exec(t);
  if (m) {
    if ((t[0] === '(') !== (t[t.length - 1] === ')')) return undefined;
    const im = m[3] === undefined ? 1 : word(m[3]);
    return { re: word(m[1]!), im: m[2] === '-' ? -im : im };
  }
  m = RE_IMAG.exec(t);
  if (m) {
    if ((t[0] === '(') !== (t[t.length - 1] === ')')) return undefined;
    const im = m[2] === undefined ? 1 : word(m[2]);
    return { re: 0, im: m[1] === '-' ? -im : im };
  }
  m = RE_PAIR.exec(t);
  if (m) return { re: word(m[1]!), im: word(m[2]!) };
  return undefined;
}

/**
 * The shortest text that reads back as exactly `x` (ECMAScript Number::toString is the shortest
 * round-tripping decimal), keeping the sign of −0 and writing nan / inf / -inf.
 * @example formatNumber(0.1) // '0.1'
 */
export function formatNumber(x: number): string {
  if (x !== x) return 'nan';
  if (x === Infinity) return 'inf';
  if (x === -Infinity) return '-inf';
  if (x === 0 && 1 / x < 0) return '-0';
  return String(x);
}

/**
 * A complex value as `a+bj` (`a-bj` for negative or −0 imaginary part), each part by formatNumber.
 * @example formatComplex(1.5, -2) // '1.5-2j'
 */
export function formatComplex(re: number, im: number): string {
  const neg = im < 0 || (im === 0 && 1 / im < 0) || im === -Infinity;
  const mag = im !== im ? 'nan' : formatNumber(Math.abs(im));
  return `${formatNumber(re)}${neg ? '-' : '+'}${mag}j`;
}
