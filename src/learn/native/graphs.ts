/**
 * The network as ONNX graphs: the same arithmetic as layers.ts and train.ts (forward pass,
 * explicit backward pass, losses, Adam), so both engines compute the same network.
 * - training step: X, T (or one-hot Y), flat parameters P, Adam moments M, V, step size α_t and
 *   gradient scale → P′, M′, V′ and the summed loss; the update is fused into the step's graph.
 * - loss: X, T, P → summed loss (validation).
 * - predict / gradients: the trained weights as constants (the runtime pre-packs them).
 */
import type { Layout } from '../layers.ts';
import type { Activation, LossName, Task } from '../options.ts';
import { GraphBuilder, FLOAT, INT64 } from './builder.ts';

/** Adam (Kingma & Ba, ICLR 2015, Algorithm 1) and Huber δ: the constants train.ts uses. */
export const BETA1 = 0.9;
export const BETA2 = 0.999;
export const EPS = 1e-7;
const HUBER_DELTA = 1;
const GELU_C = Math.sqrt(2 / Math.PI);

interface Weights {
  W: string[];
  b: string[];
}

/** Per-layer weights sliced out of the flat parameter input (layout of layers.ts: W in×out row-major, then b). */
function weightsFromFlat(g: GraphBuilder, P: string, L: Layout): Weights {
  const W: string[] = [];
  const b: string[] = [];
  for (let l = 0; l + 1 < L.sizes.length; l++) {
    const i = L.sizes[l]!;
    const o = L.sizes[l + 1]!;
    const w = g.op('Slice', [P, g.ints([L.wOff[l]!]), g.ints([L.wOff[l]! + i * o]), g.ints([0])]);
    W.push(g.op('Reshape', [w, g.ints([i, o])]));
    b.push(g.op('Slice', [P, g.ints([L.bOff[l]!]), g.ints([L.bOff[l]! + o]), g.ints([0])]));
  }
  return { W, b };
}

/** Per-layer weights as constants. */
function weightsConst(g: GraphBuilder, P: Float32Array, L: Layout): Weights {
  const W: string[] = [];
  const b: string[] = [];
  for (let l = 0; l + 1 < L.sizes.length; l++) {
    const i = L.sizes[l]!;
    const o = L.sizes[l + 1]!;
    W.push(g.tensor(`W${l}`, P.slice(L.wOff[l]!, L.wOff[l]! + i * o), [i, o]));
    b.push(g.tensor(`b${l}`, P.slice(L.bOff[l]!, L.bOff[l]! + o), [o]));
  }
  return { W, b };
}

/** GELU, tanh form (Hendrycks & Gimpel 2016): ½z(1 + tanh(√(2/π)(z + 0.044715 z³))). */
function gelu(g: GraphBuilder, z: string): string {
  const z3 = g.op('Mul', [g.op('Mul', [z, z]), z]);
  const u = g.op('Mul', [g.op('Add', [z, g.op('Mul', [z3, g.scalar(0.044715)])]), g.scalar(GELU_C)]);
  return g.op('Mul', [g.op('Mul', [z, g.scalar(0.5)]), g.op('Add', [g.op('Tanh', [u]), g.scalar(1)])]);
}

/** d gelu/dz = ½(1 + t) + ½ z (1 − t²) √(2/π)(1 + 3·0.044715 z²). */
function geluGrad(g: GraphBuilder, z: string): string {
  const z2 = g.op('Mul', [z, z]);
  const t = g.op('Tanh', [g.op('Mul', [g.op('Mul', [z, g.op('Add', [g.op('Mul', [z2, g.scalar(0.044715)]), g.scalar(1)])]), g.scalar(GELU_C)])]);
  const a = g.op('Mul', [g.op('Add', [t, g.scalar(1)]), g.scalar(0.5)]);
  const sech2 = g.op('Sub', [g.scalar(1), g.op('Mul', [t, t])]);
  const du = g.op('Mul', [g.op('Add', [g.op('Mul', [z2, g.scalar(3 * 0.044715)]), g.scalar(1)]), g.scalar(0.5 * GELU_C)]);
  return g.op('Add', [a, g.op('Mul', [g.op('Mul', [z, sech2]), du])]);
}

