import type { BaseFamily } from './family.ts';

/** A real, integer or derived column x itself (complexity 1). */
export const column: BaseFamily = {
  name: 'column',
  description: 'a real, integer or derived column itself',
  ofColumn: (c) => (c.complex ? [] : [{ text: c.name, cost: 1, values: c.re }]),
};
