/**
 * Exact inertia and determinant of a sparse symmetric integer matrix (Seifert forms V + Vᵀ of long
 * braids, Goeritz matrices of large diagrams).
 *
 * Symmetric fraction-free (Bareiss) elimination: after s pivot steps every entry of the reduced
 * matrix is the (s+1)-minor det A[P ∪ {i}, P ∪ {j}] of the pivot set P, and the s-th pivot is the
 * leading minor d_s, so every division is exact (E. H. Bareiss, Math. Comp. 22 (1968)). The
 * diagonal of the congruent LDLᵀ form is d_s / d_{s−1}, so the inertia is read from the signs of
 * consecutive pivots (Sylvester's law of inertia) and det A = d_last.
 *
 * Sparsity: a step changes an entry a_ij only by the factor d_s / d_{s−1} unless both a_ik and a_kj
 * are nonzero. Each stored entry keeps the step it was last written at and is brought to the current
 * step on demand (a_ij · d_s / d_t, exact), so a step costs O(deg(k)²) big-integer operations and
 * fill-in stays inside the envelope of the given order.
 * Pivots: the next unreduced index in the given order when its diagonal is nonzero; otherwise a
 * neighbour j with a nonzero diagonal is eliminated first (which makes a_kk nonzero), and when both
 * diagonals are zero the congruence row_k += row_j, col_k += col_j gives a_kk = 2a_kj ≠ 0. A row
 * that has become zero splits off as a zero eigenvalue.
 * @example sparseInertia(3, [[0, 0, 2], [0, 1, -1], [1, 1, 2], [1, 2, -1], [2, 2, 2]]) // { positive: 3, negative: 0, zero: 0, determinant: 4n, updates: 2 }
 */
export interface SparseInertia {
  positive: number;
  negative: number;
  zero: number;
  /** det A, exactly (0 when singular). */
  determinant: bigint;
  /** Entries written during the elimination (the work, in big-integer updates). */
  updates: number;
}

interface Entry {
  v: bigint;
  /** pivot step at which v was written */
  t: number;
}

