import { SurmiseError, didYouMean, printable } from '../../errors.ts';
import type { Column, Table } from '../types.ts';
import type { BinaryNode, CallNode, Expr } from './ast.ts';
import { expressionColumns } from './ast.ts';
import { exprError } from './caret.ts';
import { cdiv, cexp, clog, ccos, cmul, cpow, csin, csqrt, ctan, oddRootNumerator, out } from './complex.ts';
import { FUNCTIONS, FUNCTION_NAMES } from './functions.ts';
import { expressionSource, parseExpression } from './parse.ts';

/** An expression evaluated on every row. `im` is null when every value is real. */
export interface Evaluated {
  re: Float64Array;
  im: Float64Array | null;
  /** 1 where any input cell of the row is missing (its value is NaN then). */
  missing: Uint8Array;
}

/** A value during evaluation: a column (length nRows) or a scalar (length 1, broadcast). */
interface Val {
  re: Float64Array;
  im: Float64Array | null;
  scalar: boolean;
}

/** An expression checked against a table's columns, ready to evaluate (possibly many times). */
export interface CompiledExpression {
  expr: Expr;
  /** Column names the expression reads. */
  columns: string[];
  evaluate(): Evaluated;
}

const ZERO = new Float64Array(1);

interface Ctx {
  table: Table;
  n: number;
  source: string | undefined;
  cols: Map<string, { re: Float64Array; im: Float64Array | null }>;
}

function resolveColumn(table: Table, name: string): { col: Column; part?: 're' | 'im' } | undefined {
  const exact = table.columns.find((c) => c.name === name);
  if (exact) return { col: exact };
  // `X.re` / `X.im` of a complex column X (the names its features carry)
  const m = /^(.*)\.(re|im)$/.exec(name);
  if (m) {
    const base = table.columns.find((c) => c.name === m[1]);
    if (base && base.kind === 'complex') return { col: base, part: m[2] as 're' | 'im' };
  }
  return undefined;
}

/**
 * Check `source` against `table` (columns exist, none is a label) and return an evaluator.
 * Errors: expr.parse, expr.unknownFunction, expr.arity, expr.unknownColumn, expr.labelColumn,
 * and at evaluation expr.notReal (a complex value where a real one is required).
 */
export function compileExpression(table: Table, source: string | Expr): CompiledExpression {
  const expr = typeof source === 'string' ? parseExpression(source) : source;
  const text = typeof source === 'string' ? source : expressionSource(expr);
  refuseAmbiguousConstants(table, expr, text);
  const names = expressionColumns(expr);
  const cols = new Map<string, { re: Float64Array; im: Float64Array | null }>();
  const masks: Uint8Array[] = [];
  for (const name of names) {
    const r = resolveColumn(table, name);
    const node = findColumnNode(expr, name)!;
    if (!r) {
      const candidates = table.columns.map((c) => c.name);
      let hint = didYouMean(name, candidates);
      if (hint === '' && FUNCTIONS.has(name)) hint = ` ('${name}' is a function: write ${name}(...))`;
      throw exprError(
        'expr.unknownColumn',
        `unknown column '${printable(name)}' at position ${node.pos + 1} of the expression (table ${table.source})${hint}`,
        text,
        node.pos,
        node.end,
        { column: name },
      );
    }
    const { col, part } = r;
    if (col.kind === 'label') {
      throw exprError(
        'expr.labelColumn',
        `column '${printable(name)}' holds labels (text), so it cannot be used in an expression (position ${node.pos + 1})`,
        text,
        node.pos,
        node.end,
        { column: name },
      );
    }
    masks.push(col.missing);
    if (col.kind === 'complex') cols.set(name, part === undefined ? { re: col.re, im: col.im } : { re: part === 're' ? col.re : col.im, im: null });
    else cols.set(name, { re: col.values, im: null });
  }
  const ctx: Ctx = { table, n: table.nRows, source: text, cols };
  const shared = new Set<Float64Array>();
  for (const c of cols.values()) {
    shared.add(c.re);
    if (c.im) shared.add(c.im);
  }
  return {
    expr,
    columns: names,
    evaluate(): Evaluated {
      const n = table.nRows;
      const missing = new Uint8Array(n);
      for (const m of masks) for (let i = 0; i < n; i++) missing[i]! |= m[i]!;
      const v = evalNode(ctx, expr);
      let re = broadcast(v.re, v.scalar, n, shared);
      let im = v.im ? broadcast(v.im, v.scalar, n, shared) : null;
      if (im && isAllReal(re, im)) {
        for (let i = 0; i < n; i++) if (Number.isNaN(im[i]!)) re[i] = NaN;
        im = null;
      }
      for (let i = 0; i < n; i++) {
        if (missing[i]) {
          re[i] = NaN;
          if (im) im[i] = NaN;
        }
      }
      return { re, im, missing };
    },
  };
}

