/**
 * A bounded search for a simpler closed braid with the same closure. Every step is an isotopy of
 * the closure:
 * - conjugation (the word is cyclic) and conjugation by Δ (σ_i ↔ σ_{n−i});
 * - braid relations: far commutation σ_iσ_j = σ_jσ_i (|i − j| ≥ 2), σ_i^ε σ_j^ε σ_i^ε =
 *   σ_j^ε σ_i^ε σ_j^ε and σ_i^ε σ_j^δ σ_i^{−ε} = σ_j^{−ε} σ_i^δ σ_j^ε (|i − j| = 1; Artin 1925);
 * - free cyclic reduction σ_i σ_i⁻¹ → nothing;
 * - exchange moves A σ_{n−1} B σ_{n−1}⁻¹ → A σ_{n−1}⁻¹ B σ_{n−1} for words A, B without σ_{n−1}
 *   (and the same at σ_1) (Birman–Menasco, "Studying links via closed braids V: the unlink",
 *   Trans. AMS 329, 1992);
 * - Markov destabilisation when σ_{n−1} or σ_1 occurs once (Markov 1936; Birman 1974, Thm 2.3).
 * Birman–Menasco show that every closed braid of the unknot reaches the trivial 1-strand braid by
 * braid isotopy, exchange moves and destabilisations without ever adding strands; we search only
 * length-preserving rewrites (plus the reductions), within a budget of visited words, so an unknot
 * may be missed but anything reported was reached by isotopies.
 * The search stops early at a word that is a braid connected sum: its σ_{i−1} and σ_i letters
 * form one run each around the circle for some 1 < i < n (a middle generator occurring once is
 * the simplest case, `reduce.ts`) or when the closure is split (a generator that never occurs).
 * Visited words are keyed by their least rotation under σ_i ↔ σ_{n−i}; words with fewer letters
 * of the rarer end generator (σ_1 or σ_{n−1}) are expanded first, since one such letter allows a
 * destabilisation.
 */
import type { Braid } from '../braid.ts';
import { cyclicReduce } from './reduce.ts';

export interface ClosedBraidOptions {
  /** Words expanded in all (each has up to about twice its length of neighbours). */
  maxStates: number;
  /** Letters of neighbouring words looked at in all (bounds the time on long words). */
  maxWork: number;
  /** Letters a word may grow by (cancelling pairs inserted) before it has to shrink; 0 = length-preserving only. */
  slack?: number;
}
export const CLOSED_BRAID_DEFAULTS: ClosedBraidOptions = { maxStates: 200, maxWork: 100_000 };

export type ClosedBraidOutcome =
  /** The simplest closed braid reached (fewest strands, then fewest letters). */
  | { kind: 'braid'; braid: Braid; states: number }
  /** The word is A·B with A in σ_1..σ_{i−1}, B in σ_i..σ_{n−1} (up to commutations): closure(A) # closure(B). */
  | { kind: 'sum'; braid: Braid; at: number; summands: [Braid, Braid]; states: number }
  /** A generator never occurs: the closure is split (for n strands and no letters, an unlink). */
  | { kind: 'split'; braid: Braid; states: number };

/** Free cyclic reduction and destabilisation until neither applies; stops at a split or a braid connected sum. */
export function normaliseClosedBraid(b: Braid): { braid: Braid; split: boolean; sum: number } {
  let n = b.strands;
  let w = b.word.slice();
  for (;;) {
    w = cyclicReduce(w);
    if (n === 1) return { braid: { strands: 1, word: [] }, split: false, sum: 0 };
    const count = new Int32Array(n);
    for (const g of w) count[Math.abs(g)]!++;
    for (let i = 1; i < n; i++) if (count[i] === 0) return { braid: { strands: n, word: w }, split: true, sum: 0 };
    if (count[n - 1] === 1) {
      w = w.filter((g) => Math.abs(g) !== n - 1);
      n--;
      continue;
    }
    if (count[1] === 1) {
      w = w.filter((g) => Math.abs(g) !== 1).map((g) => g - Math.sign(g));
      n--;
      continue;
    }
    for (let i = 2; i < n; i++) if (sumAt(w, i)) return { braid: { strands: n, word: w }, split: false, sum: i };
    return { braid: { strands: n, word: w }, split: false, sum: 0 };
  }
}

/**
 * True when the cyclic word is, up to far commutations, A·B with A in σ_1..σ_{i−1} and B in
 * σ_i..σ_{n−1}: exactly when its σ_{i−1} and σ_i letters form one run of each around the circle
 * (cut before the σ_{i−1} run; then no σ_i precedes a σ_{i−1}, and every other pair that has to
 * be exchanged commutes). The closure is then closure(A) # closure(B) (Birman 1974, §2).
 */
