import { deriveSeed } from '../../util/rng.ts';
import { heldOutLoss } from '../held-out-loss.ts';
import { permutationImportance } from '../permutation.ts';
import type { AttributionStrategy } from './strategy.ts';

/** Rise of the held-out loss when a group's columns are shuffled jointly (Breiman, Machine Learning 45, 2001). */
export const permutation = {
  name: 'permutation',
  label: 'permutation importance',
  description: 'rise of the held-out loss when a group\'s columns are shuffled together (Breiman, Machine Learning 45, 2001)',
  compute: ({ model, x, y, n, groups, settings: s }) => {
    const r = permutationImportance(heldOutLoss(model, y, s.classificationLoss), x, n, model.p, groups, { seed: deriveSeed(s.seed, 'permutation'), repeats: s.permutationRepeats });
    return { scores: r, baseLoss: r.baseLoss };
  },
} satisfies AttributionStrategy<'permutation'>;