/** Evaluate an expression on every row of `table`, column at a time. */
export function evaluateExpression(table: Table, source: string | Expr): Evaluated {
  return compileExpression(table, source).evaluate();
}

const CONSTANT_VALUES: Record<string, string> = { pi: 'the constant π = 3.14159…', e: 'the constant e = 2.71828…', i: 'the imaginary unit i' };

/**
 * A bare `pi`, `e` or `i` is a constant; when the table also has a column of that name the
 * reading is ambiguous, so it is refused with the backquoted form that names the column.
 */
function refuseAmbiguousConstants(table: Table, e: Expr, text: string | undefined): void {
  const stack: Expr[] = [e];
  while (stack.length) {
    const x = stack.pop()!;
    if (x.type === 'constant' && resolveColumn(table, x.name)) {
      throw exprError(
        'expr.ambiguousName',
        `'${x.name}' at position ${x.pos + 1} is both a column of the table and ${CONSTANT_VALUES[x.name]}; ` +
          `write \`${x.name}\` (in backquotes) for the column`,
        text,
        x.pos,
        x.end,
        { column: x.name },
      );
    }
    if (x.type === 'unary') stack.push(x.arg);
    else if (x.type === 'binary') stack.push(x.right, x.left);
    else if (x.type === 'call') for (let k = x.args.length - 1; k >= 0; k--) stack.push(x.args[k]!);
  }
}

function findColumnNode(e: Expr, name: string): Expr | undefined {
  switch (e.type) {
    case 'column':
      return e.name === name ? e : undefined;
    case 'unary':
      return findColumnNode(e.arg, name);
    case 'binary':
      return findColumnNode(e.left, name) ?? findColumnNode(e.right, name);
    case 'call':
      for (const a of e.args) {
        const f = findColumnNode(a, name);
        if (f) return f;
      }
      return undefined;
    default:
      return undefined;
  }
}

function broadcast(a: Float64Array, scalar: boolean, n: number, shared: Set<Float64Array>): Float64Array {
  if (scalar) return new Float64Array(n).fill(a[0]!);
  return shared.has(a) ? a.slice() : a;
}

/** True when every imaginary part is 0 (a NaN imaginary part with a NaN real part counts as real). */
function isAllReal(re: Float64Array, im: Float64Array): boolean {
  for (let i = 0; i < im.length; i++) {
    const y = im[i]!;
    if (y !== 0 && !(Number.isNaN(y) && Number.isNaN(re[i]!))) return false;
  }
  return true;
}

const scalarVal = (re: number, im: number | null = null): Val => ({
  re: Float64Array.of(re),
  im: im === null ? null : Float64Array.of(im),
  scalar: true,
});

function evalNode(ctx: Ctx, e: Expr): Val {
  switch (e.type) {
    case 'number':
      return scalarVal(e.value);
    case 'constant':
      return e.name === 'pi' ? scalarVal(Math.PI) : e.name === 'e' ? scalarVal(Math.E) : scalarVal(0, 1);
    case 'column': {
      const c = ctx.cols.get(e.name);
      if (!c) throw new SurmiseError('expr.unknownColumn', `unknown column '${e.name}'`, undefined, 1);
      return { re: c.re, im: c.im, scalar: false };
    }
    case 'unary': {
      const a = evalNode(ctx, e.arg);
      if (e.op === '+') return a;
      return { re: a.re.map((x) => -x), im: a.im ? a.im.map((x) => -x) : null, scalar: a.scalar };
    }
    case 'binary':
      return evalBinary(ctx, e);
    case 'call':
      return evalCall(ctx, e);
  }
}

