/**
 * The `split` option of fit and search, in the project's split syntax (src/table/split.ts):
 * `random[:TRAIN,VALIDATION,TEST]` fits (or selects) on the training part and measures on the test
 * part (validation rows are left unused and counted); `where:CONDITION` fits where the condition
 * holds and measures where it does not (an undecidable condition leaves the row out, counted).
 * `kfold:K` is not a single split: fit and search refuse it and point to `folds`.
 */
import { SurmiseError } from '../errors.ts';
import type { Table } from '../table/types.ts';
import { parseSplitSpec, randomSplit } from '../table/split.ts';
import { evaluateExpression } from '../table/expr/evaluate.ts';

export interface RowSplit {
  /** Table rows of the fitting (selection) part, ascending. */
  first: Int32Array;
  /** Table rows of the held-out part, ascending. */
  second: Int32Array;
  /** Rows in neither part (validation share, or an undecidable condition). */
  unused: number;
  description: string;
}

export function splitRows(table: Table, spec: string, seed: number): RowSplit {
  const s = parseSplitSpec(spec);
  if (s.kind === 'kfold') {
    throw new SurmiseError('relate.badSplit', `\`split\` ${spec}: a k-fold split is not one fitting part and one held-out part; use \`folds\` ${s.k} for cross-validation`, { option: 'split', also: ['folds'] });
  }
  if (s.kind === 'random') {
    const r = randomSplit(table.nRows, { train: s.train, validation: s.validation, test: s.test, seed });
    return { first: r.train, second: r.test, unused: r.validation.length, description: r.description };
  }
  const v = evaluateExpression(table, s.condition);
  if (v.im) throw new SurmiseError('relate.badSplit', `\`split\` where:${s.condition}: the condition has complex values; compare re(…) or abs(…)`, { option: 'split' });
  const a: number[] = [];
  const b: number[] = [];
  let unused = 0;
  for (let i = 0; i < table.nRows; i++) {
    const c = v.re[i]!;
    if (Number.isNaN(c) || v.missing[i]) unused++;
    else if (c !== 0) a.push(i);
    else b.push(i);
  }
  if (a.length === 0 || b.length === 0) {
    throw new SurmiseError('relate.badSplit', `\`split\` where:${s.condition}: ${a.length} rows satisfy the condition and ${b.length} do not; both parts must be non-empty`, { option: 'split' });
  }
  return {
    first: Int32Array.from(a),
    second: Int32Array.from(b),
    unused,
    description: `fit where ${s.condition} (${a.length} rows), held out where not (${b.length} rows)${unused ? `; ${unused} rows undecidable` : ''}`,
  };
}
