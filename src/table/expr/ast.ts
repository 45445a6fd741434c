/**
 * The syntax tree of a surmise expression. Positions are 0-based offsets into the source text
 * (`pos` inclusive, `end` exclusive); messages show them 1-based.
 */
export type BinaryOp = '+' | '-' | '*' | '/' | '^' | '<' | '<=' | '>' | '>=' | '==' | '!=';
export type UnaryOp = '-' | '+';
export type ConstantName = 'pi' | 'e' | 'i';

export interface NumberNode {
  type: 'number';
  value: number;
  pos: number;
  end: number;
}
export interface ColumnNode {
  type: 'column';
  name: string;
  pos: number;
  end: number;
}
export interface ConstantNode {
  type: 'constant';
  name: ConstantName;
  pos: number;
  end: number;
}
export interface UnaryNode {
  type: 'unary';
  op: UnaryOp;
  arg: Expr;
  pos: number;
  end: number;
}
export interface BinaryNode {
  type: 'binary';
  op: BinaryOp;
  left: Expr;
  right: Expr;
  pos: number; // position of the operator
  end: number;
}
export interface CallNode {
  type: 'call';
  name: string;
  args: Expr[];
  pos: number;
  end: number;
}

export type Expr = NumberNode | ColumnNode | ConstantNode | UnaryNode | BinaryNode | CallNode;

export const COMPARISON_OPS: ReadonlySet<string> = new Set(['<', '<=', '>', '>=', '==', '!=']);

/** Structural equality, ignoring positions. */
export function sameExpression(a: Expr, b: Expr): boolean {
  switch (a.type) {
    case 'number':
      return b.type === 'number' && Object.is(a.value, b.value);
    case 'column':
      return b.type === 'column' && a.name === b.name;
    case 'constant':
      return b.type === 'constant' && a.name === b.name;
    case 'unary':
      return b.type === 'unary' && a.op === b.op && sameExpression(a.arg, b.arg);
    case 'binary':
      return b.type === 'binary' && a.op === b.op && sameExpression(a.left, b.left) && sameExpression(a.right, b.right);
    case 'call':
      return (
        b.type === 'call' &&
        a.name === b.name &&
        a.args.length === b.args.length &&
        a.args.every((x, k) => sameExpression(x, b.args[k]!))
      );
  }
}

/** The column names an expression reads, in order of first appearance, without repeats. */
export function expressionColumns(expr: Expr): string[] {
  const seen = new Set<string>();
  const visit = (e: Expr): void => {
    switch (e.type) {
      case 'column':
        seen.add(e.name);
        return;
      case 'unary':
        visit(e.arg);
        return;
      case 'binary':
        visit(e.left);
        visit(e.right);
        return;
      case 'call':
        e.args.forEach(visit);
        return;
      default:
        return;
    }
  };
  visit(expr);
  return [...seen];
}
