/**
 * Noise probes: columns that cannot predict the target by construction, trained and attributed
 * beside the real inputs so that every ranking carries its own noise level. Two kinds:
 * - a **permuted copy** of a real feature (its rows shuffled: the same values and distribution,
 *   no link to the target; the "permutation probe" of shadow-feature methods, Stoppiglia et al.,
 *   JMLR 3, 2003; Kursa & Rudnicki, J. Stat. Softw. 36, 2010), so a skewed or integer column's
 *   spurious share is matched in kind;
 * - a **Gaussian column** N(0, 1) (Stoppiglia et al. 2003: random probe variables).
 * The probes are drawn once (seeded) and kept in every repeat, like a real column that happens to be inert: a chance link to the target in this sample then affects probes and real columns alike.
 * A quantity is above the noise level when its whole interval lies above the probes' upper
 * reference: the largest upper interval end of any probe (our rule, deliberately conservative).
 */
import type { Dataset } from '../table/dataset.ts';
import type { FeatureGroup } from './types.ts';
import { Rng, deriveSeed } from '../util/rng.ts';

export interface ProbeSpec {
  /** Name shown in the JSON (never a feature name: it contains a space). */
  name: string;
  kind: 'permuted' | 'gaussian';
  /** The feature a permuted copy was made from. */
  of?: string;
}

/**
 * Which probes: ⌈count/2⌉ permuted copies of features drawn without replacement (seeded; cycling
 * when there are fewer features) and ⌊count/2⌋ Gaussian columns.
 * @example planProbes(['a', 'b'], 3, 1).map((p) => p.kind) // ['permuted', 'permuted', 'gaussian']
 */
export function planProbes(featureNames: readonly string[], count: number, seed: number): ProbeSpec[] {
  const nPerm = featureNames.length > 0 ? Math.ceil(count / 2) : 0;
  const order = new Rng(deriveSeed(seed, 'probes', 'features')).permutation(featureNames.length);
  const out: ProbeSpec[] = [];
  for (let k = 0; k < nPerm; k++) {
    const of = featureNames[order[k % featureNames.length]!]!;
    out.push({ name: `probe ${k + 1} (permuted ${of})`, kind: 'permuted', of });
  }
  for (let k = nPerm; k < count; k++) out.push({ name: `probe ${k + 1} (Gaussian)`, kind: 'gaussian' });
  return out;
}

/** The probe columns of one repeat over the dataset's kept rows, drawn with `seed`. */
export function probeColumns(ds: Dataset, probes: readonly ProbeSpec[], seed: number): Float64Array[] {
  const n = ds.y.length;
  return probes.map((pr, k) => {
    const rng = new Rng(deriveSeed(seed, 'probe', k));
    if (pr.kind === 'gaussian') return Float64Array.from({ length: n }, () => rng.normal());
    const src = ds.x[ds.featureNames.indexOf(pr.of!)]!;
    const perm = rng.permutation(n);
    return Float64Array.from(perm, (i) => src[i]!);
  });
}

/** The dataset with probe columns appended as features (after the real ones); groups stay the real ones. */
export function withProbes(ds: Dataset, probes: readonly ProbeSpec[], cols: readonly Float64Array[]): Dataset {
  return { ...ds, x: [...ds.x, ...cols], featureNames: [...ds.featureNames, ...probes.map((p) => p.name)] };
}

/**
 * What the probes were, in words.
 * @example describeProbes(planProbes(['a'], 2, 1)) // "1 permuted copy (of a) and 1 Gaussian column"
 */
export function describeProbes(probes: readonly ProbeSpec[]): string {
  const perm = probes.filter((p) => p.kind === 'permuted').map((p) => p.of!);
  const gauss = probes.filter((p) => p.kind === 'gaussian').length;
  const parts: string[] = [];
  if (perm.length) parts.push(`${perm.length} permuted cop${perm.length === 1 ? 'y' : 'ies'} (of ${perm.join(', ')})`);
  if (gauss) parts.push(`${gauss} Gaussian column${gauss === 1 ? '' : 's'}`);
  return parts.join(' and ');
}

/** One single-member group per probe, numbered after the p real features. */
export function probeGroups(probes: readonly ProbeSpec[], p: number): FeatureGroup[] {
  return probes.map((pr, k) => ({ name: pr.name, members: [p + k] }));
}

/**
 * The probes' upper reference: the largest upper interval end over the probes (NaN with none).
 * @example noiseReference([0.01, 0.03, 0.02]) // 0.03
 */
export function noiseReference(probeHighs: readonly number[]): number {
  return probeHighs.length ? Math.max(...probeHighs) : Number.NaN;
}