/** The real parts of `v`, or expr.notReal naming `what` when some value has a non-zero imaginary part. */
function requireReal(ctx: Ctx, v: Val, what: string, node: Expr): Float64Array {
  if (!v.im) return v.re;
  for (let i = 0; i < v.im.length; i++) {
    const y = v.im[i]!;
    if (y !== 0 && !Number.isNaN(y)) {
      const row = v.scalar ? '' : ` (first at data row ${i + 1}${ctx.table.lines ? `, line ${ctx.table.lines[i]}` : ''}: ${fmtC(v.re[i]!, y)})`;
      throw exprError(
        'expr.notReal',
        `${what} needs real values, but the argument at position ${node.pos + 1} is complex${row}; take re(), im() or abs() first`,
        ctx.source,
        node.pos,
        node.end,
      );
    }
  }
  return v.re;
}

function fmtC(a: number, b: number): string {
  return `${a}${b < 0 ? '-' : '+'}${Math.abs(b)}i`;
}

function outLen(ctx: Ctx, a: Val, b: Val): number {
  return a.scalar && b.scalar ? 1 : ctx.n;
}

function evalBinary(ctx: Ctx, e: BinaryNode): Val {
  const a = evalNode(ctx, e.left);
  const b = evalNode(ctx, e.right);
  const n = outLen(ctx, a, b);
  const scalar = n === 1 && a.scalar && b.scalar;
  const sa = a.scalar ? 0 : 1;
  const sb = b.scalar ? 0 : 1;
  const op = e.op;
  if (op === '<' || op === '<=' || op === '>' || op === '>=' || op === '==' || op === '!=') {
    const x = requireReal(ctx, a, `the comparison '${op}'`, e.left);
    const y = requireReal(ctx, b, `the comparison '${op}'`, e.right);
    const r = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const p = x[i * sa]!;
      const q = y[i * sb]!;
      if (Number.isNaN(p) || Number.isNaN(q)) r[i] = NaN;
      else
        r[i] =
          op === '<' ? +(p < q) : op === '<=' ? +(p <= q) : op === '>' ? +(p > q) : op === '>=' ? +(p >= q) : op === '==' ? +(p === q) : +(p !== q);
    }
    return { re: r, im: null, scalar };
  }
  if (!a.im && !b.im) return realArith(op, a.re, sa, b.re, sb, n, scalar);
  const ar = a.re;
  const ai = a.im ?? ZERO;
  const br = b.re;
  const bi = b.im ?? ZERO;
  const sai = a.im ? sa : 0;
  const sbi = b.im ? sb : 0;
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  switch (op) {
    case '+':
      for (let i = 0; i < n; i++) {
        re[i] = ar[i * sa]! + br[i * sb]!;
        im[i] = ai[i * sai]! + bi[i * sbi]!;
      }
      break;
    case '-':
      for (let i = 0; i < n; i++) {
        re[i] = ar[i * sa]! - br[i * sb]!;
        im[i] = ai[i * sai]! - bi[i * sbi]!;
      }
      break;
    case '*':
      for (let i = 0; i < n; i++) {
        cmul(ar[i * sa]!, ai[i * sai]!, br[i * sb]!, bi[i * sbi]!);
        re[i] = out.re;
        im[i] = out.im;
      }
      break;
    case '/':
      for (let i = 0; i < n; i++) {
        cdiv(ar[i * sa]!, ai[i * sai]!, br[i * sb]!, bi[i * sbi]!);
        re[i] = out.re;
        im[i] = out.im;
      }
      break;
    case '^':
      for (let i = 0; i < n; i++) {
        cpow(ar[i * sa]!, ai[i * sai]!, br[i * sb]!, bi[i * sbi]!);
        re[i] = out.re;
        im[i] = out.im;
      }
      break;
  }
  return { re, im, scalar };
}

/**
 * Real arithmetic. x^y for x < 0 and non-integer y: real (-1)^p |x|^y when y = p/q with q odd
 * (so (-8)^(1/3) = -2, the real cube root), else the principal complex value |x|^y e^(i pi y).
 */
