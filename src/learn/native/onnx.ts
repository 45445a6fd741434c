/**
 * A small encoder of ONNX models in the protobuf wire format (field numbers from onnx.proto,
 * IR version 8, operator set 17): just the messages surmise writes — model, graph, node,
 * attribute, tensor, value info. Measured against building the same graph with the `onnx-proto`
 * message types (protobufjs): no dependency, and nothing to load at start (see README).
 */

/** ONNX element types (TensorProto.DataType). */
export const FLOAT = 1;
export const INT64 = 7;

const enc = new TextEncoder();

/** Bytes being assembled: a list of chunks, concatenated once. */
class Bytes {
  parts: Uint8Array[] = [];
  size = 0;
  push(b: Uint8Array): void {
    this.parts.push(b);
    this.size += b.length;
  }
  done(): Uint8Array {
    const out = new Uint8Array(this.size);
    let o = 0;
    for (const p of this.parts) {
      out.set(p, o);
      o += p.length;
    }
    return out;
  }
}

/** Base-128 varint of a non-negative integer or a negative int64 (two's complement, 10 bytes). */
function varint(v: number | bigint): Uint8Array {
  let x = BigInt.asUintN(64, BigInt(v));
  const out: number[] = [];
  while (x >= 0x80n) {
    out.push(Number(x & 0x7fn) | 0x80);
    x >>= 7n;
  }
  out.push(Number(x));
  return Uint8Array.from(out);
}

type Wire = 0 | 2 | 5;
const tag = (field: number, wire: Wire) => varint((field << 3) | wire);

/** A message under construction: append fields, then `bytes()`. */
export class Msg {
  private b = new Bytes();
  int(field: number, v: number | bigint): this {
    this.b.push(tag(field, 0));
    this.b.push(varint(v));
    return this;
  }
  float(field: number, v: number): this {
    this.b.push(tag(field, 5));
    const f = new Uint8Array(4);
    new DataView(f.buffer).setFloat32(0, v, true);
    this.b.push(f);
    return this;
  }
  bytes(field: number, v: Uint8Array): this {
    this.b.push(tag(field, 2));
    this.b.push(varint(v.length));
    this.b.push(v);
    return this;
  }
  str(field: number, s: string): this {
    return this.bytes(field, enc.encode(s));
  }
  msg(field: number, m: Msg): this {
    return this.bytes(field, m.done());
  }
  done(): Uint8Array {
    return this.b.done();
  }
}

export type AttrValue = { int: number } | { float: number } | { ints: number[] };

/** AttributeProto: name 1, f 2, i 3, ints 8, type 20 (FLOAT 1, INT 2, INTS 7). */
function attribute(name: string, a: AttrValue): Msg {
  const m = new Msg().str(1, name);
  if ('int' in a) return m.int(3, a.int).int(20, 2);
  if ('float' in a) return m.float(2, a.float).int(20, 1);
  for (const v of a.ints) m.int(8, v);
  return m.int(20, 7);
}

export interface NodeSpec {
  op: string;
  inputs: string[];
  outputs: string[];
  attrs?: Record<string, AttrValue>;
}

/** NodeProto: input 1, output 2, name 3, op_type 4, attribute 5. */
function node(n: NodeSpec, k: number): Msg {
  const m = new Msg();
  for (const i of n.inputs) m.str(1, i);
  for (const o of n.outputs) m.str(2, o);
  m.str(3, `n${k}`).str(4, n.op);
  for (const [name, a] of Object.entries(n.attrs ?? {})) m.msg(5, attribute(name, a));
  return m;
}

export interface TensorSpec {
  name: string;
  dims: number[];
  /** float32 or int64 values, little-endian raw data */
  data: Float32Array | BigInt64Array;
}

/** TensorProto: dims 1, data_type 2, name 8, raw_data 9. */
function tensor(t: TensorSpec): Msg {
  const m = new Msg();
  for (const d of t.dims) m.int(1, d);
  m.int(2, t.data instanceof Float32Array ? FLOAT : INT64).str(8, t.name);
  return m.bytes(9, new Uint8Array(t.data.buffer, t.data.byteOffset, t.data.byteLength));
}

export interface ValueSpec {
  name: string;
  type: number;
  /** a number is a fixed size, a string a symbolic one */
  dims: Array<number | string>;
}

/** ValueInfoProto: name 1, type 2 → TypeProto.tensor_type 1 → elem_type 1, shape 2 → dim 1 → dim_value 1 | dim_param 2. */
function valueInfo(v: ValueSpec): Msg {
  const shape = new Msg();
  for (const d of v.dims) shape.msg(1, typeof d === 'number' ? new Msg().int(1, d) : new Msg().str(2, d));
  return new Msg().str(1, v.name).msg(2, new Msg().msg(1, new Msg().int(1, v.type).msg(2, shape)));
}

export interface GraphSpec {
  name: string;
  nodes: NodeSpec[];
  initializers: TensorSpec[];
  inputs: ValueSpec[];
  outputs: ValueSpec[];
}

/** ModelProto (ir_version 1, producer_name 2, graph 7, opset_import 8 → domain 1, version 2) around GraphProto (node 1, name 2, initializer 5, input 11, output 12). */
export function encodeModel(g: GraphSpec, opset = 17): Uint8Array {
  const graph = new Msg();
  g.nodes.forEach((n, k) => graph.msg(1, node(n, k)));
  graph.str(2, g.name);
  for (const t of g.initializers) graph.msg(5, tensor(t));
  for (const v of g.inputs) graph.msg(11, valueInfo(v));
  for (const v of g.outputs) graph.msg(12, valueInfo(v));
  return new Msg().int(1, 8).str(2, 'surmise').msg(7, graph).msg(8, new Msg().str(1, '').int(2, opset)).done();
}
