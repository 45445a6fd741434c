/**
 * The registered function families (list.ts) and what is derived from them: the type UnaryFn of a
 * tree's function node, its values (FN), and the grammar's unary operations (grammar.ts).
 */
import { FUNCTION_FAMILIES } from './list.ts';
import type { FunctionFamily } from './family.ts';

export { FUNCTION_FAMILIES };
export type { FunctionFamily } from './family.ts';

/** A function the search may apply, by name. */
export type UnaryFn = (typeof FUNCTION_FAMILIES)[number]['name'];

/** Each family by name. */
export const FAMILY: ReadonlyMap<string, FunctionFamily> = new Map(FUNCTION_FAMILIES.map((f) => [f.name, f as FunctionFamily]));

/** The value of each registered function, by name. */
export const FN = Object.fromEntries(FUNCTION_FAMILIES.map((f) => [f.name, f.value])) as Record<UnaryFn, (x: number) => number>;