/** Inertia of the symmetric matrix of size n with entries (i, j, a_ij), i ≤ j (duplicates add). */
export function sparseInertia(n: number, entries: Iterable<readonly [number, number, number | bigint]>): SparseInertia {
  const rows: Map<number, Entry>[] = Array.from({ length: n }, () => new Map());
  for (const [i0, j0, x] of entries) {
    const v = BigInt(x);
    if (v === 0n) continue;
    const i = Math.min(i0, j0);
    const j = Math.max(i0, j0);
    const e = rows[i]!.get(j);
    if (e) e.v += v;
    else {
      const ne: Entry = { v, t: 0 };
      rows[i]!.set(j, ne);
      rows[j]!.set(i, ne);
    }
  }
  const P: bigint[] = [1n]; // P[s]: the s-th pivot (leading minor); P[0] = 1
  let s = 0;
  const cur = (e: Entry | undefined): bigint => (e === undefined ? 0n : e.t === s ? e.v : (e.v * P[s]!) / P[e.t]!);
  const alive = new Uint8Array(n).fill(1);
  let positive = 0;
  let negative = 0;
  let zero = 0;
  let updates = 0;

  const put = (i: number, j: number, v: bigint): void => {
    updates++;
    const e = rows[i]!.get(j);
    if (v === 0n) {
      if (e) {
        rows[i]!.delete(j);
        rows[j]!.delete(i);
      }
    } else if (e) {
      e.v = v;
      e.t = s;
    } else {
      const ne: Entry = { v, t: s };
      rows[i]!.set(j, ne);
      rows[j]!.set(i, ne);
    }
  };

  const pivot = (k: number): void => {
    const p = cur(rows[k]!.get(k));
    const prev = P[s]!;
    const nb: Array<[number, bigint]> = [];
    for (const [j, e] of rows[k]!) if (j !== k) nb.push([j, cur(e)]);
    for (const [j] of nb) rows[j]!.delete(k);
    rows[k]!.clear();
    alive[k] = 0;
    // bring the touched block to step s before the step counter moves
    const old: bigint[][] = nb.map(([i]) => nb.map(([j]) => cur(rows[i]!.get(j))));
    s++;
    P.push(p);
    for (let a = 0; a < nb.length; a++)
      for (let b = a; b < nb.length; b++) put(nb[a]![0], nb[b]![0], (p * old[a]![b]! - nb[a]![1] * nb[b]![1]) / prev);
    if ((p > 0n) === (prev > 0n)) positive++;
    else negative++;
  };

  for (let k = 0; k < n; k++) {
    while (alive[k]) {
      if (cur(rows[k]!.get(k)) !== 0n) {
        pivot(k);
        break;
      }
      let j = -1;
      let jDiag = false;
      for (const [c] of rows[k]!) {
        if (c === k) continue;
        const d = cur(rows[c]!.get(c)) !== 0n;
        if (j < 0 || (d && !jDiag) || (d === jDiag && c < j)) {
          j = c;
          jDiag = d;
        }
      }
      if (j < 0) {
        alive[k] = 0;
        rows[k]!.clear();
        zero++;
        break;
      }
      if (jDiag) {
        pivot(j); // a_kk becomes −a_kj² / d_{s−1} ≠ 0
        continue;
      }
      // both diagonals zero: row_k += row_j, col_k += col_j (a congruence), then a_kk = 2a_kj
      const rowK = new Map<number, bigint>();
      for (const [c, e] of rows[k]!) rowK.set(c, cur(e));
      const rowJ = new Map<number, bigint>();
      for (const [c, e] of rows[j]!) rowJ.set(c, cur(e));
      const akj = rowK.get(j)!;
      const ajj = rowJ.get(j) ?? 0n;
      const akk = rowK.get(k) ?? 0n;
      for (const [c, v] of rowJ) if (c !== k && c !== j) put(k, c, (rowK.get(c) ?? 0n) + v);
      put(k, j, akj + ajj);
      put(k, k, akk + 2n * akj + ajj);
    }
  }
  return { positive, negative, zero, determinant: zero > 0 ? 0n : P[s]!, updates };
}

/** Entries (i ≤ j) of a dense symmetric matrix, for `sparseInertia`. */
export function* symmetricEntries(m: ReadonlyArray<ReadonlyArray<number>>): Generator<[number, number, number]> {
  for (let i = 0; i < m.length; i++) {
    const r = m[i]!;
    for (let j = i; j < r.length; j++) if (r[j] !== 0) yield [i, j, r[j]!];
  }
}

/**
 * Reverse Cuthill–McKee order of a graph's vertices, leaving out `skip` (E. Cuthill & J. McKee,
 * "Reducing the bandwidth of sparse symmetric matrices", 1969; A. George, 1971): breadth-first from a
 * vertex of least degree, neighbours by increasing degree, then reversed. Keeps elimination fill
 * inside a narrow envelope.
 */
export function bandOrder(adj: readonly (readonly number[])[], skip = -1): number[] {
  const n = adj.length;
  const seen = new Uint8Array(n);
  if (skip >= 0) seen[skip] = 1;
  const byDegree = Array.from({ length: n }, (_, i) => i).sort((a, b) => adj[a]!.length - adj[b]!.length);
  const order: number[] = [];
  for (const start of byDegree) {
    if (seen[start]) continue;
    seen[start] = 1;
    order.push(start);
    for (let h = order.length - 1; h < order.length; h++) {
      const next = adj[order[h]!]!.filter((v) => !seen[v]).sort((a, b) => adj[a]!.length - adj[b]!.length);
      for (const v of next) {
        seen[v] = 1;
        order.push(v);
      }
    }
  }
  return order.reverse();
}
