/**
 * The arithmetic of the fully connected network, written with explicit gradients (no tape):
 * every matrix product is a plain `matMul` (no transposeA/transposeB flags, which run 10–30×
 * slower on the wasm backend), each weight keeps a transposed copy for the backward pass, and
 * bias + ReLU are fused into the forward product.
 */
import * as tf from '@tensorflow/tfjs';
import type { Activation } from './options.ts';

export { makeLayout, type Layout } from './layout.ts';
import type { Layout } from './layout.ts';

/** Per-layer tensors: weights, their transposes (for the backward pass) and biases. */
export interface Views {
  W: tf.Tensor2D[];
  WT: tf.Tensor2D[];
  b: tf.Tensor1D[];
}

/**
 * Per-layer tensors uploaded from a flat Float32Array of parameters (copied: slicing a tensor on
 * wasm measured ~5 ms per 300×300 block, uploading a slice of the array well under 1 ms).
 */
export function viewsFromParams(P: Float32Array, L: Layout): Views {
  const W: tf.Tensor2D[] = [];
  const WT: tf.Tensor2D[] = [];
  const b: tf.Tensor1D[] = [];
  for (let l = 0; l + 1 < L.sizes.length; l++) {
    const i = L.sizes[l]!;
    const o = L.sizes[l + 1]!;
    const off = L.wOff[l]!;
    const w = tf.tensor2d(P.slice(off, off + i * o), [i, o]);
    W.push(w);
    WT.push(tf.transpose(w)); // measured faster than a JavaScript transpose loop
    b.push(tf.tensor1d(P.slice(L.bOff[l]!, L.bOff[l]! + o)));
  }
  return { W, WT, b };
}

export function disposeViews(v: Views | null): void {
  if (!v) return;
  tf.dispose([...v.W, ...v.WT, ...v.b]);
}

const GELU_C = Math.sqrt(2 / Math.PI);

/** GELU, tanh form (Hendrycks & Gimpel, "Gaussian Error Linear Units", 2016): ½z(1 + tanh(√(2/π)(z + 0.044715 z³))). */
export function gelu(z: tf.Tensor): tf.Tensor {
  return tf.tidy(() => {
    const u = tf.mul(tf.add(z, tf.mul(tf.pow(z, 3), 0.044715)), GELU_C);
    return tf.mul(tf.mul(z, 0.5), tf.add(tf.tanh(u), 1));
  });
}

/** d gelu/dz = ½(1 + t) + ½ z (1 − t²) √(2/π)(1 + 3·0.044715 z²), t = tanh(√(2/π)(z + 0.044715 z³)). */
export function geluGrad(z: tf.Tensor): tf.Tensor {
  return tf.tidy(() => {
    const z2 = tf.square(z);
    const t = tf.tanh(tf.mul(tf.mul(z, tf.add(tf.mul(z2, 0.044715), 1)), GELU_C));
    const a = tf.mul(tf.add(t, 1), 0.5);
    const sech2 = tf.sub(1, tf.square(t));
    const du = tf.mul(tf.add(tf.mul(z2, 3 * 0.044715), 1), 0.5 * GELU_C);
    return tf.add(a, tf.mul(tf.mul(z, sech2), du));
  });
}

/**
 * Forward pass. Returns the output (logits or standardized value) and, when `keep` is set, the
 * layer inputs (A₀ = X, A₁, …) and, for GELU, the pre-activations, for the backward pass.
 */
export function forward(X: tf.Tensor2D, v: Views, act: Activation, keep: boolean): { out: tf.Tensor2D; A: tf.Tensor2D[]; Z: tf.Tensor2D[] } {
  const A: tf.Tensor2D[] = [X];
  const Z: tf.Tensor2D[] = [];
  const nl = v.W.length;
  let a = X;
  for (let l = 0; l + 1 < nl; l++) {
    if (act === 'relu') {
      a = tf.fused.matMul({ a, b: v.W[l]!, bias: v.b[l]!, activation: 'relu' }) as tf.Tensor2D;
    } else {
      const z = tf.fused.matMul({ a, b: v.W[l]!, bias: v.b[l]! }) as tf.Tensor2D;
      if (keep) Z.push(z);
      a = gelu(z) as tf.Tensor2D;
    }
    if (keep) A.push(a);
  }
  const out = tf.fused.matMul({ a, b: v.W[nl - 1]!, bias: v.b[nl - 1]! }) as tf.Tensor2D;
  return { out, A, Z };
}

/** Back-propagate dOut = ∂f/∂out through every layer down to the input X: returns ∂f/∂X. */
export function backwardToInput(dOut: tf.Tensor2D, fw: { A: tf.Tensor2D[]; Z: tf.Tensor2D[] }, v: Views, act: Activation): tf.Tensor2D {
  const nl = v.W.length;
  let dZ = dOut;
  for (let l = nl - 1; l >= 0; l--) {
    const dA = tf.matMul(dZ, v.WT[l]!) as tf.Tensor2D;
    if (l === 0) return dA;
    dZ = activationBackward(dA, fw, l, act);
  }
  return dZ;
}

/** dZ of hidden layer l−1 (whose output is A[l]) from dA[l]. */
function activationBackward(dA: tf.Tensor2D, fw: { A: tf.Tensor2D[]; Z: tf.Tensor2D[] }, l: number, act: Activation): tf.Tensor2D {
  return act === 'relu'
    ? (tf.mul(dA, tf.step(fw.A[l]!)) as tf.Tensor2D) // ReLU'(z) = 1[z > 0] = 1[relu(z) > 0]
    : (tf.mul(dA, geluGrad(fw.Z[l - 1]!)) as tf.Tensor2D);
}

const onesCache = new Map<number, Float32Array>();
function ones(rows: number): tf.Tensor2D {
  let a = onesCache.get(rows);
  if (!a) {
    a = new Float32Array(rows).fill(1);
    onesCache.set(rows, a);
  }
  return tf.tensor2d(a, [1, rows]);
}

/** Gradients of all parameters as one flat vector in the layout's order, from dOut = ∂loss/∂out. */
export function backwardParams(dOut: tf.Tensor2D, fw: { A: tf.Tensor2D[]; Z: tf.Tensor2D[] }, v: Views, act: Activation): tf.Tensor1D {
  const nl = v.W.length;
  const parts: tf.Tensor[] = new Array(2 * nl);
  let dZ = dOut;
  for (let l = nl - 1; l >= 0; l--) {
    const gW = tf.matMul(tf.transpose(fw.A[l]!), dZ); // ∂/∂W = Aᵀ dZ (explicit transpose + plain matMul)
    parts[2 * l] = tf.reshape(gW, [-1]);
    parts[2 * l + 1] = tf.reshape(tf.matMul(ones(dZ.shape[0]), dZ), [-1]); // ∂/∂b = 1ᵀ dZ (a plain matMul beats sum on wasm)
    if (l > 0) dZ = activationBackward(tf.matMul(dZ, v.WT[l]!) as tf.Tensor2D, fw, l, act);
  }
  return tf.concat(parts) as tf.Tensor1D;
}
