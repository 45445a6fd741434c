/**
 * Expression trees of the formula search: one real-valued term built from base quantities
 * (bases.ts) by powers, products, quotients, sums, differences, the expression language's
 * functions and a few numeric constants. Each node knows its complexity and how to compute its
 * values over columns; canonical.ts prints it in the expression language.
 *
 * Complexity (our own count, README "Search"): a base quantity costs its own count (a column 1,
 * re/im/abs/arg of a complex column 2, re/im of a quotient 4); a power p/q adds |p| − 1, + 1 when
 * q > 1 (a root), + 1 when p < 0 (a division); a function adds 1; a product adds 0; a quotient,
 * sum or difference adds 1; a numeric constant adds 1 (plus 1 for the sum it enters).
 * So x^2 = 2, 1/x = 2, sqrt(x) = 2, p*q = 2, x^2/y = 4, (a + b)^2 = 4, log(a*b + 1) = 5.
 */

import { FN, type UnaryFn } from './terms/index.ts';

export { FN, type UnaryFn };

export type Tree =
  | { op: 'base'; id: number; text: string; cost: number }
  /** a^(num/den), den ∈ {1, 2}. */
  | { op: 'pow'; num: number; den: number; a: Tree }
  | { op: 'fn'; f: UnaryFn; a: Tree }
  | { op: 'mul' | 'div' | 'add' | 'sub'; a: Tree; b: Tree }
  /** c·a, a numeric constant inside a function (exp(−a²/2) is exp(scale(−1/2, a²))). */
  | { op: 'scale'; c: number; a: Tree }
  /** c + s·a with s = ±1 (a + 1, 1 − a). */
  | { op: 'shift'; c: number; s: 1 | -1; a: Tree };

/** Complexity of a tree (see the module comment). */
export function complexity(t: Tree): number {
  switch (t.op) {
    case 'base': return t.cost;
    case 'pow': return complexity(t.a) + powCost(t.num, t.den);
    case 'fn': return complexity(t.a) + 1;
    case 'mul': return complexity(t.a) + complexity(t.b);
    case 'div': case 'add': case 'sub': return complexity(t.a) + complexity(t.b) + 1;
    case 'scale': return complexity(t.a) + 1;
    case 'shift': return complexity(t.a) + 2;
  }
}

/** Added cost of raising to the power num/den. */
export function powCost(num: number, den: number): number {
  return Math.abs(num) - 1 + (den > 1 ? 1 : 0) + (num < 0 ? 1 : 0);
}

/** x^(num/den) for den ∈ {1, 2}: integer powers by `**` (exact signs), halves through sqrt. */
export function powValue(x: number, num: number, den: number): number {
  if (den === 1) return x ** num;
  const r = Math.sqrt(x);
  return num === 1 ? r : num === -1 ? 1 / r : r ** num;
}

/** One node's values from its children's values on rows lo..hi−1 (into `out`, which may alias neither input). */
export function applyNode(t: Tree, a: Float64Array, b: Float64Array | null, out: Float64Array, lo = 0, hi = out.length): Float64Array {
  const n = hi;
  switch (t.op) {
    case 'base': throw new Error('applyNode: a base has no children');
    case 'pow': { const { num, den } = t; for (let i = lo; i < n; i++) out[i] = powValue(a[i]!, num, den); break; }
    case 'fn': {
      const f = FN[t.f];
      for (let i = lo; i < n; i++) out[i] = f(a[i]!);
      break;
    }
    case 'mul': for (let i = lo; i < n; i++) out[i] = a[i]! * b![i]!; break;
    case 'div': for (let i = lo; i < n; i++) out[i] = a[i]! / b![i]!; break;
    case 'add': for (let i = lo; i < n; i++) out[i] = a[i]! + b![i]!; break;
    case 'sub': for (let i = lo; i < n; i++) out[i] = a[i]! - b![i]!; break;
    case 'scale': { const c = t.c; for (let i = lo; i < n; i++) out[i] = c * a[i]!; break; }
    case 'shift': { const { c, s } = t; for (let i = lo; i < n; i++) out[i] = c + s * a[i]!; break; }
  }
  return out;
}

/** Values of `t` on the rows `rows` of the base columns `bases[id]` (full-length arrays). */
export function evaluateTree(t: Tree, bases: Float64Array[], rows: ArrayLike<number>): Float64Array {
  const n = rows.length;
  if (t.op === 'base') {
    const v = bases[t.id]!;
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) out[i] = v[rows[i]!]!;
    return out;
  }
  const a = evaluateTree(t.a, bases, rows);
  const b = t.op === 'mul' || t.op === 'div' || t.op === 'add' || t.op === 'sub' ? evaluateTree(t.b, bases, rows) : null;
  return applyNode(t, a, b, new Float64Array(n));
}

/** Replace the numeric constants of `t`, in depth-first order, by `cs` (used by the inner-constant fit). */
export function withConstants(t: Tree, cs: readonly number[]): Tree {
  let k = 0;
  const rec = (u: Tree): Tree => {
    switch (u.op) {
      case 'base': return u;
      case 'scale': return { ...u, a: rec(u.a), c: cs[k++]! };
      case 'shift': { const a = rec(u.a); return { ...u, a, c: cs[k++]! }; }
      case 'pow': case 'fn': return { ...u, a: rec(u.a) };
      default: return { ...u, a: rec(u.a), b: rec(u.b) };
    }
  };
  return rec(t);
}

/** The numeric constants of `t` in the order `withConstants` takes them. */
export function constantsOf(t: Tree): number[] {
  const out: number[] = [];
  const rec = (u: Tree): void => {
    switch (u.op) {
      case 'base': return;
      case 'scale': rec(u.a); out.push(u.c); return;
      case 'shift': rec(u.a); out.push(u.c); return;
      case 'pow': case 'fn': rec(u.a); return;
      default: rec(u.a); rec(u.b);
    }
  };
  rec(t);
  return out;
}

/** Smallest base id the tree reads (orders factors and terms in print). */
export function firstBase(t: Tree): number {
  switch (t.op) {
    case 'base': return t.id;
    case 'pow': case 'fn': case 'scale': case 'shift': return firstBase(t.a);
    default: return Math.min(firstBase(t.a), firstBase(t.b));
  }
}
