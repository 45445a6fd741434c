/**
 * The operations the formula search composes: unary operations on a term (integer powers in the
 * chosen range, square roots, the registered function families of terms/ — log, exp, sin, cos,
 * abs, and the numeric constants each is also tried with inside — then u + 1, 1 − u) and binary
 * ones (× ÷ + −). Each unary operation says its added complexity (tree.ts), the rows where it is
 * defined, and which compositions it refuses because they only re-spell a simpler term
 * (exp(log u) = u, (u^2)^3 = u^6, abs(exp u) = exp u).
 */
import { FAMILY, FUNCTION_FAMILIES, type FunctionFamily } from './terms/index.ts';
import { powCost, powValue, type Tree, type UnaryFn } from './tree.ts';

export interface UnaryOp {
  /** How the skipped-term list names it, e.g. `sqrt(x)`. */
  label: (arg: string) => string;
  cost: number;
  make: (a: Tree) => Tree;
  /** Values of make(a) on rows lo..hi−1 from the values of a. */
  apply: (a: Float64Array, out: Float64Array, lo: number, hi: number) => void;
  /** Why the operation is undefined at value x, or null when it is defined. */
  undefinedAt: (x: number) => string | null;
  /** False when applying it to `a` only re-spells a term the grammar reaches more simply. */
  accepts: (a: Tree) => boolean;
}

export type BinaryKind = 'mul' | 'div' | 'add' | 'sub';

/** Added complexity of each binary operation (tree.ts). */
export const BINARY_COST: Record<BinaryKind, number> = { mul: 0, div: 1, add: 1, sub: 1 };

const notPow = (a: Tree): boolean => a.op !== 'pow';
const isFn = (a: Tree, fs: readonly string[] = []): boolean => a.op === 'fn' && fs.includes(a.f);
const familyOf = (a: Tree): FunctionFamily | undefined => (a.op === 'fn' ? FAMILY.get(a.f) : undefined);

function power(num: number, den: number): UnaryOp {
  const text = den === 1 ? (num < 0 ? `1/x^${-num}` : `x^${num}`) : num === 1 ? 'sqrt(x)' : num === -1 ? '1/sqrt(x)' : `x^(${num}/${den})`;
  return {
    label: (arg) => (num === -1 && den === 1 ? `1/${arg}` : text.replace('x', arg)),
    cost: powCost(num, den),
    make: (a) => ({ op: 'pow', num, den, a }),
    apply: (a, out, lo, hi) => { for (let i = lo; i < hi; i++) out[i] = powValue(a[i]!, num, den); },
    undefinedAt: (x) => (den === 2 && x < 0 ? 'is negative' : num < 0 && x === 0 ? 'is 0' : null),
    accepts: (a) => notPow(a) && !familyOf(a)?.absorbsPowers && !(familyOf(a)?.evenPowersRespell && den === 1 && num % 2 === 0),
  };
}

/** f(u) for a registered family f. */
function plain(f: FunctionFamily): UnaryOp {
  return {
    label: (arg) => `${f.name}(${arg})`,
    cost: 1,
    make: (a) => ({ op: 'fn', f: f.name as UnaryFn, a }),
    apply: (a, out, lo, hi) => { const g = f.value; for (let i = lo; i < hi; i++) out[i] = g(a[i]!); },
    undefinedAt: (x) => f.undefinedAt?.(x) ?? null,
    accepts: (a) => !isFn(a, f.refuses),
  };
}

/** f(c·u) for each numeric constant c a family is tried with inside. */
function scaled(f: FunctionFamily): UnaryOp[] {
  return (f.scaled ?? []).map(([c, text]) => ({
    label: (arg) => `${f.name}(${text.replace('u', arg)})`,
    cost: 2,
    make: (a) => ({ op: 'fn', f: f.name as UnaryFn, a: { op: 'scale', c, a } }),
    apply: (a, out, lo, hi) => { const g = f.value; for (let i = lo; i < hi; i++) out[i] = g(c * a[i]!); },
    undefinedAt: (x) => f.undefinedAt?.(c * x) ?? null,
    accepts: (a) => !isFn(a, f.scaledRefuses),
  }));
}

/** The unary operations for integer powers lo..hi (0 and 1 left out), in a fixed order. */
export function unaryOps(powers: [number, number]): UnaryOp[] {
  const ops: UnaryOp[] = [];
  for (let k = powers[0]; k <= powers[1]; k++) if (k !== 0 && k !== 1) ops.push(power(k, 1));
  ops.push(power(1, 2), power(-1, 2));
  const families = FUNCTION_FAMILIES as readonly FunctionFamily[];
  ops.push(...families.map(plain));
  // numeric constants inside functions (the Gaussian exp(−u²/2), half and double angles);
  // the inner-constant fit (inner-constants.ts) refines them
  ops.push(...families.flatMap(scaled));
  ops.push({
    label: (arg) => `${arg} + 1`,
    cost: 2,
    make: (a) => ({ op: 'shift', c: 1, s: 1, a }),
    apply: (a, out, lo, hi) => { for (let i = lo; i < hi; i++) out[i] = 1 + a[i]!; },
    undefinedAt: () => null,
    accepts: (a) => a.op !== 'shift',
  });
  ops.push({
    label: (arg) => `1 - ${arg}`,
    cost: 2,
    make: (a) => ({ op: 'shift', c: 1, s: -1, a }),
    apply: (a, out, lo, hi) => { for (let i = lo; i < hi; i++) out[i] = 1 - a[i]!; },
    undefinedAt: () => null,
    accepts: (a) => a.op !== 'shift',
  });
  return ops;
}
