import type { FunctionFamily } from './family.ts';

/** Natural logarithm, defined for u > 0; log(exp u) = u is refused. */
export const log = {
  name: 'log',
  description: 'natural logarithm (positive arguments only)',
  value: Math.log,
  undefinedAt: (x) => (!(x > 0) ? 'is not positive' : null),
  refuses: ['exp'],
} satisfies FunctionFamily<'log'>;
