/**
 * Artin's action of the braid group B_n on the free group F_n = ⟨x_1, …, x_n⟩, which is faithful
 * (E. Artin, "Theorie der Zöpfe", Abh. Math. Sem. Hamburg 4, 1925; Birman, "Braids, Links and
 * Mapping Class Groups", 1974, ch. 1): two braid words are the same braid exactly when their
 * automorphisms agree on every x_j. This decides the word problem exactly (no floating point).
 *
 * σ_i acts by x_i ↦ x_i x_{i+1} x_i⁻¹, x_{i+1} ↦ x_i (others fixed); a word a_1 … a_k acts by
 * s_{a_1} ∘ … ∘ s_{a_k}, a homomorphism. The automorphism is stored as the images (w_1, …, w_n),
 * freely reduced words in the letters ±1..±n; composing with one more generator on the right only
 * recombines the images: φ∘s_i sends x_i to w_i w_{i+1} w_i⁻¹ and x_{i+1} to w_i.
 * The images of a pseudo-Anosov braid grow exponentially with its powers, so every computation
 * takes a cap on the total length and gives up (undefined) beyond it.
 */
import type { Braid } from './braid.ts';

export type FreeWord = number[];

/** Freely reduced product u·v. */
function mul(u: FreeWord, v: FreeWord): FreeWord {
  let k = 0;
  while (k < u.length && k < v.length && u[u.length - 1 - k] === -v[k]!) k++;
  const out = u.slice(0, u.length - k);
  for (let j = k; j < v.length; j++) out.push(v[j]!);
  return out;
}

const inv = (u: FreeWord): FreeWord => u.map((x) => -x).reverse();

/**
 * The images of x_1..x_n under the automorphism of the word (repeated `power` times), or
 * undefined when their total length exceeds `cap`.
 */
export function artinImages(strands: number, word: readonly number[], power = 1, cap = 20000): FreeWord[] | undefined {
  let w: FreeWord[] | undefined = Array.from({ length: strands }, (_, j) => [j + 1]);
  for (let r = 0; r < power && w; r++) w = continueImages(w, word, cap);
  return w;
}

/** The images under a given automorphism (images) of the automorphism of `word`, composed on the right. */
function continueImages(w: FreeWord[], word: readonly number[], cap: number): FreeWord[] | undefined {
  let total = w.reduce((s, x) => s + x.length, 0);
  for (const g of word) {
    const i = Math.abs(g) - 1;
    const a = w[i]!;
    const b = w[i + 1]!;
    const before = a.length + b.length;
    if (g > 0) {
      w[i] = mul(mul(a, b), inv(a));
      w[i + 1] = a;
    } else {
      w[i] = b;
      w[i + 1] = mul(mul(inv(b), a), b);
    }
    total += w[i]!.length + w[i + 1]!.length - before;
    if (total > cap) return undefined;
  }
  return w;
}

/** True when the images are x_1..x_n themselves (the identity automorphism, i.e. the trivial braid). */
function isIdentity(w: FreeWord[]): boolean {
  return w.every((x, j) => x.length === 1 && x[0] === j + 1);
}

/**
 * Exact test of β^k = γ in B_n (γ given as a word): the automorphism of β^k γ⁻¹ is the identity.
 * undefined when the cap on the image length was hit (nothing decided).
 */
export function powerEquals(b: Braid, k: number, gamma: readonly number[], cap = 20000): boolean | undefined {
  const first = artinImages(b.strands, b.word, k, cap);
  if (!first) return undefined;
  const gInv = gamma.map((g) => -g).reverse();
  const w = continueImages(first, gInv, cap);
  if (!w) return undefined;
  return isIdentity(w);
}

/** Exact test that two words on the same strands are the same braid (undefined past the cap). */
export function sameBraid(strands: number, u: readonly number[], v: readonly number[], cap = 20000): boolean | undefined {
  return powerEquals({ strands, word: [...u] }, 1, v, cap);
}
