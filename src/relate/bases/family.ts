/**
 * A family of base quantities of the formula search, registered in one list (list.ts): the real
 * values it reads off one column (`ofColumn`) or off an ordered pair of columns (`ofPair`), each
 * with its expression text and complexity (tree.ts). A column here is real or complex; a real
 * column has im = 0. Adding a family is one file in this folder and one line in list.ts; its
 * texts must be expressions of the expression language, so the printed formula reads back.
 */
export interface BaseColumn {
  /** The column's name as an expression writes it (backquoted when needed). */
  name: string;
  re: Float64Array;
  /** Zeros for a real column. */
  im: Float64Array;
  complex: boolean;
}

/** One candidate base quantity before the constant / non-finite check. */
export interface BaseTerm {
  text: string;
  cost: number;
  values: Float64Array;
}

export interface BaseFamily {
  name: string;
  description: string;
  /** The quantities of one column (none when the family does not apply to it). */
  ofColumn?: (c: BaseColumn) => BaseTerm[];
  /** The quantities of an ordered pair of distinct columns (none when the family does not apply). */
  ofPair?: (a: BaseColumn, b: BaseColumn) => BaseTerm[];
}
