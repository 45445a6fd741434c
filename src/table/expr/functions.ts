/**
 * The functions an expression may call: name, arity and whether the arguments must be real.
 * The arithmetic lives in evaluate.ts; this table is what the parser checks names and arity against.
 */
export interface FunctionInfo {
  name: string;
  minArgs: number;
  maxArgs: number;
  /** Arguments must be real (an argument with a non-zero imaginary part is an error). */
  realOnly: boolean;
  summary: string;
}

const list: FunctionInfo[] = [
  { name: 'abs', minArgs: 1, maxArgs: 1, realOnly: false, summary: 'absolute value |z|' },
  { name: 'sqrt', minArgs: 1, maxArgs: 1, realOnly: false, summary: 'principal square root' },
  { name: 'exp', minArgs: 1, maxArgs: 1, realOnly: false, summary: 'exponential' },
  { name: 'log', minArgs: 1, maxArgs: 1, realOnly: false, summary: 'principal natural logarithm' },
  { name: 'sin', minArgs: 1, maxArgs: 1, realOnly: false, summary: 'sine' },
  { name: 'cos', minArgs: 1, maxArgs: 1, realOnly: false, summary: 'cosine' },
  { name: 'tan', minArgs: 1, maxArgs: 1, realOnly: false, summary: 'tangent' },
  { name: 'atan2', minArgs: 2, maxArgs: 2, realOnly: true, summary: 'angle of the point (x, y), atan2(y, x)' },
  { name: 'min', minArgs: 2, maxArgs: Infinity, realOnly: true, summary: 'smallest argument' },
  { name: 'max', minArgs: 2, maxArgs: Infinity, realOnly: true, summary: 'largest argument' },
  { name: 'floor', minArgs: 1, maxArgs: 1, realOnly: true, summary: 'largest integer <= x' },
  { name: 'ceil', minArgs: 1, maxArgs: 1, realOnly: true, summary: 'smallest integer >= x' },
  { name: 'round', minArgs: 1, maxArgs: 1, realOnly: true, summary: 'nearest integer, halves away from zero' },
  { name: 'sign', minArgs: 1, maxArgs: 1, realOnly: true, summary: '-1, 0 or 1' },
  { name: 're', minArgs: 1, maxArgs: 1, realOnly: false, summary: 'real part' },
  { name: 'im', minArgs: 1, maxArgs: 1, realOnly: false, summary: 'imaginary part' },
  { name: 'arg', minArgs: 1, maxArgs: 1, realOnly: false, summary: 'principal argument in (-pi, pi]' },
  { name: 'conj', minArgs: 1, maxArgs: 1, realOnly: false, summary: 'complex conjugate' },
];

export const FUNCTIONS: ReadonlyMap<string, FunctionInfo> = new Map(list.map((f) => [f.name, f]));
export const FUNCTION_NAMES: readonly string[] = list.map((f) => f.name);
