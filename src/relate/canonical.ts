/**
 * Canonical text of search trees and formulas, in the expression language (it reads back with
 * parseExpression). A product is printed as one monomial: numeric factor first, factors ordered by
 * the first base quantity they read, equal factors merged into powers, negative powers after one
 * '/': `3*a^2/b`, `-a^2/2`, `re(z)*im(z)`, `3*a^2/(2*b)`; a power 1/2 is `sqrt(...)`. Sums keep
 * their order with a constant last (`a*b + 1`), or first when the next term is negative (`1 - v^2`).
 */
import { simplestRational } from './rational.ts';
import { firstBase, type Tree } from './tree.ts';
import { gcd } from '../util/gcd.ts';

/** A numeric coefficient: an exact rational, or a decimal shown as given. */
export type Coef = { num: number; den: number } | { decimal: number };

interface Factor {
  text: string;
  /** Needs parentheses before '^' or inside a product (a sum). */
  sum: boolean;
  order: number;
  num: number;
  den: number;
}

/** Shortest text of a number that reads back to it (6 significant digits for fitted decimals). */
export function decimalText(x: number): string {
  return String(Number(x.toPrecision(6)));
}

/** A constant as a rational when it is one with a denominator ≤ 1000, else as a decimal. */
export function constantCoef(c: number): Coef {
  const r = simplestRational(c, c, 1000);
  return r ? { num: r.num, den: r.den } : { decimal: c };
}

function collect(t: Tree, num: number, den: number, acc: { coef: Coef; factors: Map<string, Factor> }): void {
  if (t.op === 'mul' || t.op === 'div') {
    collect(t.a, num, den, acc);
    collect(t.b, t.op === 'div' ? -num : num, den, acc);
    return;
  }
  if (t.op === 'pow') {
    const n2 = num * t.num;
    const d2 = den * t.den;
    const g = gcd(n2, d2);
    collect(t.a, n2 / g, d2 / g, acc);
    return;
  }
  if (t.op === 'scale' && den === 1 && 'num' in acc.coef) {
    const c = constantCoef(t.c);
    if ('num' in c) {
      const pn = c.num ** Math.abs(num);
      const pd = c.den ** Math.abs(num);
      const [n1, d1] = num > 0 ? [pn, pd] : [pd, pn];
      const nn = acc.coef.num * n1 * Math.sign(d1);
      const dd = acc.coef.den * Math.abs(d1);
      const g = gcd(nn, dd);
      acc.coef = { num: nn / g, den: dd / g };
      collect(t.a, num, den, acc);
      return;
    }
  }
  const text = atomText(t);
  const prior = acc.factors.get(text);
  if (prior) {
    const n2 = prior.num * den + num * prior.den;
    const d2 = prior.den * den;
    const g = gcd(n2, d2);
    prior.num = n2 / g;
    prior.den = d2 / g;
  } else {
    acc.factors.set(text, { text, sum: t.op === 'add' || t.op === 'sub' || t.op === 'shift' || (t.op === 'scale'), order: firstBase(t), num, den });
  }
}

function atomText(t: Tree): string {
  switch (t.op) {
    case 'base': return t.text;
    case 'fn': return `${t.f}(${treeText(t.a)})`;
    case 'add': case 'sub': case 'shift': return sumText(t);
    case 'scale': return monomialText(constantCoef(t.c), t.a);
    default: return treeText(t);
  }
}

function powerText(f: Factor, num: number, den: number): string {
  const base = f.sum ? `(${f.text})` : f.text;
  if (den === 2 && num === 1) return `sqrt(${f.text})`;
  if (den === 1) return num === 1 ? base : `${base}^${num}`;
  return `${base}^(${num}/${den})`;
}