interface Forward {
  out: string;
  /** layer inputs A₀ = X, A₁, … */
  A: string[];
  /** GELU pre-activations */
  Z: string[];
}

function forward(g: GraphBuilder, X: string, w: Weights, act: Activation): Forward {
  const A = [X];
  const Z: string[] = [];
  const nl = w.W.length;
  let a = X;
  for (let l = 0; l + 1 < nl; l++) {
    const z = g.op('Gemm', [a, w.W[l]!, w.b[l]!]);
    if (act === 'relu') a = g.op('Relu', [z]);
    else {
      Z.push(z);
      a = gelu(g, z);
    }
    A.push(a);
  }
  return { out: g.op('Gemm', [a, w.W[nl - 1]!, w.b[nl - 1]!]), A, Z };
}

/**
 * Back-propagate dOut through every layer. Returns ∂/∂W, ∂/∂b per layer (when `params`) and ∂/∂X
 * (when `input`). ∂W = Aᵀ dZ, ∂b = 1ᵀ dZ, dA = dZ Wᵀ; ReLU′ = 1[relu(z) > 0].
 */
function backward(g: GraphBuilder, dOut: string, fw: Forward, w: Weights, act: Activation, params: boolean, input: boolean): { gW: string[]; gb: string[]; dX: string | null } {
  const nl = w.W.length;
  const gW: string[] = new Array(nl);
  const gb: string[] = new Array(nl);
  let dZ = dOut;
  let dX: string | null = null;
  for (let l = nl - 1; l >= 0; l--) {
    if (params) {
      gW[l] = g.op('Gemm', [fw.A[l]!, dZ], { transA: { int: 1 } });
      gb[l] = g.op('ReduceSum', [dZ, g.ints([0])], { keepdims: { int: 0 } });
    }
    if (l === 0 && !input) break;
    const dA = g.op('Gemm', [dZ, w.W[l]!], { transB: { int: 1 } });
    if (l === 0) {
      dX = dA;
      break;
    }
    dZ = act === 'relu'
      ? g.op('Where', [g.op('Greater', [fw.A[l]!, g.scalar(0)]), dA, g.scalar(0)])
      : g.op('Mul', [dA, geluGrad(g, fw.Z[l - 1]!)]);
  }
  return { gW, gb, dX };
}

export interface NetSpec {
  layout: Layout;
  activation: Activation;
  loss: LossName;
  task: Task;
}

/** Summed loss and, when `gs` (the gradient scale, 2/rows for MSE, 1/rows otherwise) is given, ∂loss/∂out. */
function loss(g: GraphBuilder, out: string, T: string, s: NetSpec, gs: string | null): { sum: string; dOut: string | null } {
  if (s.task === 'classification') {
    const logp = g.op('LogSoftmax', [out], { axis: { int: 1 } });
    const sum = g.op('Neg', [g.op('ReduceSum', [g.op('Mul', [T, logp])], { keepdims: { int: 0 } })]);
    return { sum, dOut: gs ? g.op('Mul', [g.op('Sub', [g.op('Exp', [logp]), T]), gs]) : null };
  }
  const r = g.op('Sub', [out, T]);
  if (s.loss === 'mse') {
    return { sum: g.op('ReduceSum', [g.op('Mul', [r, r])], { keepdims: { int: 0 } }), dOut: gs ? g.op('Mul', [r, gs]) : null };
  }
  // Huber (Huber, Ann. Math. Statist. 35, 1964): ½r² for |r| ≤ δ, δ(|r| − ½δ) beyond
  const ar = g.op('Abs', [r]);
  const q = g.op('Min', [ar, g.scalar(HUBER_DELTA)]);
  const terms = g.op('Add', [g.op('Mul', [g.op('Mul', [q, q]), g.scalar(0.5)]), g.op('Mul', [g.op('Sub', [ar, q]), g.scalar(HUBER_DELTA)])]);
  const sum = g.op('ReduceSum', [terms], { keepdims: { int: 0 } });
  return { sum, dOut: gs ? g.op('Mul', [g.op('Clip', [r, g.scalar(-HUBER_DELTA), g.scalar(HUBER_DELTA)]), gs]) : null };
}

const outWidth = (s: NetSpec) => s.layout.sizes[s.layout.sizes.length - 1]!;

