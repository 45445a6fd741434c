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

// Exact powers of ten: 10^k is a double exactly for k <= 22 (5^22 < 2^53).
const POW10 = [1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22];
const SPLIT = 134217729; // 2^27 + 1, Dekker's splitting constant
/** 2^-80: a bound on the relative error of the double-double evaluation below (which is about 2^-100). */
const DD_SLACK = 2 ** -80;

/** The value of the last successful `scanDecimal`. */
export const scannedValue = new Float64Array(1);

/**
 * Read a plain decimal literal `[+-]digits[.digits][(e|E)[+-]digits]` from `t[start..end)` straight
 * from its character codes, stopping at `end` or at the first character equal to `stop`. Returns
 * the stopping index and leaves the value in `scannedValue[0]`, or returns -1 (nothing stored) when
 * the text is anything else (blanks, words, hex, ...) or when exact rounding is not guaranteed here
 * (more than 19 significant digits, a power of ten beyond ±22): callers then use `Number()`.
 * The value is bit-identical to `Number()` (ECMA-262 StringToNumber, correctly rounded):
 * - up to 15 significant digits and |e| <= 22, the significand and 10^|e| are exact doubles and one
 *   IEEE multiplication or division rounds correctly (Clinger 1990, "How to read floating point
 *   numbers accurately", the fast path);
 * - 16 to 19 digits whose significand is below 2^53: the same (the significand is still exact);
 * - other 16 to 19 digit significands: significand × 10^e in double-double arithmetic (Dekker 1971 exact products,
 *   Knuth's two-sum), relative error below 2^-100; the rounded value is taken only when rounding
 *   both ends of an interval of relative width 2^-80 around it gives the same double (rounding is
 *   monotonic), otherwise -1.
 */
export function scanDecimal(t: string, start: number, end: number, stop: number): number {
  let i = start;
  let c = i < end ? t.charCodeAt(i) : -1;
  let neg = false;
  if (c === 45 || c === 43) {
    neg = c === 45;
    c = ++i < end ? t.charCodeAt(i) : -1;
  }
  let a = 0; // first 15 significant digits
  let b = 0; // digits 16..19
  let nb = 0;
  let nd = 0; // significant digits (from the first nonzero one)
  let scale = 0; // value = (a·10^nb + b) · 10^scale
  let digits = false;
  while (c >= 48 && c <= 57) {
    digits = true;
    if (nd > 0 || c !== 48) {
      if (nd < 15) a = a * 10 + (c - 48);
      else if (nd < 19) {
        b = b * 10 + (c - 48);
        nb++;
      } else return -1;
      nd++;
    }
    c = ++i < end ? t.charCodeAt(i) : -1;
  }
  if (c === 46) {
    c = ++i < end ? t.charCodeAt(i) : -1;
    while (c >= 48 && c <= 57) {
      digits = true;
      if (nd > 0 || c !== 48) {
        if (nd < 15) a = a * 10 + (c - 48);
        else if (nd < 19) {
          b = b * 10 + (c - 48);
          nb++;
        } else return -1;
        nd++;
      }
      scale--;
      c = ++i < end ? t.charCodeAt(i) : -1;
    }
  }
  if (!digits) return -1;
  if (c === 101 || c === 69) {
    c = ++i < end ? t.charCodeAt(i) : -1;
    let eneg = false;
    if (c === 45 || c === 43) {
      eneg = c === 45;
      c = ++i < end ? t.charCodeAt(i) : -1;
    }
    if (!(c >= 48 && c <= 57)) return -1;
    let ex = 0;
    while (c >= 48 && c <= 57) {
      if (ex < 100000) ex = ex * 10 + (c - 48);
      c = ++i < end ? t.charCodeAt(i) : -1;
    }
    scale += eneg ? -ex : ex;
  }
  if (i < end && c !== stop) return -1;
  return compose(neg, a, b, nb, nd, scale) ? i : -1;
}

/**
 * `scanDecimal` over the bytes of ASCII text (`t[i]` is the character code at i), same value; it
 * also stops at a line end (LF, or CR before LF or at `end`), returning the index of that LF/CR.
 */
