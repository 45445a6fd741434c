import type { FunctionFamily } from './family.ts';

/** Absolute value; abs(abs u) and abs(exp u) re-spell simpler terms, and so do its even powers. */
export const abs = {
  name: 'abs',
  description: 'absolute value',
  value: Math.abs,
  refuses: ['abs', 'exp'],
  evenPowersRespell: true,
} satisfies FunctionFamily<'abs'>;