/** `coef·t` as one monomial. */
export function monomialText(coef: Coef, t: Tree): string {
  const acc = { coef: 'num' in coef ? coef : { num: 1, den: 1 }, factors: new Map<string, Factor>() };
  collect(t, 1, 1, acc);
  const factors = [...acc.factors.values()].filter((f) => f.num !== 0).sort((x, y) => x.order - y.order || (x.text < y.text ? -1 : x.text > y.text ? 1 : 0));
  const top: string[] = [];
  const bottom: string[] = [];
  let sign = '';
  if ('decimal' in coef) {
    const d = coef.decimal;
    if (d < 0) sign = '-';
    const m = decimalText(Math.abs(d));
    if (m !== '1') top.push(m);
    const c = acc.coef as { num: number; den: number };
    if (c.num < 0) sign = sign ? '' : '-';
    if (Math.abs(c.num) !== 1) top.push(String(Math.abs(c.num)));
    if (c.den !== 1) bottom.push(String(c.den));
  } else {
    const c = acc.coef as { num: number; den: number };
    if (c.num < 0) sign = '-';
    if (Math.abs(c.num) !== 1) top.push(String(Math.abs(c.num)));
    if (c.den !== 1) bottom.push(String(c.den));
  }
  for (const f of factors) {
    if (f.num > 0) top.push(powerText(f, f.num, f.den));
    else bottom.push(powerText(f, -f.num, f.den));
  }
  const numText = top.length ? top.join('*') : '1';
  if (!bottom.length) return sign + numText;
  return `${sign}${numText}/${bottom.length > 1 ? `(${bottom.join('*')})` : bottom[0]}`;
}

function sumTerms(t: Tree, sign: 1 | -1, out: Array<{ sign: 1 | -1; t: Tree | null; c: number }>): void {
  if (t.op === 'add' || t.op === 'sub') {
    sumTerms(t.a, sign, out);
    sumTerms(t.b, t.op === 'sub' ? (-sign as 1 | -1) : sign, out);
  } else if (t.op === 'shift') {
    sumTerms(t.a, (sign * t.s) as 1 | -1, out);
    out.push({ sign, t: null, c: t.c });
  } else out.push({ sign, t, c: 0 });
}

function sumText(t: Tree): string {
  const parts: Array<{ sign: 1 | -1; t: Tree | null; c: number }> = [];
  sumTerms(t, 1, parts);
  const vars = parts.filter((p) => p.t !== null);
  const consts = parts.filter((p) => p.t === null && p.c !== 0);
  const texts = vars.map((p) => monomialText(p.sign === 1 ? { num: 1, den: 1 } : { num: -1, den: 1 }, p.t!));
  const cText = consts.map((p) => {
    const c = constantCoef(p.sign * p.c);
    return 'num' in c ? (c.den === 1 ? String(c.num) : `${c.num}/${c.den}`) : decimalText(c.decimal);
  });
  const ordered = texts.length && texts[0]!.startsWith('-') && cText.length ? [...cText, ...texts] : [...texts, ...cText];
  return joinSum(ordered);
}

/** `a`, `- b`, … joined into `a - b + c`. */
export function joinSum(items: string[]): string {
  let s = '';
  for (const it of items) {
    if (s === '') s = it;
    else if (it.startsWith('-')) s += ` - ${it.slice(1)}`;
    else s += ` + ${it}`;
  }
  return s === '' ? '0' : s;
}

/** Canonical text of a tree. */
export function treeText(t: Tree): string {
  if (t.op === 'add' || t.op === 'sub' || t.op === 'shift' || t.op === 'scale') return atomText(t);
  return monomialText({ num: 1, den: 1 }, t);
}

/** `c0 + Σ cj·tj` with the terms in the order given and the constant last (omitted when exactly 0). */
export function formulaText(intercept: Coef, coefs: Coef[], terms: Tree[]): string {
  const items = terms.map((t, j) => {
    const c = coefs[j]!;
    if ('num' in c && c.num === 0) return '';
    const inner = treeText(t);
    const isSum = t.op === 'add' || t.op === 'sub' || t.op === 'shift';
    if (!isSum) return monomialText(c, t);
    const cText = 'num' in c ? (c.den === 1 ? String(c.num) : `${c.num}/${c.den}`) : decimalText(c.decimal);
    return cText === '1' ? inner : cText === '-1' ? `-(${inner})` : `${cText}*(${inner})`;
  }).filter((s) => s !== '');
  const ic = 'num' in intercept ? (intercept.num === 0 ? '' : intercept.den === 1 ? String(intercept.num) : `${intercept.num}/${intercept.den}`) : decimalText(intercept.decimal);
  if (ic !== '') items.push(ic);
  return joinSum(items);
}
