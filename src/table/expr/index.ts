/**
 * The expression language: parse, format and evaluate expressions over a table's columns, and
 * derive new columns from them. See README.md in src/table/ for the grammar and choices.
 */
export type { Expr, BinaryOp, UnaryOp, ConstantName } from './ast.ts';
export { sameExpression, expressionColumns } from './ast.ts';
export { parseExpression, expressionSource } from './parse.ts';
export { formatExpression, formatColumnName } from './format.ts';
export { evaluateExpression, compileExpression, type Evaluated, type CompiledExpression } from './evaluate.ts';
export { deriveColumn, parseDerive, withDerived, isIntegerByConstruction, type DeriveSpec } from './derive.ts';
export { realColumn, type RealValues } from './real.ts';
export { FUNCTIONS, FUNCTION_NAMES, type FunctionInfo } from './functions.ts';
