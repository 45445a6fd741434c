import type { BaseFamily } from './family.ts';

/** re(z), im(z), abs(z) = |z| (Math.hypot, no overflow), arg(z) ∈ (−π, π] of a complex column (complexity 2 each). */
export const complexParts: BaseFamily = {
  name: 'complex parts',
  description: 're, im, abs and arg of a complex column',
  ofColumn: (c) =>
    c.complex
      ? [
          { text: `re(${c.name})`, cost: 2, values: c.re },
          { text: `im(${c.name})`, cost: 2, values: c.im },
          { text: `abs(${c.name})`, cost: 2, values: c.re.map((x, i) => Math.hypot(x, c.im[i]!)) },
          { text: `arg(${c.name})`, cost: 2, values: c.re.map((x, i) => Math.atan2(c.im[i]!, x)) },
        ]
      : [],
};