export function scanDecimalBytes(t: Uint8Array, start: number, end: number, stop: number): number {
  let i = start;
  let c = i < end ? t[i]! : -1;
  let neg = false;
  if (c === 45 || c === 43) {
    neg = c === 45;
    c = ++i < end ? t[i]! : -1;
  }
  let a = 0; // first 15 significant digits
  let b = 0; // digits 16..19
  let nb = 0;
  let nd = 0; // significant digits (from the first nonzero one)
  let scale = 0; // value = (a·10^nb + b) · 10^scale
  let digits = false;
  while (c >= 48 && c <= 57) {
    digits = true;
    if (nd > 0 || c !== 48) {
      if (nd < 15) a = a * 10 + (c - 48);
      else if (nd < 19) {
        b = b * 10 + (c - 48);
        nb++;
      } else return -1;
      nd++;
    }
    c = ++i < end ? t[i]! : -1;
  }
  if (c === 46) {
    c = ++i < end ? t[i]! : -1;
    while (c >= 48 && c <= 57) {
      digits = true;
      if (nd > 0 || c !== 48) {
        if (nd < 15) a = a * 10 + (c - 48);
        else if (nd < 19) {
          b = b * 10 + (c - 48);
          nb++;
        } else return -1;
        nd++;
      }
      scale--;
      c = ++i < end ? t[i]! : -1;
    }
  }
  if (!digits) return -1;
  if (c === 101 || c === 69) {
    c = ++i < end ? t[i]! : -1;
    let eneg = false;
    if (c === 45 || c === 43) {
      eneg = c === 45;
      c = ++i < end ? t[i]! : -1;
    }
    if (!(c >= 48 && c <= 57)) return -1;
    let ex = 0;
    while (c >= 48 && c <= 57) {
      if (ex < 100000) ex = ex * 10 + (c - 48);
      c = ++i < end ? t[i]! : -1;
    }
    scale += eneg ? -ex : ex;
  }
  if (i < end && c !== stop && c !== 10 && !(c === 13 && (i + 1 === end || t[i + 1] === 10))) return -1;
  return compose(neg, a, b, nb, nd, scale) ? i : -1;
}

/** (a·10^nb + b)·10^scale, negated when `neg`, into scannedValue[0] when exactly rounded here (see scanDecimal). */
function compose(neg: boolean, a: number, b: number, nb: number, nd: number, scale: number): boolean {
  let x: number;
  if (nd === 0) x = 0;
  else if (scale > 22 || scale < -22) return false;
  else if (nb === 0) x = scale === 0 ? a : scale > 0 ? a * POW10[scale]! : a / POW10[-scale]!;
  else if ((x = a * POW10[nb]! + b) < 9007199254740992) {
    // 16 to 19 digits but below 2^53: the significand is still an exact double (Clinger's fast path)
    if (scale !== 0) x = scale > 0 ? x * POW10[scale]! : x / POW10[-scale]!;
  } else {
    // W = a·10^nb + b exactly as wh + wl
    const P = POW10[nb]!;
    let ph = a * P;
    let s = SPLIT * a;
    let xh = s - (s - a);
    let xl = a - xh;
    s = SPLIT * P;
    let yh = s - (s - P);
    let yl = P - yh;
    let pl = xh * yh - ph + xh * yl + xl * yh + xl * yl;
    const sh = ph + b; // two-sum (ph, b)
    const bv = sh - ph;
    const sl = ph - (sh - bv) + (b - bv) + pl;
    const wh = sh + sl;
    const wl = sl - (wh - sh);
    let hi: number;
    let lo: number;
    if (scale === 0) {
      hi = wh;
      lo = wl;
    } else if (scale > 0) {
      const Q = POW10[scale]!;
      ph = wh * Q;
      s = SPLIT * wh;
      xh = s - (s - wh);
      xl = wh - xh;
      s = SPLIT * Q;
      yh = s - (s - Q);
      yl = Q - yh;
      pl = xh * yh - ph + xh * yl + xl * yh + xl * yl + wl * Q;
      hi = ph + pl;
      lo = pl - (hi - ph);
    } else {
      const Q = POW10[-scale]!;
      const q1 = wh / Q;
      // remainder wh + wl - q1·Q, with q1·Q exact as ph + pl
      ph = q1 * Q;
      s = SPLIT * q1;
      xh = s - (s - q1);
      xl = q1 - xh;
      s = SPLIT * Q;
      yh = s - (s - Q);
      yl = Q - yh;
      pl = xh * yh - ph + xh * yl + xl * yh + xl * yl;
      const q2 = (wh - ph - pl + wl) / Q;
      hi = q1 + q2;
      lo = q2 - (hi - q1);
    }
    const slack = (hi < 0 ? -hi : hi) * DD_SLACK;
    if (hi + (lo + slack) !== hi || hi + (lo - slack) !== hi) return false;
    x = hi;
  }
  scannedValue[0] = neg ? -x : x;
  return true;
}

/**
 * The number written in `s`, or undefined when `s` is not a number. Accepts decimal and
 * scientific notation and (case-insensitively) nan, inf, +inf, -inf, infinity. Blanks around the
 * number are ignored. Missing markers are NOT numbers here: test `isMissingText` first.
 * @example parseNumberText('1.5e3') // 1500
 * @example parseNumberText('12abc') // undefined
 */
export function parseNumberText(s: string): number | undefined {
  if (scanDecimal(s, 0, s.length, -1) === s.length && s.length > 0) return scannedValue[0];
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
