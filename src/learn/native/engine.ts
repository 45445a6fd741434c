/**
 * The native engine: the network's ONNX graphs (graphs.ts) run by onnxruntime-node on the CPU.
 * Training keeps parameters and Adam moments in two sets of buffers that the runtime reads and
 * writes in place (inputs wrap one set, pre-allocated outputs the other; they swap each step), so
 * nothing is copied between steps. Prediction and input gradients run the trained weights as
 * constants in row chunks.
 */
import { SurmiseError } from '../../errors.ts';
import { checkMatrix } from '../data.ts';
import type { Engine, Trainer } from '../engines.ts';
import { makeLayout } from '../layout.ts';
import { adamRate, type TrainSetup } from '../train.ts';
import { NetworkBase, type NetworkState, type TrainedNetwork } from '../trained.ts';
import type { Task } from '../options.ts';
import { inferenceModel, lossModel, trainStepModel, type NetSpec } from './graphs.ts';
import { Session, f32, loadOrt, type OrtTensor } from './runtime.ts';

export function nativeEngine(): Engine {
  loadOrt();
  return { name: 'native', trainer: nativeTrainer, network: (s) => new NativeNetwork(s) };
}

/** Rows per validation-loss chunk. */
const VAL_CHUNK = 8192;

/** Targets as the graphs take them: [rows, 1] standardized values, or [rows, K] one-hot (unseen class: all zero). */
function targets(t: Float32Array, rows: number, K: number, task: Task, into?: Float32Array): Float32Array {
  if (task === 'regression') return into ? (into.set(t.subarray(0, rows)), into) : t.slice(0, rows);
  const oh = into ?? new Float32Array(rows * K);
  oh.fill(0);
  for (let i = 0; i < rows; i++) if (t[i]! >= 0) oh[i * K + t[i]!] = 1;
  return oh;
}

function nativeTrainer(s: TrainSetup): Trainer {
  const { layout: L, options: o, prep, K, B } = s;
  const spec: NetSpec = { layout: L, activation: o.activation, loss: o.loss, task: prep.task };
  const step = new Session(trainStepModel(spec));
  let evalS: Session | null = null;
  const p = L.sizes[0]!;
  const n = L.total;
  // two sets of (P, M, V): the step reads one and writes the other
  type Bufs = { P: Float32Array; M: Float32Array; V: Float32Array };
  const a: Bufs = { P: s.P, M: new Float32Array(n), V: new Float32Array(n) };
  const b: Bufs = { P: new Float32Array(n), M: new Float32Array(n), V: new Float32Array(n) };
  const wrap = (x: Bufs) => ({ P: f32(x.P, [n]), M: f32(x.M, [n]), V: f32(x.V, [n]) });
  let cur = { arr: a, t: wrap(a) };
  let nxt = { arr: b, t: wrap(b) };
  const lossOut = f32(new Float32Array(1), []);
  const at = new Float32Array(1);
  const atT = f32(at, []);
  // the batch buffers are the loop's own (xb, tb): wrapped once per shape
  const tBuf = new Float32Array(B * K);
  const gsFull = f32(Float32Array.of((o.loss === 'mse' && prep.task === 'regression' ? 2 : 1) / B), []);
  let wrapped: { xb: Float32Array; X: OrtTensor; T: OrtTensor } | null = null;
  return {
    step(xb, tb, rows, t) {
      let X: OrtTensor;
      let T: OrtTensor;
      let gs = gsFull;
      if (rows === B) {
        if (!wrapped || wrapped.xb !== xb) wrapped = { xb, X: f32(xb, [B, p]), T: f32(tBuf, [B, K]) };
        targets(tb, rows, K, prep.task, tBuf);
        X = wrapped.X;
        T = wrapped.T;
      } else {
        X = f32(xb.subarray(0, rows * p), [rows, p]);
        T = f32(targets(tb, rows, K, prep.task), [rows, K]);
        gs = f32(Float32Array.of((o.loss === 'mse' && prep.task === 'regression' ? 2 : 1) / rows), []);
      }
      at[0] = adamRate(o.learningRate, t);
      step.run({ X, T, P: cur.t.P, M: cur.t.M, V: cur.t.V, at: atT, gs }, { P2: nxt.t.P, M2: nxt.t.M, V2: nxt.t.V, loss: lossOut });
      [cur, nxt] = [nxt, cur];
      return (lossOut.data as Float32Array)[0]!;
    },
    validationLoss() {
      evalS ??= new Session(lossModel(spec));
      let total = 0;
      const P = f32(cur.arr.P, [n]);
      for (let r0 = 0; r0 < s.nVal; r0 += VAL_CHUNK) {
        const r1 = Math.min(s.nVal, r0 + VAL_CHUNK);
        const X = f32(s.xv.subarray(r0 * p, r1 * p), [r1 - r0, p]);
        const T = f32(targets(prep.tVal.subarray(r0, r1), r1 - r0, K, prep.task), [r1 - r0, K]);
        total += (evalS.run({ X, T, P }, { loss: null }).loss!.data as Float32Array)[0]!;
      }
      return total;
    },
    parameters: () => cur.arr.P,
    dispose() {
      step.dispose();
      evalS?.dispose();
    },
  };
}

