import type { FunctionFamily } from './family.ts';

/** Exponential; also exp(−u), exp(±u/2), exp(2u) (a Gaussian exp(−u²/2) is exp(−u/2) of u²). */
export const exp = {
  name: 'exp',
  description: 'exponential, and exp(−u), exp(±u/2), exp(2u)',
  value: Math.exp,
  refuses: ['log', 'exp'],
  absorbsPowers: true,
  scaled: [[-1, '-u'], [-0.5, '-u/2'], [0.5, 'u/2'], [2, '2*u']],
  scaledRefuses: ['log', 'exp'],
} satisfies FunctionFamily<'exp'>;
