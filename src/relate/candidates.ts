/**
 * Candidate terms for the formula search, built from chosen columns on the rows in use.
 *
 * Complexity of a term (our own count, documented in README.md): 1 per column occurrence,
 * + (|k| − 1) for a power k, + 1 for a negative power (a division), + 1 per function applied
 * (abs, sqrt, log, re, im, arg). So x = 1, x^2 = 2, 1/x = 2, p*q = 2, x^2/y = 4, log(x) = 2,
 * re(lon/mer) = 4. The intercept costs 0; a model's complexity is the sum over its terms.
 */
import type { Table } from '../table/types.ts';
import { formatColumnName } from '../table/expr/format.ts';
import { getColumnOrThrow } from './columns.ts';

export interface CandidateTerm {
  /** Expression text the expression language reads back, e.g. `x^2/y`. */
  name: string;
  complexity: number;
  /** Values on the rows in use (same order as the `rows` given). */
  values: Float64Array;
}

export interface SkippedTerm {
  name: string;
  reason: string;
}

export interface CandidateOptions {
  /** Smallest and largest integer power (default −3..3). */
  powers?: [number, number];
  /** Include products of two monomials of different columns (default true). */
  products?: boolean;
  /** At most this many product terms; beyond it products keep only powers with |k| ≤ 1 (default 600). */
  maxProducts?: number;
}

interface Base {
  col: string;
  values: Float64Array;
}

function monomialText(factors: Array<{ col: string; k: number }>): string {
  const num = factors.filter((f) => f.k > 0).map((f) => formatColumnName(f.col) + (f.k > 1 ? `^${f.k}` : ''));
  const den = factors.filter((f) => f.k < 0).map((f) => formatColumnName(f.col) + (f.k < -1 ? `^${-f.k}` : ''));
  const top = num.length ? num.join('*') : '1';
  if (den.length === 0) return top;
  return `${top}/${den.length > 1 ? `(${den.join('*')})` : den[0]}`;
}

function monomialComplexity(factors: Array<{ k: number }>): number {
  let c = 0;
  for (const f of factors) c += 1 + (Math.abs(f.k) - 1) + (f.k < 0 ? 1 : 0);
  return c;
}

function firstBad(v: Float64Array, ok: (x: number) => boolean): number {
  for (let i = 0; i < v.length; i++) if (!ok(v[i]!)) return i;
  return -1;
}

function isConstant(v: Float64Array): boolean {
  for (let i = 1; i < v.length; i++) if (v[i] !== v[0]) return false;
  return true;
}

/**
 * Build the candidate terms on `rows` of `table` from the columns `from`. Terms not finite on
 * every row (negative powers of a column that is 0 somewhere, sqrt/log of non-positive values)
 * are skipped with the reason; so are constants and exact duplicates.
 */