/** Rows per prediction / gradient chunk (see README for the measurement). */
const CHUNK = 4096;

class NativeNetwork extends NetworkBase implements TrainedNetwork {
  readonly engine = 'native' as const;
  private readonly spec: NetSpec;
  private readonly params: Float32Array;
  private predictS: Session | null = null;
  private gradS: Session | null = null;
  private disposed = false;

  constructor(state: NetworkState) {
    super(state);
    this.spec = { layout: makeLayout(state.sizes), activation: state.activation, loss: state.loss, task: state.task };
    this.params = Float32Array.from(state.params);
  }

  private session(grad: boolean): Session {
    if (this.disposed) throw new SurmiseError('learn.disposed', 'this network was disposed; rebuild it with networkFromJSON', undefined, 1);
    if (grad) return (this.gradS ??= new Session(inferenceModel(this.spec, this.params, this.classes, this.state.yScale, true)));
    return (this.predictS ??= new Session(inferenceModel(this.spec, this.params, this.classes, this.state.yScale, false)));
  }

  /** Run `output` of the (gradient) graph over row chunks of x: `width` values per row. */
  private chunks(x: Float64Array | Float32Array, n: number, width: number, output: string, grad: boolean): Float64Array {
    checkMatrix(x, n, this.p, 'network input');
    const s = this.session(grad);
    const out = new Float64Array(n * width);
    for (let r0 = 0; r0 < n; r0 += CHUNK) {
      const r1 = Math.min(n, r0 + CHUNK);
      const sub = x.subarray(r0 * this.p, r1 * this.p);
      const X = f32(sub instanceof Float32Array ? sub : Float32Array.from(sub), [r1 - r0, this.p]);
      out.set(s.run({ X }, { [output]: null })[output]!.data as Float32Array, r0 * width);
    }
    return out;
  }

  predict(x: Float64Array | Float32Array, n: number): Float64Array {
    if (this.task === 'regression') {
      const z = this.chunks(x, n, 1, 'out', false);
      for (let i = 0; i < n; i++) z[i] = z[i]! * this.state.yScale + this.state.yMean;
      return z;
    }
    return this.chunks(x, n, 1, 'expect', false);
  }

  predictProba(x: Float64Array | Float32Array, n: number): Float64Array {
    if (this.task !== 'classification') throw new SurmiseError('learn.notClassification', 'class probabilities exist only for a classification network');
    return this.chunks(x, n, this.classes!.length, 'proba', false);
  }

  predictClass(x: Float64Array | Float32Array, n: number): Float64Array {
    if (this.task === 'regression') return this.predict(x, n);
    const K = this.classes!.length;
    const z = this.chunks(x, n, K, 'out', false);
    const c = this.classes!;
    const res = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      let best = 0; // first maximum, as argMax
      for (let k = 1; k < K; k++) if (z[i * K + k]! > z[i * K + best]!) best = k;
      res[i] = c[best]!;
    }
    return res;
  }

  inputGradients(x: Float64Array | Float32Array, n: number): Float64Array {
    return this.chunks(x, n, this.p, 'grad', true);
  }

  dispose(): void {
    this.predictS?.dispose();
    this.gradS?.dispose();
    this.predictS = this.gradS = null;
    this.disposed = true;
  }
}
