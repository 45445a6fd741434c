import { deriveSeed } from '../../util/rng.ts';
import { smoothGrad as smoothGradKernel } from '../smoothgrad.ts';
import { sumOverGroups } from '../groups.ts';
import type { AttributionStrategy } from './strategy.ts';

/** Mean |gradient| averaged over Gaussian-perturbed copies of each row (Smilkov et al. 2017), summed over groups. */
export const smoothgrad = {
  name: 'smoothgrad',
  label: 'SmoothGrad',
  description: 'mean absolute gradient averaged over noisy copies of each row (Smilkov et al., "SmoothGrad", 2017)',
  compute: ({ model, x, n, groups, settings: s }) => {
    const r = smoothGradKernel(model, x, n, { seed: deriveSeed(s.seed, 'smoothgrad'), samples: s.smoothGradSamples, noiseLevel: s.smoothGradNoise });
    return { scores: sumOverGroups(r, model.p, groups) };
  },
} satisfies AttributionStrategy<'smoothgrad'>;
