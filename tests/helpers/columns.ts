import type { Column } from '../../src/table/types.ts';

/** A label column with no missing cells. */
export const label = (name: string, values: string[]): Column => ({ name, kind: 'label', values, missing: new Uint8Array(values.length) });

/** A complex column from its parts, with no missing cells. */
export const cplx = (name: string, re: number[], im: number[]): Column => ({
  name,
  kind: 'complex',
  re: Float64Array.from(re),
  im: Float64Array.from(im),
  missing: new Uint8Array(re.length),
});