/** One training step with the Adam update fused in (bias corrections folded into α_t, fed per step). */
export function trainStepModel(s: NetSpec): Uint8Array {
  const g = new GraphBuilder();
  const L = s.layout;
  const X = g.input('X', ['N', L.sizes[0]!]);
  const T = g.input('T', ['N', outWidth(s)]);
  const P = g.input('P', [L.total]);
  const M = g.input('M', [L.total]);
  const V = g.input('V', [L.total]);
  const at = g.input('at', []);
  const gs = g.input('gs', []);
  const w = weightsFromFlat(g, P, L);
  const fw = forward(g, X, w, s.activation);
  const { sum, dOut } = loss(g, fw.out, T, s, gs);
  const { gW, gb } = backward(g, dOut!, fw, w, s.activation, true, false);
  const parts: string[] = [];
  for (let l = 0; l < gW.length; l++) parts.push(g.op('Reshape', [gW[l]!, g.ints([-1])]), gb[l]!);
  const G = g.op('Concat', parts, { axis: { int: 0 } });
  // m ← β₁m + (1−β₁)g; v ← β₂v + (1−β₂)g²; θ ← θ − α_t m/(√v + ε)
  const m2 = g.op('Add', [g.op('Mul', [M, g.scalar(BETA1)]), g.op('Mul', [G, g.scalar(1 - BETA1)])]);
  const v2 = g.op('Add', [g.op('Mul', [V, g.scalar(BETA2)]), g.op('Mul', [g.op('Mul', [G, G]), g.scalar(1 - BETA2)])]);
  const step = g.op('Div', [g.op('Mul', [m2, at]), g.op('Add', [g.op('Sqrt', [v2]), g.scalar(EPS)])]);
  g.output('P2', g.op('Sub', [P, step]), [L.total]);
  g.output('M2', m2, [L.total]);
  g.output('V2', v2, [L.total]);
  g.output('loss', sum, []);
  return g.encode('train_step');
}

/** Summed loss under parameters P (validation). */
export function lossModel(s: NetSpec): Uint8Array {
  const g = new GraphBuilder();
  const L = s.layout;
  const X = g.input('X', ['N', L.sizes[0]!]);
  const T = g.input('T', ['N', outWidth(s)]);
  const P = g.input('P', [L.total]);
  const fw = forward(g, X, weightsFromFlat(g, P, L), s.activation);
  g.output('loss', loss(g, fw.out, T, s, null).sum, []);
  return g.encode('loss');
}

/**
 * Prediction and input gradients of a trained network (weights constant). Outputs: `out` (the
 * standardized value or logits), and for classification `proba` (softmax) and `expect` (Σ p_k c_k);
 * `grad` = ∂(predict)/∂X in target units (regression: yScale·∂out/∂X; classification: of Σ p_k c_k,
 * ∂E/∂z_k = p_k (c_k − E)).
 */
export function inferenceModel(s: NetSpec, params: Float32Array, classes: number[] | null, yScale: number, withGrad: boolean): Uint8Array {
  const g = new GraphBuilder();
  const L = s.layout;
  const K = outWidth(s);
  const X = g.input('X', ['N', L.sizes[0]!]);
  const w = weightsConst(g, params, L);
  const fw = forward(g, X, w, s.activation);
  g.output('out', fw.out, ['N', K]);
  let dOut: string | null = null;
  if (s.task === 'classification') {
    const pr = g.op('Softmax', [fw.out], { axis: { int: 1 } });
    const e = g.op('MatMul', [pr, g.tensor('cCol', Float32Array.from(classes!), [K, 1])]);
    g.output('proba', pr, ['N', K]);
    g.output('expect', e, ['N', 1]);
    if (withGrad) dOut = g.op('Mul', [pr, g.op('Sub', [g.tensor('cRow', Float32Array.from(classes!), [1, K]), e])]);
  } else if (withGrad) {
    dOut = g.op('Expand', [g.scalar(yScale), g.op('Shape', [fw.out])]);
  }
  if (dOut) g.output('grad', backward(g, dOut, fw, w, s.activation, false, true).dX!, ['N', L.sizes[0]!]);
  return g.encode(withGrad ? 'gradients' : 'predict');
}

export { FLOAT, INT64 };
