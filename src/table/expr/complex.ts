/**
 * Scalar complex kernels. Each writes its result to the exported `out` pair, so the column loops
 * in evaluate.ts allocate nothing per element. Branch cuts are the principal ones (W. Kahan,
 * "Branch cuts for complex elementary functions", in The State of the Art in Numerical Analysis,
 * 1987): sqrt and log are continuous from above on the negative real axis; arg lies in (-pi, pi].
 */
export const out = { re: 0, im: 0 };

/** (a+bi)(c+di) = (ac-bd) + (ad+bc)i */
export function cmul(a: number, b: number, c: number, d: number): void {
  out.re = a * c - b * d;
  out.im = a * d + b * c;
}

/** (a+bi)/(c+di) by Smith's scaling (R. L. Smith, "Algorithm 116: Complex division", CACM 5, 1962). */
export function cdiv(a: number, b: number, c: number, d: number): void {
  if (c === 0 && d === 0) {
    out.re = a / 0;
    out.im = b === 0 ? 0 : b / 0;
    return;
  }
  if (Math.abs(c) >= Math.abs(d)) {
    const r = d / c;
    const den = c + d * r;
    out.re = (a + b * r) / den;
    out.im = (b - a * r) / den;
  } else {
    const r = c / d;
    const den = c * r + d;
    out.re = (a * r + b) / den;
    out.im = (b * r - a) / den;
  }
}

/** Principal square root (Kahan 1987): re >= 0; on the negative axis sqrt(-x) = i sqrt(x). */
export function csqrt(a: number, b: number): void {
  if (a === 0 && b === 0) {
    out.re = 0;
    out.im = 0;
    return;
  }
  const t = Math.sqrt((Math.abs(a) + Math.hypot(a, b)) / 2);
  if (a >= 0) {
    out.re = t;
    out.im = b / (2 * t);
  } else {
    out.re = Math.abs(b) / (2 * t);
    out.im = b < 0 ? -t : t;
  }
}

/** Principal logarithm: log|z| + i arg z, arg in (-pi, pi]. */
export function clog(a: number, b: number): void {
  out.re = Math.log(Math.hypot(a, b));
  out.im = Math.atan2(b, a);
}

/** exp(a+bi) = e^a (cos b + i sin b) */
export function cexp(a: number, b: number): void {
  const m = Math.exp(a);
  if (b === 0) {
    out.re = m;
    out.im = 0;
    return;
  }
  out.re = m * Math.cos(b);
  out.im = m * Math.sin(b);
}

/** sin(a+bi) = sin a cosh b + i cos a sinh b */
export function csin(a: number, b: number): void {
  out.re = Math.sin(a) * Math.cosh(b);
  out.im = Math.cos(a) * Math.sinh(b);
}

/** cos(a+bi) = cos a cosh b - i sin a sinh b */
export function ccos(a: number, b: number): void {
  out.re = Math.cos(a) * Math.cosh(b);
  out.im = -Math.sin(a) * Math.sinh(b);
}

/** tan(a+bi) = (sin 2a + i sinh 2b) / (cos 2a + cosh 2b); for |b| > 20 it is i·sign(b) to double precision. */
export function ctan(a: number, b: number): void {
  if (Math.abs(b) > 20) {
    out.re = 2 * Math.sin(2 * a) * Math.exp(-2 * Math.abs(b));
    out.im = Math.sign(b);
    return;
  }
  const den = Math.cos(2 * a) + Math.cosh(2 * b);
  out.re = Math.sin(2 * a) / den;
  out.im = Math.sinh(2 * b) / den;
}

/**
 * z^w, principal value exp(w log z). A real integer exponent |n| <= 1024 uses repeated squaring,
 * so i^2 = -1 exactly; 0^w is 1 for w = 0, 0 for re(w) > 0, NaN otherwise.
 */
export function cpow(a: number, b: number, c: number, d: number): void {
  if (d === 0 && Number.isInteger(c) && Math.abs(c) <= 1024) {
    let rr = 1;
    let ri = 0;
    let br = a;
    let bi = b;
    let n = Math.abs(c);
    while (n > 0) {
      if (n & 1) {
        const t = rr * br - ri * bi;
        ri = rr * bi + ri * br;
        rr = t;
      }
      const t = br * br - bi * bi;
      bi = 2 * br * bi;
      br = t;
      n >>>= 1;
    }
    if (c < 0) cdiv(1, 0, rr, ri);
    else {
      out.re = rr;
      out.im = ri;
    }
    return;
  }
  if (a === 0 && b === 0) {
    out.re = c === 0 && d === 0 ? 1 : c > 0 ? 0 : NaN;
    out.im = c === 0 && d === 0 ? 0 : c > 0 ? 0 : NaN;
    return;
  }
  clog(a, b);
  const lr = out.re;
  const li = out.im;
  cexp(c * lr - d * li, c * li + d * lr);
}

/**
 * For x < 0 and a non-integer real y: the numerator p when y = p/q with q odd and q <= 999
 * (so x^y has the real value (-1)^p |x|^y), else undefined. Convergents of the continued fraction
 * of y, accepted when |y - p/q| <= 4 ulp(y).
 */
export function oddRootNumerator(y: number): number | undefined {
  if (!Number.isFinite(y)) return undefined;
  const tol = 4 * Number.EPSILON * Math.max(1, Math.abs(y));
  let x = y;
  let h0 = 0;
  let h1 = 1;
  let k0 = 1;
  let k1 = 0;
  for (let step = 0; step < 40; step++) {
    const a = Math.floor(x);
    const h = a * h1 + h0;
    const k = a * k1 + k0;
    if (k > 999) return undefined;
    if (Math.abs(y - h / k) <= tol) return k % 2 === 1 ? h : undefined;
    h0 = h1;
    h1 = h;
    k0 = k1;
    k1 = k;
    const frac = x - a;
    if (frac === 0) return undefined;
    x = 1 / frac;
  }
  return undefined;
}
