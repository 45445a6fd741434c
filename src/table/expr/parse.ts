import { SurmiseError, didYouMean } from '../../errors.ts';
import type { BinaryOp, ConstantName, Expr } from './ast.ts';
import { exprError } from './caret.ts';
import { FUNCTIONS, FUNCTION_NAMES } from './functions.ts';
import { type Token, tokenize } from './lexer.ts';

/**
 * Grammar (lowest precedence first):
 *   comparison := additive [ ('<' | '<=' | '>' | '>=' | '==' | '!=') additive ]   (not chained)
 *   additive   := multiplicative { ('+' | '-') multiplicative }                   (left-assoc)
 *   multiplicative := unary { ('*' | '/') unary }                                  (left-assoc)
 *   unary      := ('-' | '+') unary | power
 *   power      := primary [ '^' unary ]                  (right-assoc; -x^2 = -(x^2), 2^-1 = 0.5)
 *   primary    := number | name | `quoted name` | name '(' args ')' | '(' comparison ')'
 * Bare `pi`, `e`, `i` are the constants; a column with one of those names is written in backquotes.
 */

const MAX_DEPTH = 256;
const sources = new WeakMap<Expr, string>();

/** The text an Expr was parsed from (for caret messages), when it came from parseExpression. */
export function expressionSource(expr: Expr): string | undefined {
  return sources.get(expr);
}

