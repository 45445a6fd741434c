/**
 * The `--split` option of fit and search: `FRACTION` (e.g. 0.8, the share of usable rows in the
 * first part; the rest is held out), drawn by a seeded permutation, or `COLUMN` naming an integer
 * or label column whose rows equal to `train`/`selection`/`1` form the first part and the others
 * the held-out part.
 */
import { SurmiseError } from '../errors.ts';
import type { Table } from '../table/types.ts';
import { Rng, deriveSeed } from '../util/rng.ts';

export function splitRows(table: Table, spec: string, seed: number): { first: Int32Array; second: Int32Array; description: string } {
  const s = spec.trim();
  const f = Number(s);
  if (s !== '' && Number.isFinite(f)) {
    if (!(f > 0 && f < 1)) throw new SurmiseError('relate.badSplit', `--split ${spec}: expected a fraction strictly between 0 and 1 (e.g. 0.8), or a column name`);
    const perm = new Rng(deriveSeed(seed, 'split')).permutation(table.nRows);
    const cut = Math.round(f * table.nRows);
    return { first: perm.slice(0, cut).sort(), second: perm.slice(cut).sort(), description: `random ${Math.round(f * 100)}/${Math.round((1 - f) * 100)} split (seed ${seed})` };
  }
  const col = table.columns.find((c) => c.name === s);
  if (!col) {
    throw new SurmiseError(
      'relate.badSplit',
      `--split ${spec}: not a fraction in (0, 1) and no column of ${table.source} has that name; columns: ${table.columns.map((c) => c.name).join(', ')}`,
    );
  }
  if (col.kind === 'complex' || col.kind === 'real') throw new SurmiseError('relate.badSplit', `--split ${spec}: the column must hold labels or integers (train/test or 1/0), it holds ${col.kind} values`);
  const first: number[] = [];
  const second: number[] = [];
  for (let i = 0; i < table.nRows; i++) {
    if (col.missing[i]) continue;
    const v = String(col.values[i]).toLowerCase();
    if (v === 'train' || v === 'selection' || v === '1') first.push(i);
    else second.push(i);
  }
  return { first: Int32Array.from(first), second: Int32Array.from(second), description: `split by column '${s}' (train/selection/1 against the rest)` };
}
