import type { FunctionFamily } from './family.ts';

/** Cosine; also the half and double angles cos(u/2), cos(2u). */
export const cos = {
  name: 'cos',
  description: 'cosine, and the half and double angles',
  value: Math.cos,
  refuses: [],
  scaled: [[0.5, 'u/2'], [2, '2*u']],
  scaledRefuses: ['log', 'exp'],
} satisfies FunctionFamily<'cos'>;