function realArith(op: string, x: Float64Array, sa: number, y: Float64Array, sb: number, n: number, scalar: boolean): Val {
  const r = new Float64Array(n);
  switch (op) {
    case '+':
      for (let i = 0; i < n; i++) r[i] = x[i * sa]! + y[i * sb]!;
      return { re: r, im: null, scalar };
    case '-':
      for (let i = 0; i < n; i++) r[i] = x[i * sa]! - y[i * sb]!;
      return { re: r, im: null, scalar };
    case '*':
      for (let i = 0; i < n; i++) r[i] = x[i * sa]! * y[i * sb]!;
      return { re: r, im: null, scalar };
    case '/':
      for (let i = 0; i < n; i++) r[i] = x[i * sa]! / y[i * sb]!;
      return { re: r, im: null, scalar };
  }
  // '^'
  let im: Float64Array | null = null;
  for (let i = 0; i < n; i++) {
    const p = x[i * sa]!;
    const q = y[i * sb]!;
    if (p >= 0 || Number.isInteger(q) || Number.isNaN(p) || !Number.isFinite(q)) {
      r[i] = Math.pow(p, q);
      continue;
    }
    const num = oddRootNumerator(q);
    if (num !== undefined) {
      r[i] = (num % 2 === 0 ? 1 : -1) * Math.pow(-p, q);
      continue;
    }
    const m = Math.pow(-p, q);
    im ??= new Float64Array(n);
    r[i] = m * Math.cos(Math.PI * q);
    im[i] = m * Math.sin(Math.PI * q);
  }
  return { re: r, im, scalar };
}

type C1 = (a: number, b: number) => void;

function mapReal(v: Val, f: (x: number) => number): Val {
  const n = v.re.length;
  const r = new Float64Array(n);
  const x = v.re;
  for (let i = 0; i < n; i++) r[i] = f(x[i]!);
  return { re: r, im: null, scalar: v.scalar };
}

/** Apply a complex kernel; when the value is real and `staysReal(x)` holds everywhere, use `realF`. */
function mapMaybeComplex(v: Val, realF: (x: number) => number, cf: C1, staysReal: (x: number) => boolean): Val {
  const x = v.re;
  const n = x.length;
  if (!v.im) {
    let ok = true;
    for (let i = 0; i < n; i++)
      if (!staysReal(x[i]!)) {
        ok = false;
        break;
      }
    if (ok) return mapReal(v, realF);
  }
  const y = v.im ?? new Float64Array(n);
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    cf(x[i]!, y[i]!);
    re[i] = out.re;
    im[i] = out.im;
  }
  return { re, im, scalar: v.scalar };
}

const always = (): boolean => true;
const nonNegative = (x: number): boolean => !(x < 0);

function roundHalfAway(x: number): number {
  return x < 0 ? -Math.round(-x) : Math.round(x);
}