function sumAt(w: readonly number[], i: number): boolean {
  let changes = 0;
  let first = 0;
  let prev = 0;
  for (const g of w) {
    const a = Math.abs(g);
    if (a !== i && a !== i - 1) continue;
    if (!first) first = a;
    else if (a !== prev) changes++;
    prev = a;
  }
  if (prev !== first) changes++;
  return changes <= 2;
}

/** Start of the least rotation of a cyclic sequence (two-pointer method, linear time). */
function leastRotation(s: readonly number[]): number {
  const L = s.length;
  let i = 0;
  let j = 1;
  let k = 0;
  while (i < L && j < L && k < L) {
    const a = s[(i + k) % L]!;
    const b = s[(j + k) % L]!;
    if (a === b) {
      k++;
      continue;
    }
    if (a > b) i += k + 1;
    else j += k + 1;
    if (i === j) j++;
    k = 0;
  }
  return Math.min(i, j);
}

/**
 * Key of a closed braid up to rotation and conjugation by Δ: a 52-bit hash of the least rotation
 * of the word or of its image under σ_i ↔ σ_{n−i}, whichever is smaller. A collision can only
 * prune the search (a word not expanded), never change what a reached word is.
 */
function keyOf(n: number, w: readonly number[]): number {
  const L = w.length;
  const flip = new Array<number>(L);
  for (let k = 0; k < L; k++) flip[k] = w[k]! > 0 ? n - w[k]! : -n - w[k]!;
  const r1 = leastRotation(w);
  const r2 = leastRotation(flip);
  let cmp = 0;
  for (let k = 0; k < L && cmp === 0; k++) cmp = w[(k + r1) % L]! - flip[(k + r2) % L]!;
  const [s, r] = cmp <= 0 ? [w, r1] : [flip, r2];
  let h1 = 0x811c9dc5 ^ n;
  let h2 = 0x1b873593 ^ L;
  for (let k = 0; k < L; k++) {
    const x = s[(k + r) % L]! + 64;
    h1 = Math.imul(h1 ^ x, 0x01000193);
    h2 = Math.imul(h2 ^ x, 0x5bd1e995) ^ (h2 >>> 13);
  }
  return (h1 >>> 0) * 0x100000 + ((h2 >>> 0) & 0xfffff);
}

/** A length-preserving rewrite: the new word, the positions it changed, and whether letter counts may have changed. */
export interface Rewrite {
  word: number[];
  at: number[];
  relation: boolean;
}

/** Length-preserving rewrites of a cyclic word (braid relations and exchange moves). */
export function neighbours(n: number, w: readonly number[]): Rewrite[] {
  const L = w.length;
  const out: Rewrite[] = [];
  if (L < 3) return out;
  for (let j = 0; j < L; j++) {
    const j1 = (j + 1) % L;
    const j2 = (j + 2) % L;
    const a = w[j]!;
    const b = w[j1]!;
    if (Math.abs(Math.abs(a) - Math.abs(b)) >= 2) {
      const v = w.slice();
      v[j] = b;
      v[j1] = a;
      out.push({ word: v, at: [j, j1], relation: false });
    }
    const c = w[j2]!;
    const i = Math.abs(a);
    const k = Math.abs(b);
    if (Math.abs(c) !== i || Math.abs(i - k) !== 1) continue;
    const e = Math.sign(a);
    const d = Math.sign(b);
    let r: [number, number, number] | undefined;
    if (a === c && d === e) r = [b, a, b]; // σ_i^ε σ_k^ε σ_i^ε = σ_k^ε σ_i^ε σ_k^ε
    else if (a === -c) r = [-e * k, d * i, e * k]; // σ_i^ε σ_k^δ σ_i^{−ε} = σ_k^{−ε} σ_i^δ σ_k^ε
    if (!r) continue;
    const v = w.slice();
    v[j] = r[0];
    v[j1] = r[1];
    v[j2] = r[2];
    out.push({ word: v, at: [j, j1, j2], relation: true });
  }
  // exchange moves at σ_{n−1} and at σ_1: exactly two letters, of opposite signs
  for (const g of n > 2 ? [n - 1, 1] : []) {
    const at: number[] = [];
    for (let j = 0; j < L; j++) if (Math.abs(w[j]!) === g) at.push(j);
    if (at.length !== 2 || w[at[0]!] !== -w[at[1]!]!) continue;
    const v = w.slice();
    v[at[0]!] = -v[at[0]!]!;
    v[at[1]!] = -v[at[1]!]!;
    out.push({ word: v, at, relation: false });
  }
  return out;
}

