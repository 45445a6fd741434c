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

/** Deepest nesting of parentheses, calls, signs and powers the parser follows. */
const MAX_DEPTH = 256;
/**
 * Deepest syntax tree accepted: a flat sum of n terms is a tree n deep (left-associative), and
 * every later walk of the tree (evaluation, formatting) recurses once per level; 500 levels stay
 * far inside the JavaScript stack wherever the expression is evaluated.
 */
export const MAX_EXPRESSION_DEPTH = 500;
/** Longest expression text read, in characters. */
export const MAX_EXPRESSION_LENGTH = 20_000;
const sources = new WeakMap<Expr, string>();

/** The text an Expr was parsed from (for caret messages), when it came from parseExpression. */
export function expressionSource(expr: Expr): string | undefined {
  return sources.get(expr);
}

export function parseExpression(source: string): Expr {
  if (typeof source !== 'string') {
    throw new SurmiseError('expr.parse', `cannot read expression: expected text, got ${typeof source}`);
  }
  if (source.length > MAX_EXPRESSION_LENGTH) {
    throw new SurmiseError(
      'expr.tooLong',
      `cannot read expression: it is ${source.length.toLocaleString('en-US')} characters long, more than the ${MAX_EXPRESSION_LENGTH.toLocaleString('en-US')} read; split it into derived columns`,
      { length: source.length, limit: MAX_EXPRESSION_LENGTH },
    );
  }
  const tokens = tokenize(source);
  let k = 0;
  let depth = 0;
  /** Height of each subtree built so far (leaves 1). */
  const heights = new WeakMap<Expr, number>();
  const heightOf = (e: Expr): number => heights.get(e) ?? 1;
  /** A node over `children`, refused when the tree would be deeper than MAX_EXPRESSION_DEPTH. */
  const node = <T extends Expr>(e: T, ...children: Expr[]): T => {
    let h = 0;
    for (const c of children) h = Math.max(h, heightOf(c));
    if (h + 1 > MAX_EXPRESSION_DEPTH) {
      throw exprError(
        'expr.tooDeep',
        `cannot read expression at position ${e.pos + 1}: more than ${MAX_EXPRESSION_DEPTH} operations are chained or nested here ` +
          `(e.g. a sum or product of more than ${MAX_EXPRESSION_DEPTH} terms); split it into derived columns`,
        source,
        e.pos,
        e.end,
        { limit: MAX_EXPRESSION_DEPTH },
      );
    }
    heights.set(e, h + 1);
    return e;
  };
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
      return node({ type: 'binary', op: t.op as BinaryOp, left, right, pos: t.pos, end: t.end }, left, right);
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
        left = node({ type: 'binary', op: t.op, left, right, pos: t.pos, end: t.end }, left, right);
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
        left = node({ type: 'binary', op: t.op, left, right, pos: t.pos, end: t.end }, left, right);
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
      return node({ type: 'unary', op: t.op, arg, pos: t.pos, end: t.end }, arg);
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
      return node({ type: 'binary', op: '^', left: base, right: exponent, pos: t.pos, end: t.end }, base, exponent);
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
    return node({ type: 'call', name: info.name, args, pos: nameTok.pos, end: close.end }, ...args);
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
