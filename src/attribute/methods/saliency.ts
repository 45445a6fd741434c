import { gradientSaliency } from '../saliency.ts';
import { sumOverGroups } from '../groups.ts';
import type { AttributionStrategy } from './strategy.ts';

/** S_j = mean_i |∂f/∂x_j(x_i)|, summed over each group's members (Simonyan, Vedaldi & Zisserman 2014). */
export const saliency = {
  name: 'saliency',
  label: 'saliency',
  description: 'mean absolute input gradient over the held-out rows (Simonyan, Vedaldi & Zisserman 2014)',
  compute: ({ model, x, n, groups }) => ({ scores: sumOverGroups(gradientSaliency(model, x, n), model.p, groups) }),
} satisfies AttributionStrategy<'saliency'>;
