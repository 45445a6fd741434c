import { printable } from '../../errors.ts';
import { exprError } from './caret.ts';

export type Token =
  | { type: 'number'; value: number; text: string; pos: number; end: number }
  | { type: 'name'; name: string; quoted: boolean; text: string; pos: number; end: number }
  | { type: 'op'; op: string; text: string; pos: number; end: number }
  | { type: '(' | ')' | ','; text: string; pos: number; end: number }
  | { type: 'eof'; text: string; pos: number; end: number };

const isDigit = (c: string | undefined): boolean => c !== undefined && c >= '0' && c <= '9';
const isNameStart = (c: string | undefined): boolean => c !== undefined && /[A-Za-z_]/.test(c);
const isNameChar = (c: string | undefined): boolean => c !== undefined && /[A-Za-z0-9_.]/.test(c);

const OPS2 = ['<=', '>=', '==', '!='];
const OPS1 = ['+', '-', '*', '/', '^', '<', '>'];

/** Split an expression into tokens; errors are `expr.parse` with a caret. */
export function tokenize(source: string): Token[] {
  const out: Token[] = [];
  let k = 0;
  const n = source.length;
  while (k < n) {
    const c = source[k]!;
    if (/\s/.test(c)) {
      k++;
      continue;
    }
    const start = k;
    if (isDigit(c) || (c === '.' && isDigit(source[k + 1]))) {
      while (isDigit(source[k])) k++;
      if (source[k] === '.') {
        k++;
        while (isDigit(source[k])) k++;
      }
      if (source[k] === 'e' || source[k] === 'E') {
        let m = k + 1;
        if (source[m] === '+' || source[m] === '-') m++;
        if (isDigit(source[m])) {
          while (isDigit(source[m])) m++;
          k = m;
        } else if (!isNameChar(source[m]) || source[m] === '.') {
          throw exprError(
            'expr.parse',
            `cannot read expression at position ${start + 1}: the number '${source.slice(start, m)}' has no exponent digits`,
            source,
            start,
            m,
          );
        }
      }
      const text = source.slice(start, k);
      const value = Number(text);
      if (!Number.isFinite(value)) {
        throw exprError('expr.parse', `cannot read expression at position ${start + 1}: the number '${text}' is too large for double precision`, source, start, k);
      }
      out.push({ type: 'number', value, text, pos: start, end: k });
      continue;
    }
    if (isNameStart(c)) {
      while (isNameChar(source[k])) k++;
      const text = source.slice(start, k);
      out.push({ type: 'name', name: text, quoted: false, text, pos: start, end: k });
      continue;
    }
    if (c === '`') {
      // backquoted column name; a doubled backquote stands for one backquote
      let name = '';
      k++;
      for (;;) {
        if (k >= n) {
          throw exprError('expr.parse', `cannot read expression at position ${start + 1}: the backquoted name is not closed`, source, start, n);
        }
        if (source[k] === '`') {
          if (source[k + 1] === '`') {
            name += '`';
            k += 2;
            continue;
          }
          k++;
          break;
        }
        name += source[k]!;
        k++;
      }
      if (name.length === 0) {
        throw exprError('expr.parse', `cannot read expression at position ${start + 1}: empty column name between backquotes`, source, start, k);
      }
      out.push({ type: 'name', name, quoted: true, text: source.slice(start, k), pos: start, end: k });
      continue;
    }
    const two = source.slice(k, k + 2);
    if (OPS2.includes(two)) {
      out.push({ type: 'op', op: two, text: two, pos: k, end: k + 2 });
      k += 2;
      continue;
    }
    if (OPS1.includes(c)) {
      out.push({ type: 'op', op: c, text: c, pos: k, end: k + 1 });
      k++;
      continue;
    }
    if (c === '(' || c === ')' || c === ',') {
      out.push({ type: c, text: c, pos: k, end: k + 1 });
      k++;
      continue;
    }
    let hint = '';
    if (c === '=') hint = "; write '==' to compare";
    else if (c === '!') hint = "; write '!=' for 'not equal'";
    else if (c === '"' || c === "'") hint = '; put column names with spaces or symbols in backquotes, like `my col`';
    else if (c === '[' || c === '{') hint = '; use ( ) for grouping';
    throw exprError(
      'expr.parse',
      `cannot read expression at position ${start + 1}: unexpected character '${printable(c)}'${hint}`,
      source,
      start,
    );
  }
  out.push({ type: 'eof', text: '', pos: n, end: n });
  return out;
}