export function parseExpression(source: string): Expr {
  if (typeof source !== 'string') {
    throw new SurmiseError('expr.parse', `cannot read expression: expected text, got ${typeof source}`);
  }
  const tokens = tokenize(source);
  let k = 0;
  let depth = 0;
  const peek = (): Token => tokens[k]!;
  const prevText = (): string | undefined => (k > 0 ? tokens[k - 1]!.text : undefined);
  const fail = (pos: number, msg: string, end = pos + 1): never => {
    throw exprError('expr.parse', `cannot read expression at position ${pos + 1}: ${msg}`, source, pos, end);
  };
  const enter = (t: Token): void => {
    if (++depth > MAX_DEPTH) fail(t.pos, `the expression is nested more than ${MAX_DEPTH} levels deep`);
  };

  const isValueStart = (t: Token): boolean => t.type === 'number' || t.type === 'name' || t.type === '(';

  function comparison(): Expr {
    const left = additive();
    const t = peek();
    if (t.type === 'op' && ['<', '<=', '>', '>=', '==', '!='].includes(t.op)) {
      k++;
      const right = additive();
      const t2 = peek();
      if (t2.type === 'op' && ['<', '<=', '>', '>=', '==', '!='].includes(t2.op)) {
        fail(t2.pos, `comparisons cannot be chained; write (a < b) * (b < c) for 'a < b < c'`, t2.end);
      }
      return { type: 'binary', op: t.op as BinaryOp, left, right, pos: t.pos, end: t.end };
    }
    return left;
  }

  function additive(): Expr {
    let left = multiplicative();
    for (;;) {
      const t = peek();
      if (t.type === 'op' && (t.op === '+' || t.op === '-')) {
        k++;
        const right = multiplicative();
        left = { type: 'binary', op: t.op, left, right, pos: t.pos, end: t.end };
      } else return left;
    }
  }

  function multiplicative(): Expr {
    let left = unary();
    for (;;) {
      const t = peek();
      if (t.type === 'op' && (t.op === '*' || t.op === '/')) {
        k++;
        const right = unary();
        left = { type: 'binary', op: t.op, left, right, pos: t.pos, end: t.end };
      } else return left;
    }
  }

  function unary(): Expr {
    const t = peek();
    if (t.type === 'op' && (t.op === '-' || t.op === '+')) {
      enter(t);
      k++;
      const arg = unary();
      depth--;
      return { type: 'unary', op: t.op, arg, pos: t.pos, end: t.end };
    }
    return power();
  }

  function power(): Expr {
    const base = primary();
    const t = peek();
    if (t.type === 'op' && t.op === '^') {
      enter(t);
      k++;
      const exponent = unary();
      depth--;
      return { type: 'binary', op: '^', left: base, right: exponent, pos: t.pos, end: t.end };
    }
    return base;
  }

  function primary(): Expr {
    const t = peek();
    if (t.type === 'number') {
      k++;
      return { type: 'number', value: t.value, pos: t.pos, end: t.end };
    }
    if (t.type === 'name') {
      k++;
      if (!t.quoted && peek().type === '(') return call(t as Token & { type: 'name' });
      if (!t.quoted && (t.name === 'pi' || t.name === 'e' || t.name === 'i')) {
        return { type: 'constant', name: t.name as ConstantName, pos: t.pos, end: t.end };
      }
      return { type: 'column', name: t.name, pos: t.pos, end: t.end };
    }
    if (t.type === '(') {
      enter(t);
      k++;
      const inner = comparison();
      const close = peek();
      if (close.type !== ')') {
        if (close.type === 'eof') fail(close.pos, `expected ')' to close the '(' at position ${t.pos + 1}`);
        unexpectedAfterValue(close, `expected ')' to close the '(' at position ${t.pos + 1}`);
      }
      k++;
      depth--;
      return inner;
    }
    // not a value
    const prev = prevText();
    if (t.type === 'eof') {
      if (prev === undefined) fail(t.pos, 'the expression is empty');
      fail(t.pos, `expected a value after '${prev}' (the expression ends there)`);
    }
    if (prev === undefined) fail(t.pos, `expected a value at the start, found '${t.text}'`, t.end);
    return fail(t.pos, `expected a value after '${prev}'`, t.end);
  }

  function call(nameTok: Token & { type: 'name' }): Expr {
    const info = FUNCTIONS.get(nameTok.name);
    if (!info) {
      throw exprError(
        'expr.unknownFunction',
        `unknown function '${nameTok.name}' at position ${nameTok.pos + 1}${didYouMean(nameTok.name, FUNCTION_NAMES)}`,
        source,
        nameTok.pos,
        nameTok.end,
        { function: nameTok.name },
      );
    }
    const open = peek();
    enter(open);
    k++; // '('
    const args: Expr[] = [];
    if (peek().type !== ')') {
      for (;;) {
        args.push(comparison());
        const t = peek();
        if (t.type === ',') {
          k++;
          continue;
        }
        if (t.type === ')') break;
        if (t.type === 'eof') fail(t.pos, `expected ',' or ')' in the call to ${info.name}( at position ${nameTok.pos + 1}`);
        unexpectedAfterValue(t, `expected ',' or ')' in the call to ${info.name}( at position ${nameTok.pos + 1}`);
      }
    }
    const close = peek();
    k++; // ')'
    depth--;
    if (args.length < info.minArgs || args.length > info.maxArgs) {
      const want =
        info.minArgs === info.maxArgs
          ? `${info.minArgs} argument${info.minArgs === 1 ? '' : 's'}`
          : info.maxArgs === Infinity
            ? `at least ${info.minArgs} arguments`
            : `${info.minArgs} to ${info.maxArgs} arguments`;
      throw exprError(
        'expr.arity',
        `${info.name} takes ${want}, got ${args.length}, at position ${nameTok.pos + 1}`,
        source,
        nameTok.pos,
        close.end,
        { function: info.name },
      );
    }
    return { type: 'call', name: info.name, args, pos: nameTok.pos, end: close.end };
  }

  /** A token that cannot follow a complete value. */
  function unexpectedAfterValue(t: Token, fallback: string): never {
    if (isValueStart(t)) {
      const prev = tokens[k - 1];
      const hint =
        prev?.type === 'number' && t.type === 'name' ? ` (write ${prev.text} * ${t.text} for a product)` : '';
      return fail(t.pos, `expected an operator before '${t.text}'${hint}`, t.end);
    }
    if (t.type === ')') return fail(t.pos, `unmatched ')'`);
    if (t.type === ',') return fail(t.pos, `unexpected ',' outside a function call`);
    return fail(t.pos, fallback, t.end);
  }

  const expr = comparison();
  const t = peek();
  if (t.type !== 'eof') unexpectedAfterValue(t, `unexpected '${t.text}'`);
  sources.set(expr, source);
  return expr;
}
