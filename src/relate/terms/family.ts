/**
 * A function family of the formula search, registered in one list (list.ts): one real function
 * of one argument that the search may apply to a term, with the rows where it is defined, the
 * inner functions it refuses (a composition that only re-spells a simpler term), and the numeric
 * constants it is also tried with inside (exp(−u), sin(2u)…; inner-constants.ts refines them).
 * Adding one is one file in this folder and one line in list.ts; it must be a function of the
 * expression language (table/expr/functions.ts), so the printed formula reads back.
 */
export interface FunctionFamily<N extends string = string> {
  /** The name the expression language and the printed formula use, e.g. `log`. */
  name: N;
  /** One line: what it is for in a search. */
  description: string;
  /** Its value at x (real). */
  value: (x: number) => number;
  /** Why it is undefined at x, or null when it is defined there. */
  undefinedAt?: (x: number) => string | null;
  /** Inner functions f(g(u)) it refuses because the composition re-spells a simpler term (log(exp u) = u). */
  refuses: readonly string[];
  /** A power of f(u) is f of a multiple of u (exp(u)^k = exp(k·u)): powers of it are refused. */
  absorbsPowers?: boolean;
  /** f(u)^k = |u|^k for even k (abs): even integer powers of it are refused. */
  evenPowersRespell?: boolean;
  /** Numeric constants c tried inside, f(c·u), each with how the label writes c·u (`-u/2`). */
  scaled?: ReadonlyArray<readonly [number, string]>;
  /** Inner functions refused under a scaled form f(c·g(u)). */
  scaledRefuses?: readonly string[];
}