/**
 * True when the rewrite may allow a reduction: a cancelling pair next to a changed position, or
 * (for braid relations, which change letter counts and runs) an end generator occurring once or a
 * connected sum. Commutations and exchange moves keep the counts and the runs of σ_{i−1}, σ_i.
 */
function mayReduce(n: number, r: Rewrite): boolean {
  const w = r.word;
  const L = w.length;
  for (const j of r.at) if (w[j] === -w[(j + 1) % L]! || w[j] === -w[(j + L - 1) % L]!) return true;
  if (!r.relation) return false;
  let c1 = 0;
  let cn = 0;
  for (const g of w) {
    if (Math.abs(g) === 1) c1++;
    if (Math.abs(g) === n - 1) cn++;
  }
  if (c1 === 1 || cn === 1) return true;
  for (let i = 2; i < n; i++) if (sumAt(w, i)) return true;
  return false;
}

/** Letters of the rarer end generator (σ_1 or σ_{n−1}): one of them allows a destabilisation. */
function endCount(n: number, w: readonly number[]): number {
  let a = 0;
  let z = 0;
  for (const g of w) {
    if (Math.abs(g) === 1) a++;
    if (Math.abs(g) === n - 1) z++;
  }
  return Math.min(a, z);
}

/** Search for a simpler closed braid with the same closure (see the module comment). */
export function simplifyClosedBraid(b0: Braid, opts: ClosedBraidOptions = CLOSED_BRAID_DEFAULTS): ClosedBraidOutcome {
  let states = 0;
  let work = 0;
  let cur = normaliseClosedBraid(b0);
  for (;;) {
    if (cur.split) return { kind: 'split', braid: cur.braid, states };
    if (cur.sum) return sumOutcome(cur.braid, cur.sum, states);
    if (cur.braid.strands === 1) return { kind: 'braid', braid: cur.braid, states };
    const n = cur.braid.strands;
    const L = cur.braid.word.length;
    // best-first over words of the same strands and length; a smaller one restarts the search
    const seen = new Set<number>([keyOf(n, cur.braid.word)]);
    const buckets: number[][][] = [];
    const heads: number[] = [];
    const push = (w: number[]): void => {
      const e = endCount(n, w);
      if (!buckets[e]) {
        buckets[e] = [];
        heads[e] = 0;
      }
      buckets[e]!.push(w);
    };
    push(cur.braid.word);
    let next: ReturnType<typeof normaliseClosedBraid> | undefined;
    while (!next && states < opts.maxStates && work < opts.maxWork) {
      let e = 0;
      while (e < buckets.length && (!buckets[e] || heads[e]! >= buckets[e]!.length)) e++;
      if (e >= buckets.length) break;
      const w = buckets[e]![heads[e]!++]!;
      states++;
      const around = neighbours(n, w);
      // with slack: a cancelling pair σ_k^ε σ_k^{−ε} inserted anywhere (an isotopy; the word grows by 2)
      if (opts.slack && w.length < L + opts.slack)
        for (let p = 0; p <= w.length; p++)
          for (let g = 1; g < n; g++)
            for (const e of [g, -g]) around.push({ word: [...w.slice(0, p), e, -e, ...w.slice(p)], at: [p], relation: false });
      for (const v of around) {
        work += v.word.length;
        if (mayReduce(n, v)) {
          const r = normaliseClosedBraid({ strands: n, word: v.word });
          if (r.split || r.sum || r.braid.strands < n || r.braid.word.length < L) {
            next = r;
            break;
          }
        }
        const key = keyOf(n, v.word);
        if (seen.has(key)) continue;
        seen.add(key);
        push(v.word);
      }
    }
    if (!next) return { kind: 'braid', braid: cur.braid, states };
    cur = next;
  }
}

function sumOutcome(b: Braid, i: number, states: number): ClosedBraidOutcome {
  // the σ_{i−1} letters and the σ_i letters are each one cyclic run: A and B are the letters below
  // and from i on, each read from the start of the other's run (only the cyclic order matters)
  const A = b.word.filter((g) => Math.abs(g) < i);
  const B = b.word.filter((g) => Math.abs(g) >= i).map((g) => g - Math.sign(g) * (i - 1));
  return { kind: 'sum', braid: b, at: i, summands: [{ strands: i, word: A }, { strands: b.strands - i + 1, word: B }], states };
}
