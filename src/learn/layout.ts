/** Parameter layout inside one flat Float32 vector: per layer W (in×out, row-major) then b (out). Shared by every engine and the saved state. */
export interface Layout {
  sizes: number[]; // [p, h1, …, out]
  wOff: number[];
  bOff: number[];
  total: number;
}

export function makeLayout(sizes: number[]): Layout {
  const wOff: number[] = [];
  const bOff: number[] = [];
  let off = 0;
  for (let l = 0; l + 1 < sizes.length; l++) {
    wOff.push(off);
    off += sizes[l]! * sizes[l + 1]!;
    bOff.push(off);
    off += sizes[l + 1]!;
  }
  return { sizes, wOff, bOff, total: off };
}
