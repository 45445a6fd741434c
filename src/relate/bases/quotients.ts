import type { BaseFamily } from './family.ts';

/** Smith's complex division (R. L. Smith, CACM 5, 1962), real and imaginary parts of a/b. */
function divide(ar: number, ai: number, br: number, bi: number): [number, number] {
  if (Math.abs(br) >= Math.abs(bi)) {
    const r = bi / br;
    const d = br + bi * r;
    return [(ar + ai * r) / d, (ai - ar * r) / d];
  }
  const r = br / bi;
  const d = br * r + bi;
  return [(ar * r + ai) / d, (ai * r - ar) / d];
}

/** re(a/b) and im(a/b) of every ordered pair with a complex member (complexity 4 each). */
export const quotients: BaseFamily = {
  name: 'quotients',
  description: 're and im of the quotient a/b of two columns, one of them complex',
  ofPair: (A, B) => {
    if (!(A.complex || B.complex)) return [];
    const re = new Float64Array(A.re.length);
    const im = new Float64Array(A.re.length);
    for (let i = 0; i < re.length; i++) [re[i], im[i]] = divide(A.re[i]!, A.im[i]!, B.re[i]!, B.im[i]!);
    return [
      { text: `re(${A.name}/${B.name})`, cost: 4, values: re },
      { text: `im(${A.name}/${B.name})`, cost: 4, values: im },
    ];
  },
};
