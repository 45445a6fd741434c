import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { recognisePeriodicBraid } from '../../../src/knots/hyperbolic/periodic.ts';
import { randomBraid, torusBraid } from '../../../src/knots/generate.ts';
import { Rng } from '../../../src/util/rng.ts';
import { burauAlexanderExact } from '../../../src/knots/braid.ts';
import { trimPoly } from '../../../src/knots/poly.ts';

// Braid words of the knots up to 7 crossings: tests/fixtures/knots-small.json (see its provenance).
const fx = JSON.parse(readFileSync(new URL('../../fixtures/knots-small.json', import.meta.url), 'utf8')) as { knots: Record<string, { braid: number[] }> };

const conjugate = (w: readonly number[], c: readonly number[]): number[] => [...c, ...w, ...c.map((g) => -g).reverse()];

describe('torus links from braids conjugate to (σ1…σ_{n−1})^q (González-Meneses 2003: roots unique up to conjugacy)', () => {
  it('(σ1…σ_{p−1})^q conjugated by random words is recognised as T(p, q), also mirrored (Rolfsen §3.C: its closure is T(p, q))', () => {
    const rng = new Rng(11);
    for (const [p, q] of [[2, 3], [2, 7], [3, 4], [3, 5], [4, 5], [5, 6], [3, -7], [4, -3], [6, 7]] as const) {
      const t = torusBraid(p, q);
      for (let k = 0; k < 5; k++) {
        const c = randomBraid(rng, p, 1 + rng.int(6)).word;
        expect(recognisePeriodicBraid({ strands: p, word: conjugate(t.word, c) }), `T(${p},${q})`).toEqual({ p, q });
      }
    }
  });
  it('the reversed word (σ_{p−1}…σ1)^q (same closure, orientation reversed) and T(5, 4) = T(4, 5) on 5 strands are recognised', () => {
    expect(recognisePeriodicBraid({ strands: 4, word: torusBraid(4, 5).word.reverse() })).toEqual({ p: 4, q: 5 });
    // T(p, q) = T(q, p): (σ1σ2σ3σ4)^4 on 5 strands
    expect(recognisePeriodicBraid(torusBraid(5, 4))).toEqual({ p: 5, q: 4 });
  });
  it('a letter outside σ1..σ_{n−1} is not a braid on n strands: nothing is claimed (σ1σ2σ3 is T(4, 1) only on 4 strands)', () => {
    expect(recognisePeriodicBraid({ strands: 3, word: [1, 2, 3] })).toBeUndefined();
    expect(recognisePeriodicBraid({ strands: 4, word: [1, 2, 3] })).toEqual({ p: 4, q: 1 });
  });
  it('|q| = 1: conjugates of σ1σ2σ3 (a closed braid of the unknot) give T(4, ±1)', () => {
    expect(recognisePeriodicBraid({ strands: 4, word: conjugate([1, 2, 3], [2, -1, 3, 3]) })).toEqual({ p: 4, q: 1 });
    expect(recognisePeriodicBraid({ strands: 4, word: conjugate([-3, -2, -1], [1, 2]) })).toEqual({ p: 4, q: -1 });
  });
  it('never claims a braid of a hyperbolic knot, nor a near-torus word (one letter changed, a twist added)', () => {
    for (const k of ['4_1', '5_2', '6_1', '6_2', '6_3', '7_2', '7_3', '7_4', '7_5', '7_6', '7_7']) {
      const b = fx.knots[k]!.braid;
      // strands from the largest |generator| (negative letters are inverses of the same generators)
      expect(recognisePeriodicBraid({ strands: Math.max(...b.map(Math.abs)) + 1, word: b }), k).toBeUndefined();
    }
    // T(3,4)'s word with one letter inverted: exponent sum not a multiple of 2 → not conjugate to δ^q
    const w = torusBraid(3, 4).word;
    w[3] = -w[3]!;
    expect(recognisePeriodicBraid({ strands: 3, word: w })).toBeUndefined();
    // δ^3 σ1² on 3 strands: exponent sum 8 = 2·4, but not conjugate to δ^4 (different closure: a link)
    expect(recognisePeriodicBraid({ strands: 3, word: [...torusBraid(3, 3).word, 1, 1] })).toBeUndefined();
  });
  it('random braids claimed as T(n, q) have the torus knot Alexander polynomial (t^{nq} − 1)(t − 1)/((t^n − 1)(t^q − 1)) (Rolfsen §7.D; from memory)', () => {
    // the formula itself: trefoil t² − t + 1, T(3,4) = 8_19: t⁶ − t⁵ + t³ − t + 1 (from memory)
    expect(torusAlexander(2, 3)).toEqual([1n, -1n, 1n]);
    expect(torusAlexander(3, 4)).toEqual([1n, -1n, 0n, 1n, 0n, -1n, 1n]);
    const rng = new Rng(4);
    let found = 0;
    for (let t = 0; t < 3000; t++) {
      const b = randomBraid(rng, 3 + rng.int(2), 6 + rng.int(10));
      const r = recognisePeriodicBraid(b);
      if (!r) continue;
      const a = Math.abs(r.q);
      if (gcd(b.strands, a) !== 1) continue; // a link
      found++;
      // (t^{na} − 1)(t − 1)/((t^n − 1)(t^a − 1)) as coefficients, up to ±t^k
      const expected = torusAlexander(b.strands, a);
      const got = trimPoly(burauAlexanderExact(b)).coeffs;
      const sign = got[0]! < 0n ? -1n : 1n;
      expect(got.map((c) => c * sign), b.word.join(' ')).toEqual(expected);
    }
    expect(found).toBeGreaterThan(5);
  });
});

function gcd(a: number, b: number): number {
  while (b) [a, b] = [b, a % b];
  return a;
}

/** Coefficients of (t^{pq} − 1)(t − 1)/((t^p − 1)(t^q − 1)), lowest degree first. */
function torusAlexander(p: number, q: number): bigint[] {
  // multiply (t^{pq} − 1)(t − 1), then divide exactly by (t^p − 1) and by (t^q − 1)
  let num = new Array<bigint>(p * q + 2).fill(0n);
  const top = Array.from({ length: p * q + 1 }, (_, k) => (k === 0 ? -1n : k === p * q ? 1n : 0n));
  for (let k = 0; k < top.length; k++) {
    num[k]! += -top[k]!;
    num[k + 1]! += top[k]!;
  }
  for (const d of [p, q]) {
    // divide by t^d − 1: quotient c with c[k] = num[k + d] + c[k + d] from the top
    const out = new Array<bigint>(num.length - d).fill(0n);
    for (let k = num.length - 1 - d; k >= 0; k--) out[k] = num[k + d]! + (k + d < out.length ? out[k + d]! : 0n);
    num = out;
  }
  while (num.length && num[num.length - 1] === 0n) num.pop();
  while (num.length && num[0] === 0n) num.shift();
  return num;
}