export function buildCandidates(
  table: Table,
  from: string[],
  rows: Int32Array,
  opts: CandidateOptions = {},
): { terms: CandidateTerm[]; skipped: SkippedTerm[] } {
  const [pLo, pHi] = opts.powers ?? [-3, 3];
  const powers: number[] = [];
  for (let k = pLo; k <= pHi; k++) if (k !== 0) powers.push(k);
  const terms: CandidateTerm[] = [];
  const skipped: SkippedTerm[] = [];
  const seen = new Map<string, string>();
  const n = rows.length;
  const rowDesc = (i: number) => `data row ${rows[i]! + 1}`;
  const add = (name: string, complexity: number, values: Float64Array): void => {
    const bad = firstBad(values, Number.isFinite);
    if (bad >= 0) {
      skipped.push({ name, reason: `not finite at ${rowDesc(bad)}` });
      return;
    }
    if (isConstant(values)) {
      skipped.push({ name, reason: 'constant on the rows used (the intercept covers it)' });
      return;
    }
    // exact duplicates (e.g. abs(x) of a positive x): hash of a few values then full compare
    const key = `${values[0]}|${values[n >> 1]}|${values[n - 1]}`;
    const prior = seen.get(key);
    if (prior !== undefined) {
      const other = terms.find((t) => t.name === prior)!;
      let same = true;
      for (let i = 0; i < n && same; i++) same = other.values[i] === values[i];
      if (same) {
        skipped.push({ name, reason: `identical to '${prior}' on the rows used` });
        return;
      }
    }
    seen.set(key, name);
    terms.push({ name, complexity, values });
  };
  const reals: Base[] = [];
  const complexes: Array<{ col: string; re: Float64Array; im: Float64Array }> = [];
  for (const name of from) {
    const c = getColumnOrThrow(table, name);
    if (c.kind === 'complex') {
      const re = new Float64Array(n);
      const im = new Float64Array(n);
      for (let i = 0; i < n; i++) { re[i] = c.re[rows[i]!]!; im[i] = c.im[rows[i]!]!; }
      complexes.push({ col: name, re, im });
    } else if (c.kind === 'real' || c.kind === 'integer') {
      const v = new Float64Array(n);
      for (let i = 0; i < n; i++) v[i] = c.values[rows[i]!]!;
      reals.push({ col: name, values: v });
    }
  }
  // monomials of one column, and functions of it
  const mono = new Map<string, Float64Array>(); // `${col}^${k}`
  for (const b of reals) {
    const hasZero = firstBad(b.values, (x) => x !== 0);
    for (const k of powers) {
      const name = monomialText([{ col: b.col, k }]);
      if (k < 0 && hasZero >= 0) {
        skipped.push({ name, reason: `'${b.col}' is 0 at ${rowDesc(hasZero)}` });
        continue;
      }
      const v = new Float64Array(n);
      for (let i = 0; i < n; i++) v[i] = b.values[i]! ** k;
      mono.set(`${b.col}^${k}`, v);
      add(name, monomialComplexity([{ k }]), v);
    }
    const col = formatColumnName(b.col);
    const neg = firstBad(b.values, (x) => x >= 0);
    if (neg >= 0) add(`abs(${col})`, 2, b.values.map(Math.abs));
    if (neg >= 0) skipped.push({ name: `sqrt(${col})`, reason: `'${b.col}' < 0 at ${rowDesc(neg)}` });
    else add(`sqrt(${col})`, 2, b.values.map(Math.sqrt));
    const nonPos = firstBad(b.values, (x) => x > 0);
    if (nonPos >= 0) skipped.push({ name: `log(${col})`, reason: `'${b.col}' ≤ 0 at ${rowDesc(nonPos)}` });
    else add(`log(${col})`, 2, b.values.map(Math.log));
  }
  for (const c of complexes) {
    const col = formatColumnName(c.col);
    add(`re(${col})`, 2, c.re.slice());
    add(`im(${col})`, 2, c.im.slice());
    add(`abs(${col})`, 2, c.re.map((x, i) => Math.hypot(x, c.im[i]!)));
    add(`arg(${col})`, 2, c.re.map((x, i) => Math.atan2(c.im[i]!, x)));
  }
  // products of two monomials of different real columns (includes a*b and a/b)
  if (opts.products ?? true) {
    const maxProducts = opts.maxProducts ?? 600;
    const nPairs = (reals.length * (reals.length - 1)) / 2;
    let pairPowers = powers;
    if (nPairs * powers.length * powers.length > maxProducts) {
      pairPowers = powers.filter((k) => Math.abs(k) <= 1);
      skipped.push({
        name: 'products of higher powers',
        reason: `${nPairs * powers.length ** 2} products would exceed the cap of ${maxProducts}: kept powers ±1 in products`,
      });
    }
    for (let a = 0; a < reals.length; a++) {
      for (let b = a + 1; b < reals.length; b++) {
        for (const i of pairPowers) {
          for (const j of pairPowers) {
            const A = reals[a]!;
            const B = reals[b]!;
            const name = monomialText([{ col: A.col, k: i }, { col: B.col, k: j }]);
            const va = mono.get(`${A.col}^${i}`);
            const vb = mono.get(`${B.col}^${j}`);
            if (!va || !vb) {
              skipped.push({ name, reason: 'a factor is skipped (division by a column that is 0 somewhere)' });
              continue;
            }
            const v = new Float64Array(n);
            for (let r = 0; r < n; r++) v[r] = va[r]! * vb[r]!;
            add(name, monomialComplexity([{ k: i }, { k: j }]), v);
          }
        }
      }
    }
  }
  // re(a/b) for pairs with a complex member (e.g. re(lon/mer), the natural slope of a cusp)
  const all: Array<{ col: string; re: Float64Array; im: Float64Array; complex: boolean }> = [
    ...reals.map((r) => ({ col: r.col, re: r.values, im: new Float64Array(n), complex: false })),
    ...complexes.map((c) => ({ ...c, complex: true })),
  ];
  for (let a = 0; a < all.length; a++) {
    for (let b = 0; b < all.length; b++) {
      const A = all[a]!;
      const B = all[b]!;
      if (a === b || !(A.complex || B.complex)) continue;
      const name = `re(${formatColumnName(A.col)}/${formatColumnName(B.col)})`;
      const v = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        const den = B.re[i]! * B.re[i]! + B.im[i]! * B.im[i]!;
        v[i] = (A.re[i]! * B.re[i]! + A.im[i]! * B.im[i]!) / den;
      }
      add(name, 4, v);
    }
  }
  return { terms, skipped };
}
