/**
 * Exact integer linear algebra for knot invariants: determinants by fraction-free (Bareiss)
 * elimination and the signature (inertia) of a symmetric integer matrix by symmetric Gaussian
 * elimination (Sylvester's law of inertia). No floating point.
 */

import { sparseInertia, symmetricEntries } from './sparse.ts';
import { gcd } from '../util/gcd.ts';

export type IntMatrix = number[][];

/** Matrices larger than this go to the sparse fraction-free elimination (sparse.ts). */
const SPARSE_FROM = 48;

/**
 * Determinant of a square integer matrix by Bareiss' fraction-free elimination
 * (E. H. Bareiss, "Sylvester's identity and multistep integer-preserving Gaussian elimination",
 * Math. Comp. 22 (1968)); every division is exact. BigInt throughout.
 * @example bareissDet([[2, 1], [1, 2]]) // 3n
 */
export function bareissDet(m: ReadonlyArray<ReadonlyArray<number | bigint>>): bigint {
  const n = m.length;
  if (n === 0) return 1n;
  const a: bigint[][] = m.map((r) => r.map((x) => BigInt(x)));
  let sign = 1n;
  let prev = 1n;
  for (let k = 0; k < n - 1; k++) {
    if (a[k]![k] === 0n) {
      let p = k + 1;
      while (p < n && a[p]![k] === 0n) p++;
      if (p === n) return 0n;
      const t = a[k]!;
      a[k] = a[p]!;
      a[p] = t;
      sign = -sign;
    }
    const akk = a[k]![k]!;
    const rk = a[k]!;
    for (let i = k + 1; i < n; i++) {
      const ri = a[i]!;
      const aik = ri[k]!;
      for (let j = k + 1; j < n; j++) ri[j] = (akk * ri[j]! - aik * rk[j]!) / prev;
      ri[k] = 0n;
    }
    prev = akk;
  }
  return sign * a[n - 1]![n - 1]!;
}

/** Inertia of a symmetric matrix: numbers of positive, negative and zero eigenvalues. */
export interface Inertia {
  positive: number;
  negative: number;
  zero: number;
}

const SAFE = 2 ** 52;

function gcdBig(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b) [a, b] = [b, a % b];
  return a;
}

/**
 * Inertia of a symmetric integer matrix, exactly. Symmetric Gaussian elimination: with a nonzero
 * diagonal pivot p, sig(A) = sign(p) + sign(p)·sig(p·A' − a·aᵀ) (Schur complement scaled by p);
 * when every remaining diagonal entry is 0 but a_ij ≠ 0, the congruence row_i += row_j,
 * col_i += col_j makes a_ii = 2a_ij ≠ 0. Each reduced block is divided by the gcd of its entries
 * (a positive scalar, which keeps the inertia). Sylvester's law of inertia makes the count exact.
 * Runs in float64 integers while every product stays below 2^52 and restarts in BigInt otherwise.
 * @example symmetricInertia([[-2, 1], [1, -2]]) // { positive: 0, negative: 2, zero: 0 }
 */
export function symmetricInertia(m: ReadonlyArray<ReadonlyArray<number>>): Inertia {
  const n = m.length;
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++)
      if (m[i]![j] !== m[j]![i]) throw new Error(`symmetricInertia: matrix is not symmetric at (${i}, ${j})`);
  if (n > SPARSE_FROM) {
    const { positive, negative, zero } = sparseInertia(n, symmetricEntries(m));
    return { positive, negative, zero };
  }
  const r = inertiaNumber(m);
  return r ?? inertiaBig(m);
}

