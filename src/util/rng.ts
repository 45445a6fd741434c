/**
 * Seeded pseudo-random numbers, identical on every machine. Every worker's and repeat's seed is
 * derived up front from the one user seed with `deriveSeed(seed, ...path)`.
 */

/** SplitMix64-style 32-bit mixer (Steele, Lea & Flood, "Fast splittable pseudorandom number generators", OOPSLA 2014). */
function mix32(x: number): number {
  x = Math.imul(x ^ (x >>> 16), 0x85ebca6b);
  x = Math.imul(x ^ (x >>> 13), 0xc2b2ae35);
  return (x ^ (x >>> 16)) >>> 0;
}

/** A child seed for `path` (e.g. deriveSeed(seed, 'fold', 3)), stable across runs and machines. */
export function deriveSeed(seed: number, ...path: Array<string | number>): number {
  let h = mix32((seed >>> 0) ^ 0x9e3779b9);
  for (const p of path) {
    const s = String(p);
    for (let i = 0; i < s.length; i++) h = mix32(h ^ Math.imul(s.charCodeAt(i) + 1, 0x27d4eb2d));
    h = mix32(h ^ 0x165667b1);
  }
  return h;
}

/** Mulberry32 generator: uniform floats in [0, 1) with 32 bits of state. */
export class Rng {
  private state: number;

  constructor(seed: number) {
    this.state = seed >>> 0;
  }

  /** Uniform on [0, 1). */
  next(): number {
    let t = (this.state = (this.state + 0x6d2b79f5) >>> 0);
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  }

  /** Uniform on [a, b). */
  uniform(a: number, b: number): number {
    return a + (b - a) * this.next();
  }

  /** Integer uniform on {0, …, n−1}. */
  int(n: number): number {
    return Math.floor(this.next() * n);
  }

  /** Standard normal by Box–Muller (Box & Muller, Ann. Math. Statist. 29, 1958). */
  normal(): number {
    let u = this.next();
    while (u === 0) u = this.next();
    const v = this.next();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  }

  /** Fisher–Yates shuffle of an index array in place (Knuth, TAOCP vol. 2, Algorithm P). */
  shuffle<T extends { length: number; [i: number]: number }>(a: T): T {
    for (let i = a.length - 1; i > 0; i--) {
      const j = Math.floor(this.next() * (i + 1));
      const t = a[i]!;
      a[i] = a[j]!;
      a[j] = t;
    }
    return a;
  }

  /** A random permutation of 0..n−1. */
  permutation(n: number): Int32Array {
    const p = new Int32Array(n);
    for (let i = 0; i < n; i++) p[i] = i;
    return this.shuffle(p);
  }
}
