/**
 * The training repeats of a predictability test (seed × fold) with their row sets, built on the table layer's splits
 * (parseSplitSpec / makeSplits) and standardization (Standardizer, fitted on each repeat's training
 * rows only). Row indices are into the dataset's kept rows.
 */
import type { Table } from '../table/types.ts';
import type { Dataset } from '../table/dataset.ts';
import { makeSplits, parseSplitSpec } from '../table/split.ts';
import { Standardizer, type StandardizerState } from '../table/standardize.ts';
import { SurmiseError } from '../errors.ts';
import { deriveSeed } from '../util/rng.ts';
import type { TrainData } from './data.ts';

export interface RepeatPlan {
  /** Network seed of this repeat (derived from the user's seed). */
  seed: number;
  /** 0-based seed index and fold (fold 0 for a single split). */
  seedIndex: number;
  fold: number;
  /** "seed 2/3" or "seed 1/3, fold 4/5" */
  label: string;
  /** The table layer's description of the split. */
  description: string;
  train: Int32Array;
  validation: Int32Array;
  test: Int32Array;
}

/**
 * The split spec of a ranking: `--split` when given, else `kfold:K` when folds ≥ 2, else `random`
 * (the table layer's 70/15/15). --folds K with a different --split is refused.
 */
export function rankSplitSpec(split: string | undefined, folds: number): string {
  if (split === undefined) return folds >= 2 ? `kfold:${folds}` : 'random';
  if (folds >= 2) {
    const s = parseSplitSpec(split);
    if (s.kind !== 'kfold' || s.k !== folds) {
      throw new SurmiseError('split.conflict', `\`folds\` ${folds} and \`split\` ${split} ask for different splits; give one of them`, { option: 'split', also: ['folds'] });
    }
  }
  return split;
}

/**
 * The repeats: for each of `seeds` seeds, the splits of the spec (one, or one per fold) drawn with
 * the seed deriveSeed(seed, 'rank', 'split', s), and a network seed deriveSeed(seed, 'rank', 'seed', s[, fold]).
 * A where: split is the same rows for every seed (only the validation carve and the network change).
 */
export function planRepeats(table: Table, ds: Dataset, o: { seed: number; seeds: number; folds: number; split?: string }): { plans: RepeatPlan[]; spec: string } {
  const spec = rankSplitSpec(o.split, o.folds);
  const parsed = parseSplitSpec(spec);
  const plans: RepeatPlan[] = [];
  for (let s = 0; s < o.seeds; s++) {
    const splits = makeSplits(ds, table, parsed, deriveSeed(o.seed, 'rank', 'split', s));
    splits.forEach((sp, f) => {
      if (sp.train.length < 2 || sp.validation.length < 1 || sp.test.length < 1) {
        throw new SurmiseError(
          'split.tooFewRows',
          `\`split\` ${spec}: ${sp.description} leaves too few rows (need at least 2 train, 1 validation, 1 test; ${ds.y.length} rows kept after the row policy)`,
          { option: 'split' },
        );
      }
      const label = splits.length > 1 ? `seed ${s + 1}/${o.seeds}, fold ${f + 1}/${splits.length}` : `seed ${s + 1}/${o.seeds}`;
      const seed = splits.length > 1 ? deriveSeed(o.seed, 'rank', 'seed', s, f) : deriveSeed(o.seed, 'rank', 'seed', s);
      plans.push({ seed, seedIndex: s, fold: f, label, description: sp.description, train: sp.train, validation: sp.validation, test: sp.test });
    });
  }
  return { plans, spec };
}

export interface RepeatData {
  train: TrainData;
  validation: TrainData;
  test: TrainData;
  /** Indices (into the dataset's features) of the columns the network sees, in order. */
  kept: number[];
  /** Features left out of this repeat because they are constant on its training rows. */
  constant: string[];
  /** The fitted standardization (training rows' means and SDs), so the run can be replayed and inverted. */
  standardizer: StandardizerState;
}

/**
 * Standardized train / validation / test matrices of one repeat on the feature columns `which`:
 * z-scores with the training rows' mean and sample SD (the table layer's Standardizer); a column
 * constant on the training rows is left out (the network cannot learn from it) and reported.
 */
export function repeatData(ds: Dataset, plan: RepeatPlan, which: readonly number[]): RepeatData {
  const cols = which.map((j) => ds.x[j]!);
  const names = which.map((j) => ds.featureNames[j]!);
  const st = new Standardizer().fit(cols, names, plan.train);
  const keptNames = new Set(st.kept);
  const kept = which.filter((j) => keptNames.has(ds.featureNames[j]!));
  if (kept.length === 0) {
    throw new SurmiseError('rank.noFeatures', `every feature is constant on the training rows of ${plan.label}; nothing can predict the target`);
  }
  const make = (rows: Int32Array): TrainData => ({ x: st.transform(cols, rows), y: Float64Array.from(rows, (r) => ds.y[r]!), n: rows.length, p: kept.length });
  return {
    train: make(plan.train),
    validation: make(plan.validation),
    test: make(plan.test),
    kept,
    constant: st.dropped.map((d) => d.name),
    standardizer: st.toJSON(),
  };
}
