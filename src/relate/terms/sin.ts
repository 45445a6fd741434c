import type { FunctionFamily } from './family.ts';

/** Sine; also the half and double angles sin(u/2), sin(2u). */
export const sin = {
  name: 'sin',
  description: 'sine, and the half and double angles',
  value: Math.sin,
  refuses: [],
  scaled: [[0.5, 'u/2'], [2, '2*u']],
  scaledRefuses: ['log', 'exp'],
} satisfies FunctionFamily<'sin'>;