function evalCall(ctx: Ctx, e: CallNode): Val {
  const info = FUNCTIONS.get(e.name);
  if (!info) {
    throw exprError('expr.unknownFunction', `unknown function '${e.name}'${didYouMean(e.name, FUNCTION_NAMES)}`, ctx.source, e.pos, e.end);
  }
  // re(a / b) is the real part of a quotient: compute only that (no imaginary array)
  const inner = e.args[0]!;
  if (e.name === 're' && inner.type === 'binary' && inner.op === '/') {
    return realQuotient(ctx, evalNode(ctx, inner.left), evalNode(ctx, inner.right));
  }
  const args = e.args.map((a) => evalNode(ctx, a));
  const arg = args[0]!;
  if (info.realOnly) {
    const xs = args.map((a, k) => requireReal(ctx, a, info.name, e.args[k]!));
    const x = xs[0]!;
    switch (e.name) {
      case 'floor':
        return mapReal({ re: x, im: null, scalar: arg.scalar }, Math.floor);
      case 'ceil':
        return mapReal({ re: x, im: null, scalar: arg.scalar }, Math.ceil);
      case 'round':
        return mapReal({ re: x, im: null, scalar: arg.scalar }, roundHalfAway);
      case 'sign':
        return mapReal({ re: x, im: null, scalar: arg.scalar }, (t) => (t > 0 ? 1 : t < 0 ? -1 : t === 0 ? 0 : NaN));
      default: {
        // atan2, min, max: n-ary over broadcast arguments
        const scalar = args.every((a) => a.scalar);
        const n = scalar ? 1 : ctx.n;
        const r = new Float64Array(n);
        const strides = args.map((a) => (a.scalar ? 0 : 1));
        if (e.name === 'atan2') {
          const y = xs[0]!;
          const xx = xs[1]!;
          const s0 = strides[0]!;
          const s1 = strides[1]!;
          for (let i = 0; i < n; i++) r[i] = Math.atan2(y[i * s0]!, xx[i * s1]!);
        } else {
          const isMin = e.name === 'min';
          for (let i = 0; i < n; i++) {
            let best = xs[0]![i * strides[0]!]!;
            for (let k = 1; k < xs.length; k++) {
              const t = xs[k]![i * strides[k]!]!;
              if (Number.isNaN(t) || Number.isNaN(best)) best = NaN;
              else if (isMin ? t < best : t > best) best = t;
            }
            r[i] = best;
          }
        }
        return { re: r, im: null, scalar };
      }
    }
  }
  switch (e.name) {
    case 'abs':
      if (!arg.im) return mapReal(arg, Math.abs);
      return { re: hypotCols(arg.re, arg.im), im: null, scalar: arg.scalar };
    case 'sqrt':
      return mapMaybeComplex(arg, Math.sqrt, csqrt, nonNegative);
    case 'log':
      return mapMaybeComplex(arg, Math.log, clog, nonNegative);
    case 'exp':
      return mapMaybeComplex(arg, Math.exp, cexp, always);
    case 'sin':
      return mapMaybeComplex(arg, Math.sin, csin, always);
    case 'cos':
      return mapMaybeComplex(arg, Math.cos, ccos, always);
    case 'tan':
      return mapMaybeComplex(arg, Math.tan, ctan, always);
    case 're':
      return { re: arg.re, im: null, scalar: arg.scalar };
    case 'im':
      return { re: arg.im ?? zerosLike(arg.re), im: null, scalar: arg.scalar };
    case 'conj':
      return { re: arg.re, im: arg.im ? arg.im.map((y) => -y) : null, scalar: arg.scalar };
    case 'arg': {
      const x = arg.re;
      const r = new Float64Array(x.length);
      if (arg.im) {
        const y = arg.im;
        for (let i = 0; i < x.length; i++) r[i] = Math.atan2(y[i]!, x[i]!);
      } else for (let i = 0; i < x.length; i++) r[i] = x[i]! < 0 ? Math.PI : Number.isNaN(x[i]!) ? NaN : 0;
      return { re: r, im: null, scalar: arg.scalar };
    }
  }
  throw new SurmiseError('expr.internal', `function '${e.name}' has no implementation`, undefined, 1);
}

function zerosLike(x: Float64Array): Float64Array {
  const z = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) if (Number.isNaN(x[i]!)) z[i] = NaN;
  return z;
}

function hypotCols(x: Float64Array, y: Float64Array): Float64Array {
  const r = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) r[i] = Math.hypot(x[i]!, y[i]!);
  return r;
}

/** re(p/q) = (a c + b d)/(c² + d²) for p = a+bi, q = c+di (Smith's scaling), without the imaginary part. */
function realQuotient(ctx: Ctx, p: Val, q: Val): Val {
  const n = outLen(ctx, p, q);
  const sa = p.scalar ? 0 : 1;
  const sb = q.scalar ? 0 : 1;
  const ar = p.re;
  const ai = p.im ?? ZERO;
  const sai = p.im ? sa : 0;
  const br = q.re;
  const bi = q.im ?? ZERO;
  const sbi = q.im ? sb : 0;
  const r = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    cdiv(ar[i * sa]!, ai[i * sai]!, br[i * sb]!, bi[i * sbi]!);
    r[i] = out.re;
  }
  return { re: r, im: null, scalar: n === 1 && p.scalar && q.scalar };
}
