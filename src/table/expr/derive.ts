import { SurmiseError } from '../../errors.ts';
import type { Column, Table } from '../types.ts';
import type { Expr } from './ast.ts';
import { compileExpression } from './evaluate.ts';
import { parseExpression } from './parse.ts';

/**
 * True when the expression can only produce integers from integer inputs: integer literals and
 * integer columns combined by + - *, unary minus, x^k for a literal k >= 0, abs, min, max, re,
 * conj, floor, ceil, round, sign and comparisons (1/0). Division never counts.
 */
export function isIntegerByConstruction(expr: Expr, table: Table): boolean {
  const rec = (e: Expr): boolean => {
    switch (e.type) {
      case 'number':
        return Number.isInteger(e.value);
      case 'constant':
        return false;
      case 'column': {
        const c = table.columns.find((col) => col.name === e.name);
        return c !== undefined && c.kind === 'integer';
      }
      case 'unary':
        return rec(e.arg);
      case 'binary':
        switch (e.op) {
          case '+':
          case '-':
          case '*':
            return rec(e.left) && rec(e.right);
          case '/':
            return false;
          case '^':
            return rec(e.left) && e.right.type === 'number' && Number.isInteger(e.right.value) && e.right.value >= 0;
          default:
            return true; // comparisons give 1 or 0
        }
      case 'call':
        switch (e.name) {
          case 'floor':
          case 'ceil':
          case 'round':
          case 'sign':
            return true;
          case 'abs':
          case 'min':
          case 'max':
          case 're':
          case 'conj':
            return e.args.every(rec);
          case 'im':
            return rec(e.args[0]!); // im of an integer-valued (real) expression is 0
          default:
            return false;
        }
    }
  };
  return rec(expr);
}

/**
 * A new column `name` computed from `source` on every row of `table`: a ComplexColumn when some
 * value has a non-zero imaginary part, else a RealColumn of kind 'integer' when the expression is
 * integer by construction and every finite value is integral, else 'real'. The table is unchanged.
 */
export function deriveColumn(table: Table, name: string, source: string): Column {
  const compiled = compileExpression(table, source);
  const { re, im, missing } = compiled.evaluate();
  if (im) return { name, kind: 'complex', re, im, missing };
  let integral = isIntegerByConstruction(compiled.expr, table);
  if (integral) {
    for (let i = 0; i < re.length; i++) {
      const v = re[i]!;
      if (Number.isFinite(v) && !Number.isInteger(v)) {
        integral = false;
        break;
      }
    }
  }
  return { name, kind: integral ? 'integer' : 'real', values: re, missing };
}

/** A derived column as every stage's options take it: its name and the expression computing it. */
export interface DeriveSpec {
  name: string;
  source: string;
}

/**
 * A shallow copy of `table` with the derived columns appended in order (each may use the ones
 * before it); the table is unchanged. A name the table already has is refused (table.duplicateColumn).
 */
export function withDerived(table: Table, derive: readonly DeriveSpec[] = []): Table {
  if (derive.length === 0) return table;
  const columns = [...table.columns];
  for (const d of derive) {
    if (columns.some((c) => c.name === d.name)) {
      const ofTable = table.columns.some((c) => c.name === d.name);
      throw new SurmiseError(
        'table.duplicateColumn',
        ofTable
          ? `${table.source}: derived column '${d.name}' would replace the table's column of the same name; choose another name`
          : `${table.source}: derived column '${d.name}' is given twice; choose another name for one of them`,
        { option: 'derive', column: d.name },
      );
    }
    columns.push(deriveColumn({ ...table, columns: [...columns] }, d.name, d.source));
  }
  return { ...table, columns };
}

const PLAIN_NAME = /^[A-Za-z_][A-Za-z0-9_.]*$/;

/**
 * Split a `NAME=EXPRESSION` option value (as in `--derive twice_g=2*genus_bound`) at its first '='.
 * NAME is a plain name or a backquoted one (`` `half det`=... ``); the expression must parse.
 * Errors: expr.badDerive (no '=', empty or malformed name, empty expression), expr.parse.
 */
export function parseDerive(spec: string): { name: string; source: string } {
  const bad = (why: string): never => {
    throw new SurmiseError(
      'expr.badDerive',
      `cannot read derived column '${spec}': ${why}; expected NAME=EXPRESSION, e.g. twice_g=2*genus_bound`,
      { spec },
    );
  };
  let name: string;
  let rest: string;
  const trimmed = spec.trimStart();
  if (trimmed.startsWith('`')) {
    const close = trimmed.indexOf('`', 1);
    if (close < 0) bad('the backquoted name is not closed');
    name = trimmed.slice(1, close);
    const after = trimmed.slice(close + 1).trimStart();
    if (!after.startsWith('=')) bad("expected '=' after the name");
    rest = after.slice(1);
  } else {
    const eq = spec.indexOf('=');
    if (eq < 0) bad("there is no '='");
    name = spec.slice(0, eq).trim();
    rest = spec.slice(eq + 1);
    if (name.length > 0 && !PLAIN_NAME.test(name)) {
      bad(`'${name}' is not a plain name (letters, digits, '_' and '.', not starting with a digit); put other names in backquotes`);
    }
  }
  if (name.length === 0) bad('the name before = is empty');
  if (rest.startsWith('=')) bad("the name is followed by '==' (a comparison), not '='");
  const source = rest.trim();
  if (source.length === 0) bad('the expression after = is empty');
  parseExpression(source);
  return { name, source };
}
