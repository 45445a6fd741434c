/**
 * Building ONNX graphs by name: each `op` call appends a node and returns its output's name, so
 * the network's arithmetic reads like the formulas in layers.ts.
 */
import { FLOAT, INT64, encodeModel, type AttrValue, type NodeSpec, type TensorSpec, type ValueSpec } from './onnx.ts';

export class GraphBuilder {
  private nodes: NodeSpec[] = [];
  private inits: TensorSpec[] = [];
  private inputs: ValueSpec[] = [];
  private outputs: ValueSpec[] = [];
  private k = 0;
  private consts = new Map<string, string>();

  input(name: string, dims: Array<number | string>, type = FLOAT): string {
    this.inputs.push({ name, type, dims });
    return name;
  }

  output(name: string, from: string, dims: Array<number | string>, type = FLOAT): void {
    this.nodes.push({ op: 'Identity', inputs: [from], outputs: [name] });
    this.outputs.push({ name, type, dims });
  }

  /** A named constant tensor (an initializer). */
  tensor(name: string, data: Float32Array | BigInt64Array, dims: number[]): string {
    this.inits.push({ name, dims, data });
    return name;
  }

  /** A float scalar constant (shared by value). */
  scalar(v: number): string {
    const key = `f${Math.fround(v)}`;
    let name = this.consts.get(key);
    if (!name) {
      name = this.tensor(`c${this.consts.size}`, Float32Array.of(v), []);
      this.consts.set(key, name);
    }
    return name;
  }

  /** An int64 vector constant (shapes, axes, slice bounds). */
  ints(v: number[]): string {
    const key = `i${v.join(',')}`;
    let name = this.consts.get(key);
    if (!name) {
      name = this.tensor(`c${this.consts.size}`, BigInt64Array.from(v, (x) => BigInt(x)), [v.length]);
      this.consts.set(key, name);
    }
    return name;
  }

  op(op: string, inputs: string[], attrs?: Record<string, AttrValue>): string {
    const out = `t${this.k++}`;
    this.nodes.push({ op, inputs, outputs: [out], attrs });
    return out;
  }

  encode(name: string): Uint8Array {
    return encodeModel({ name, nodes: this.nodes, initializers: this.inits, inputs: this.inputs, outputs: this.outputs });
  }
}

export { FLOAT, INT64 };
