import type { Expr } from './ast.ts';
import { FUNCTIONS } from './functions.ts';

// precedence levels: comparison 1, additive 2, multiplicative 3, unary 4, power 5, atom 6
function level(e: Expr): number {
  switch (e.type) {
    case 'binary':
      if (e.op === '+' || e.op === '-') return 2;
      if (e.op === '*' || e.op === '/') return 3;
      if (e.op === '^') return 5;
      return 1;
    case 'unary':
      return 4;
    case 'number':
      return e.value < 0 || Object.is(e.value, -0) ? 4 : 6;
    default:
      return 6;
  }
}

const PLAIN_NAME = /^[A-Za-z_][A-Za-z0-9_.]*$/;

/** A column name as it must be written: bare when it reads back as that column, else backquoted. */
export function formatColumnName(name: string): string {
  if (PLAIN_NAME.test(name) && name !== 'pi' && name !== 'e' && name !== 'i') return name;
  return '`' + name.replace(/`/g, '``') + '`';
}

function formatNumber(v: number): string {
  if (Number.isNaN(v)) return '(0/0)';
  if (v === Infinity) return '(1/0)';
  if (v === -Infinity) return '(-1/0)';
  if (Object.is(v, -0)) return '-0';
  return String(v); // shortest text that reads back to the same double (ECMA-262 Number::toString)
}

/**
 * Canonical text of an expression, with only the parentheses the grammar needs:
 * parseExpression(formatExpression(e)) is structurally equal to e for every parsed e.
 * @example formatExpression(parseExpression('(a+b)*-(c^2)')) // 'a + b' becomes '(a + b) * -c^2'
 */
export function formatExpression(e: Expr): string {
  const wrap = (x: Expr, need: boolean): string => (need ? `(${formatExpression(x)})` : formatExpression(x));
  switch (e.type) {
    case 'number':
      return formatNumber(e.value);
    case 'column':
      return formatColumnName(e.name);
    case 'constant':
      return e.name;
    case 'unary': {
      const inner = wrap(e.arg, level(e.arg) < 4 || e.arg.type === 'unary' || level(e.arg) === 4);
      return e.op + inner;
    }
    case 'call':
      return `${FUNCTIONS.get(e.name)?.name ?? e.name}(${e.args.map((a) => formatExpression(a)).join(', ')})`;
    case 'binary': {
      const p = level(e);
      if (e.op === '^') {
        // the base is a primary; the exponent is a unary-level operand (right-assoc)
        return `${wrap(e.left, level(e.left) <= 5)}^${wrap(e.right, level(e.right) < 4)}`;
      }
      if (p === 1) {
        return `${wrap(e.left, level(e.left) <= 1)} ${e.op} ${wrap(e.right, level(e.right) <= 1)}`;
      }
      return `${wrap(e.left, level(e.left) < p)} ${e.op} ${wrap(e.right, level(e.right) <= p)}`;
    }
  }
}