function inertiaNumber(m: ReadonlyArray<ReadonlyArray<number>>): Inertia | undefined {
  let a: number[][] = m.map((r) => r.slice());
  let pos = 0;
  let neg = 0;
  let flip = 1; // sign multiplying the signature of the current block
  while (a.length > 0) {
    const n = a.length;
    let k = -1;
    let best = Infinity;
    for (let i = 0; i < n; i++) {
      const v = Math.abs(a[i]![i]!);
      if (v !== 0 && v < best) {
        best = v;
        k = i;
      }
    }
    if (k < 0) {
      // all diagonal zero: find an off-diagonal nonzero
      let fi = -1;
      let fj = -1;
      for (let i = 0; i < n && fi < 0; i++)
        for (let j = i + 1; j < n; j++)
          if (a[i]![j] !== 0) {
            fi = i;
            fj = j;
            break;
          }
      if (fi < 0) break; // zero block
      for (let c = 0; c < n; c++) a[fi]![c] = a[fi]![c]! + a[fj]![c]!;
      for (let rr = 0; rr < n; rr++) a[rr]![fi] = a[rr]![fi]! + a[rr]![fj]!;
      k = fi;
    }
    const p = a[k]![k]!;
    if (p > 0 === flip > 0) pos++;
    else neg++;
    if (p < 0) flip = -flip;
    const idx: number[] = [];
    for (let i = 0; i < n; i++) if (i !== k) idx.push(i);
    const b: number[][] = [];
    let g = 0;
    const rowK = a[k]!;
    for (const i of idx) {
      const ri = a[i]!;
      const aik = ri[k]!;
      const row: number[] = [];
      for (const j of idx) {
        const x = p * ri[j]!;
        const y = aik * rowK[j]!;
        if (Math.abs(x) >= SAFE || Math.abs(y) >= SAFE) return undefined;
        const v = x - y;
        row.push(v);
        if (v !== 0 && g !== 1) g = gcd(g, v);
      }
      b.push(row);
    }
    if (g > 1) for (const row of b) for (let j = 0; j < row.length; j++) row[j] = row[j]! / g;
    a = b;
  }
  return { positive: pos, negative: neg, zero: a.length };
}

function inertiaBig(m: ReadonlyArray<ReadonlyArray<number>>): Inertia {
  let a: bigint[][] = m.map((r) => r.map((x) => BigInt(x)));
  let pos = 0;
  let neg = 0;
  let flip = 1;
  while (a.length > 0) {
    const n = a.length;
    let k = -1;
    for (let i = 0; i < n; i++) if (a[i]![i] !== 0n) { k = i; break; }
    if (k < 0) {
      let fi = -1;
      let fj = -1;
      for (let i = 0; i < n && fi < 0; i++)
        for (let j = i + 1; j < n; j++)
          if (a[i]![j] !== 0n) { fi = i; fj = j; break; }
      if (fi < 0) break;
      for (let c = 0; c < n; c++) a[fi]![c] = a[fi]![c]! + a[fj]![c]!;
      for (let rr = 0; rr < n; rr++) a[rr]![fi] = a[rr]![fi]! + a[rr]![fj]!;
      k = fi;
    }
    const p = a[k]![k]!;
    if (p > 0n === flip > 0) pos++;
    else neg++;
    if (p < 0n) flip = -flip;
    const idx: number[] = [];
    for (let i = 0; i < n; i++) if (i !== k) idx.push(i);
    const b: bigint[][] = [];
    let g = 0n;
    for (const i of idx) {
      const aik = a[i]![k]!;
      const row: bigint[] = [];
      for (const j of idx) {
        const v = p * a[i]![j]! - aik * a[k]![j]!;
        row.push(v);
        if (v !== 0n && g !== 1n) g = gcdBig(g, v);
      }
      b.push(row);
    }
    if (g > 1n) for (const row of b) for (let j = 0; j < row.length; j++) row[j] = row[j]! / g;
    a = b;
  }
  return { positive: pos, negative: neg, zero: a.length };
}

/** Signature (positive minus negative eigenvalues) of a symmetric integer matrix, exactly. */
export function symmetricSignature(m: ReadonlyArray<ReadonlyArray<number>>): number {
  const r = symmetricInertia(m);
  return r.positive - r.negative;
}
