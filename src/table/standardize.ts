import { SurmiseError } from '../errors.ts';
import { kahanSum } from '../util/sum.ts';

/** The learned fields of a Standardizer, plain JSON. */
export interface StandardizerState {
  names: string[];
  mean: number[];
  std: number[];
  kept: string[];
  dropped: Array<{ name: string; reason: 'zero variance' }>;
}

/** Arithmetic mean by compensated summation: (1/n) Σ x_i (Neumaier's sum, src/util/sum.ts). */
export function columnMean(x: Float64Array, rows?: Int32Array): number {
  const n = rows ? rows.length : x.length;
  return kahanSum(x, rows) / n;
}

/**
 * Sample standard deviation, two-pass: s = sqrt(Σ (x_i − x̄)² / (n − 1)) with compensated sums
 * (the corrected two-pass algorithm's first term; Chan, Golub & LeVeque, "Algorithms for computing
 * the sample variance", The American Statistician 37, 1983).
 * @example sampleStd(Float64Array.of(1, 2, 3)) // 1
 */
export function sampleStd(x: Float64Array, mean: number, rows?: Int32Array): number {
  const n = rows ? rows.length : x.length;
  // Neumaier's compensated sum of the squared deviations, inline (no scratch array)
  let sum = 0;
  let c = 0;
  for (let k = 0; k < n; k++) {
    const v = x[rows ? rows[k]! : k]! - mean;
    const t = v * v;
    const u = sum + t;
    c += Math.abs(sum) >= t ? sum - u + t : t - u + sum;
    sum = u;
  }
  return Math.sqrt((sum + c) / (n - 1));
}

/**
 * z-scores fitted on training rows only: z = (x − mean) / s with s the SAMPLE standard deviation
 * (divisor n − 1). A feature whose training values are all equal (zero variance) is reported in
 * `dropped` by name and left out of the transformed matrix instead of being divided by zero.
 * @example new Standardizer().fit([Float64Array.of(1, 2, 3)], ['a']).transform([Float64Array.of(1, 2, 3)]) // [-1, 0, 1]
 */
export class Standardizer {
  private state: StandardizerState | undefined;
  private keptIndex: number[] = [];

  /** Learn mean and sample standard deviation of each column over `rows` (default: all rows). */
  fit(x: Float64Array[], names: string[], rows?: Int32Array): this {
    if (x.length !== names.length) {
      throw new SurmiseError('standardize.badInput', `got ${x.length} columns but ${names.length} names`);
    }
    const n = rows ? rows.length : (x[0]?.length ?? 0);
    if (n < 2) {
      throw new SurmiseError('standardize.tooFewRows', `standardizing needs at least 2 training rows to estimate a standard deviation, got ${n}`);
    }
    const mean: number[] = [];
    const std: number[] = [];
    const kept: string[] = [];
    const dropped: StandardizerState['dropped'] = [];
    this.keptIndex = [];
    x.forEach((col, j) => {
      const name = names[j]!;
      if (!rows && col.length !== n) {
        throw new SurmiseError('standardize.badInput', `column '${name}' has ${col.length} rows, expected ${n}`);
      }
      let lo = Infinity;
      let hi = -Infinity;
      for (let k = 0; k < n; k++) {
        const v = col[rows ? rows[k]! : k]!;
        if (!Number.isFinite(v)) {
          throw new SurmiseError(
            'standardize.nonFinite',
            `column '${name}' has a non-finite value (${v}) at training row ${rows ? rows[k]! : k}; apply the row policy first`,
          );
        }
        if (v < lo) lo = v;
        if (v > hi) hi = v;
      }
      const m = columnMean(col, rows);
      const s = lo === hi ? 0 : sampleStd(col, m, rows);
      mean.push(m);
      std.push(s);
      if (s === 0 || !Number.isFinite(s)) dropped.push({ name, reason: 'zero variance' });
      else {
        kept.push(name);
        this.keptIndex.push(j);
      }
    });
    this.state = { names: [...names], mean, std, kept, dropped };
    return this;
  }

  private fitted(): StandardizerState {
    if (!this.state) throw new SurmiseError('standardize.notFitted', 'the standardizer was used before fit(); fit it on the training rows first');
    return this.state;
  }

  /** Names of the columns that are transformed (in order). */
  get kept(): string[] {
    return [...this.fitted().kept];
  }

  /** Columns left out because their training values are all equal. */
  get dropped(): Array<{ name: string; reason: 'zero variance' }> {
    return this.fitted().dropped.map((d) => ({ ...d }));
  }

  /** Row-major n × p' matrix of z-scores for `rows` (default all rows) of the fitted columns. */
  transform(x: Float64Array[], rows?: Int32Array): Float64Array {
    const s = this.fitted();
    if (x.length !== s.names.length) {
      throw new SurmiseError('standardize.badInput', `fitted on ${s.names.length} columns, got ${x.length}`);
    }
    const n = rows ? rows.length : (x[0]?.length ?? 0);
    const p = this.keptIndex.length;
    const out = new Float64Array(n * p);
    this.keptIndex.forEach((j, c) => {
      const col = x[j]!;
      const m = s.mean[j]!;
      const sd = s.std[j]!;
      for (let k = 0; k < n; k++) out[k * p + c] = (col[rows ? rows[k]! : k]! - m) / sd;
    });
    return out;
  }

  /**
   * Back to the original units: one column per fitted name (all p of them, in fit order); a
   * dropped constant column comes back as its constant value.
   */
  inverseTransform(z: Float64Array): Float64Array[] {
    const s = this.fitted();
    const p = this.keptIndex.length;
    const n = p === 0 ? 0 : z.length / p;
    if (p > 0 && !Number.isInteger(n)) {
      throw new SurmiseError('standardize.badInput', `a matrix of ${z.length} values is not a whole number of rows of ${p} columns`);
    }
    const cols = s.names.map((_, j) => new Float64Array(n).fill(s.mean[j]!));
    this.keptIndex.forEach((j, c) => {
      const col = cols[j]!;
      const m = s.mean[j]!;
      const sd = s.std[j]!;
      for (let k = 0; k < n; k++) col[k] = z[k * p + c]! * sd + m;
    });
    return cols;
  }

  toJSON(): StandardizerState {
    const s = this.fitted();
    return { names: [...s.names], mean: [...s.mean], std: [...s.std], kept: [...s.kept], dropped: s.dropped.map((d) => ({ ...d })) };
  }

  static fromJSON(state: StandardizerState): Standardizer {
    const ok =
      state &&
      Array.isArray(state.names) &&
      Array.isArray(state.mean) &&
      Array.isArray(state.std) &&
      state.mean.length === state.names.length &&
      state.std.length === state.names.length &&
      Array.isArray(state.kept) &&
      Array.isArray(state.dropped);
    if (!ok) throw new SurmiseError('standardize.badState', 'the saved standardizer is malformed (names, mean and std must be arrays of equal length)');
    const s = new Standardizer();
    s.state = {
      names: [...state.names],
      mean: [...state.mean],
      std: [...state.std],
      kept: [...state.kept],
      dropped: state.dropped.map((d) => ({ ...d })),
    };
    s.keptIndex = state.kept.map((name) => {
      const j = state.names.indexOf(name);
      if (j < 0) throw new SurmiseError('standardize.badState', `the saved standardizer keeps '${name}', which is not among its names`);
      return j;
    });
    return s;
  }
}
