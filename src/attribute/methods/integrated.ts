import { integratedGradients } from '../integrated.ts';
import { sumOverGroups } from '../groups.ts';
import type { AttributionStrategy } from './strategy.ts';

/**
 * Integrated gradients from the all-zero baseline (the training means in standardized space;
 * Sundararajan, Taly & Yan, ICML 2017), summed over groups, with the completeness gap.
 */
export const integrated = {
  name: 'integrated',
  label: 'integrated gradients',
  description: 'path integral of the gradient from the training means to each row (Sundararajan, Taly & Yan, ICML 2017)',
  compute: ({ model, x, n, groups, settings: s }) => {
    const r = integratedGradients(model, x, n, { steps: s.integratedSteps });
    return { scores: sumOverGroups(r, model.p, groups), completeness: { meanAbsGap: r.meanAbsGap, maxAbsGap: r.maxAbsGap, meanAbsDelta: r.meanAbsDelta } };
  },
} satisfies AttributionStrategy<'integrated'>;
