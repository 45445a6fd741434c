/**
 * Simplest rationals and continued-fraction convergents (A. Ya. Khinchin, "Continued Fractions",
 * 1964, ch. I; the Stern–Brocot tree, Graham, Knuth & Patashnik, "Concrete Mathematics", §4.5).
 */

export interface Rational {
  num: number;
  den: number;
  /** `3`, `-2`, `1/2`, `-22/7`. */
  text: string;
}

function make(num: number, den: number): Rational {
  if (den < 0) { num = -num; den = -den; }
  if (num === 0) return { num: 0, den: 1, text: '0' };
  return { num, den, text: den === 1 ? String(num) : `${num}/${den}` };
}

/**
 * The simplest fraction in the closed interval [low, high]: the one with the smallest denominator,
 * and among those the smallest |numerator| (so an integer whenever one lies inside, and 0 when the
 * interval contains 0). Computed by the continued-fraction recursion: if an integer lies in
 * [low, high] take the one nearest 0, else with a = ⌊low⌋ recurse on [1/(high−a), 1/(low−a)].
 * Returns null when the interval is empty or not finite, or when the answer would need a
 * denominator above `maxDen` (default 1e9).
 * @example simplestRational(0.4957, 0.5017) // { num: 1, den: 2, text: '1/2' }
 */
export function simplestRational(low: number, high: number, maxDen = 1e9): Rational | null {
  if (!(Number.isFinite(low) && Number.isFinite(high)) || low > high) return null;
  if (low <= 0 && high >= 0) return make(0, 1);
  if (high < 0) {
    const r = simplestRational(-high, -low, maxDen);
    return r === null ? null : make(-r.num, r.den);
  }
  // 0 < low ≤ high: build the continued fraction [a0; a1, …] of the answer
  const terms: number[] = [];
  let l = low;
  let h = high;
  for (let depth = 0; depth < 64; depth++) {
    const c = Math.ceil(l);
    if (c <= h) {
      terms.push(c);
      break;
    }
    const a = Math.floor(l);
    terms.push(a);
    const nl = 1 / (h - a);
    const nh = 1 / (l - a);
    l = nl;
    h = nh;
    if (!Number.isFinite(l)) return null;
  }
  // fold [a0; a1, …, ak] into num/den
  let num = 1;
  let den = 0;
  for (let i = terms.length - 1; i >= 0; i--) {
    const t = terms[i]!;
    [num, den] = [t * num + den, num];
    if (den > maxDen || !Number.isSafeInteger(num)) return null;
  }
  return make(num, den);
}

/**
 * The first `n` convergents h_k/k_k of the regular continued fraction of x, with
 * h_k = a_k h_{k−1} + h_{k−2}, k_k = a_k k_{k−1} + k_{k−2} (Khinchin ch. I, eq. 4). Stops early when x
 * is reached exactly or the next denominator would pass 2^53.
 * @example convergents(Math.PI, 4).map(c => c.text) // ['3', '22/7', '333/106', '355/113']
 */
export function convergents(x: number, n: number): Rational[] {
  if (!Number.isFinite(x)) throw new RangeError(`convergents: x must be finite, got ${x}`);
  const out: Rational[] = [];
  let hPrev = 1, h = Math.floor(x);
  let kPrev = 0, k = 1;
  let rest = x - Math.floor(x);
  out.push(make(h, k));
  while (out.length < n && rest !== 0) {
    const inv = 1 / rest;
    const a = Math.floor(inv);
    rest = inv - a;
    const hn = a * h + hPrev;
    const kn = a * k + kPrev;
    if (!Number.isSafeInteger(hn) || !Number.isSafeInteger(kn)) break;
    hPrev = h; h = hn; kPrev = k; k = kn;
    out.push(make(h, k));
    // stop once the convergent equals x in float64
    if (h / k === x) break;
  }
  return out;
}
