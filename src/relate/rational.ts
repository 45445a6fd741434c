/**
 * Simplest rationals and continued-fraction convergents (A. Ya. Khinchin, "Continued Fractions",
 * 1964, ch. I; the Stern–Brocot tree, Graham, Knuth & Patashnik, "Concrete Mathematics", §4.5).
 */
import { gcd } from '../util/gcd.ts';

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
  // 0 < low ≤ high, in exact rational arithmetic on the float64 endpoints (each is m·2^e exactly),
  // so the recursion terminates like Euclid's algorithm and point intervals work
  let [ln, ld] = exact(low);
  let [hn, hd] = exact(high);
  const cap = Number.isFinite(maxDen) ? BigInt(Math.floor(maxDen)) : null;
  // convergents p/q of the partial continued fraction [a0; a1, …] (Khinchin ch. I, eq. 4)
  let p1 = 1n, p2 = 0n, q1 = 0n, q2 = 1n;
  for (;;) {
    const c = ceilDiv(ln, ld);
    const last = c * hd <= hn; // an integer c lies in [l, h]: it ends the expansion
    const a = last ? c : ln / ld; // else a = ⌊l⌋ (l > 0, not an integer)
    [p1, p2] = [a * p1 + p2, p1];
    [q1, q2] = [a * q1 + q2, q1];
    // denominators only grow along the expansion, so passing the cap is final
    if (cap !== null && q1 > cap) return null;
    if (last) {
      if (p1 > BigInt(Number.MAX_SAFE_INTEGER) || q1 > BigInt(Number.MAX_SAFE_INTEGER)) return null;
      return make(Number(p1), Number(q1));
    }
    // new interval [1/(h − a), 1/(l − a)]
    [ln, ld, hn, hd] = [hd, hn - a * hd, ld, ln - a * ld];
  }
}

/** x = num/den exactly, with den a power of two (x finite, > 0). */
function exact(x: number): [bigint, bigint] {
  let den = 1n;
  while (!Number.isInteger(x)) {
    x *= 2;
    den *= 2n;
  }
  return [BigInt(x), den];
}

/** ⌈n/d⌉ for n, d > 0. */
function ceilDiv(n: bigint, d: bigint): bigint {
  return (n + d - 1n) / d;
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

/** Largest denominator of a fraction worth showing (our rule; see simpleFraction). */
export const SIMPLE_DENOMINATOR = 12;

/** What the interval says about simple fractions: exactly one (shown), several (too wide to pick one), or none. */
export interface SimpleFraction {
  status: 'one' | 'several' | 'none';
  /** The one fraction with denominator ≤ maxDen in the interval (status 'one'), else null. */
  rational: Rational | null;
  /** "1/2"; "several simple fractions (1/2, 2/3, …)"; "no simple fraction". */
  text: string;
}

/**
 * A fraction that means something: shown only when exactly one fraction p/q with q ≤ maxDen
 * (default 12) lies in the closed interval [low, high], i.e. the data single it out among the
 * simple fractions (our rule). A wide interval holds several (it cannot pick one; width ≥ 1 always
 * holds at least k/1 and k/2 or two halves); a narrow one may hold none ("no simple fraction": the
 * estimate is better written as a decimal). Fractions are enumerated per denominator q from
 * ⌈low·q⌉ to ⌊high·q⌋ and reduced (the Farey sequence of order maxDen; Hardy & Wright ch. III).
 * @example simpleFraction(0.4957, 0.5017).text // '1/2'
 * @example simpleFraction(0.489, 0.491).text // 'no simple fraction' (25/51 is inside; denominator 51 > 12)
 * @example simpleFraction(0.45, 0.7).status // 'several' (1/2, 2/3, 3/5, …)
 */
export function simpleFraction(low: number, high: number, maxDen = SIMPLE_DENOMINATOR): SimpleFraction {
  if (!(Number.isFinite(low) && Number.isFinite(high)) || low > high) return { status: 'none', rational: null, text: 'no simple fraction' };
  const found: Array<[number, number]> = [];
  if (high - low < 1) {
    for (let q = 1; q <= maxDen && found.length < 3; q++) {
      for (let p = Math.ceil(low * q); p <= Math.floor(high * q) && found.length < 3; p++) {
        if (gcd(p, q) === 1) found.push([p, q]); // reduced only: 0/1 once, 2/4 is 1/2
      }
    }
  }
  if (high - low >= 1 || found.length > 1) {
    const shown = found.slice(0, 2).map(([p, q]) => make(p, q).text);
    return { status: 'several', rational: null, text: `several simple fractions (${shown.length ? shown.join(', ') + ', …' : 'interval wider than 1'})` };
  }
  if (found.length === 0) return { status: 'none', rational: null, text: 'no simple fraction' };
  const r = make(found[0]![0], found[0]![1]);
  return { status: 'one', rational: r, text: r.text };
}
