/** The data handed to learning: a row-major n×p matrix of standardized inputs and a target. */
import { SurmiseError } from '../errors.ts';

export interface TrainData {
  /** row-major n×p, standardized */
  x: Float32Array | Float64Array;
  y: Float64Array;
  n: number;
  p: number;
}

/** Check shapes and finiteness; `what` names the data set in messages ("training rows"). */
export function checkData(d: TrainData, what: string, p?: number, needY = true): void {
  if (!d || typeof d !== 'object') throw new SurmiseError('learn.badData', `${what}: expected { x, y, n, p }`);
  if (!Number.isInteger(d.n) || d.n < 0) throw new SurmiseError('learn.badData', `${what}: expected n to be an integer ≥ 0, got ${d.n}`);
  if (!Number.isInteger(d.p) || d.p < 1) throw new SurmiseError('learn.badData', `${what}: expected p to be a positive integer, got ${d.p}`);
  if (p !== undefined && d.p !== p) throw new SurmiseError('learn.shapeMismatch', `${what}: ${d.p} input columns, but the network has ${p}`);
  if (!(d.x instanceof Float32Array || d.x instanceof Float64Array) || d.x.length !== d.n * d.p) {
    throw new SurmiseError('learn.badData', `${what}: x must be a Float32Array or Float64Array of n×p = ${d.n * d.p} values, got ${d.x?.length}`);
  }
  checkFinite(d.x, d.p, what);
  if (needY) {
    if (!(d.y instanceof Float64Array) || d.y.length !== d.n) {
      throw new SurmiseError('learn.badData', `${what}: y must be a Float64Array of n = ${d.n} values, got ${d.y?.length}`);
    }
    for (let i = 0; i < d.n; i++) {
      if (!Number.isFinite(d.y[i]!)) throw new SurmiseError('learn.nonFinite', `${what}: target in row ${i + 1} is ${d.y[i]}; learning needs finite values`, { row: i + 1 });
    }
  }
}

/** Throws on the first NaN/±∞ input, naming its row and column (1-based). */
export function checkFinite(x: Float32Array | Float64Array, p: number, what: string): void {
  for (let k = 0; k < x.length; k++) {
    if (!Number.isFinite(x[k]!)) {
      const row = Math.floor(k / p) + 1;
      const col = (k % p) + 1;
      throw new SurmiseError('learn.nonFinite', `${what}: input row ${row}, column ${col} is ${x[k]}; learning needs finite values`, { row, column: col });
    }
  }
}

export function checkMatrix(x: Float32Array | Float64Array, n: number, p: number, what: string): void {
  if (!Number.isInteger(n) || n < 0) throw new SurmiseError('learn.badData', `${what}: expected n to be an integer ≥ 0, got ${n}`);
  if (!(x instanceof Float32Array || x instanceof Float64Array) || x.length !== n * p) {
    throw new SurmiseError('learn.shapeMismatch', `${what}: expected ${n}×${p} = ${n * p} values, got ${x?.length}`);
  }
}
