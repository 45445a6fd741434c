/**
 * The `k` rows with the largest (or, with `largest = false`, smallest) value, in one pass with a
 * binary heap of size k (J. W. J. Williams, "Algorithm 232: Heapsort", CACM 7, 1964): O(n log k).
 * `rows` lists the candidate row indices (all of 0..values.length−1 when null). Ties go to the
 * earlier row, so the answer is deterministic. Returned best first.
 * @example topK(new Float64Array([5, 9, 1, 9]), null, 2, true) // Int32Array [1, 3]
 */
export function topK(values: Float64Array, rows: Int32Array | null, k: number, largest: boolean): Int32Array {
  const n = rows ? rows.length : values.length;
  const size = Math.min(Math.max(0, Math.floor(k)), n);
  if (size === 0) return new Int32Array(0);
  const sign = largest ? 1 : -1;
  // heap[0] is the worst kept row: smallest signed value, and among equals the latest row
  const heap = new Int32Array(size);
  let len = 0;
  // "a is worse than b": lower signed value, or equal value and later row
  const worse = (a: number, b: number): boolean => {
    const va = sign * values[a]!;
    const vb = sign * values[b]!;
    return va < vb || (va === vb && a > b);
  };
  const siftDown = (i: number): void => {
    for (;;) {
      const l = 2 * i + 1;
      const r = l + 1;
      let w = i;
      if (l < len && worse(heap[l]!, heap[w]!)) w = l;
      if (r < len && worse(heap[r]!, heap[w]!)) w = r;
      if (w === i) return;
      const t = heap[i]!;
      heap[i] = heap[w]!;
      heap[w] = t;
      i = w;
    }
  };
  for (let t = 0; t < n; t++) {
    const row = rows ? rows[t]! : t;
    if (len < size) {
      heap[len] = row;
      let i = len++;
      while (i > 0) {
        const p = (i - 1) >> 1;
        if (!worse(heap[i]!, heap[p]!)) break;
        const s = heap[i]!;
        heap[i] = heap[p]!;
        heap[p] = s;
        i = p;
      }
    } else if (worse(heap[0]!, row)) {
      heap[0] = row;
      siftDown(0);
    }
  }
  // best first
  return Int32Array.from(heap).sort((a, b) => (worse(a, b) ? 1 : worse(b, a) ? -1 : 0));
}
