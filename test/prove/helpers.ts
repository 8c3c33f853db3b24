/**
 * Test helpers for the proof stage: seeded random networks, hand-built ONNX graphs and
 * onnxruntime runs. Not a test file itself.
 */
import onnxProto from 'onnx-proto';
import * as ort from 'onnxruntime-node';
import type { DenseLayer } from '../../src/model/onnx-write.js';
import type { Network } from '../../src/prove/index.js';

const { onnx } = onnxProto;

/** Mulberry32: a small seeded generator of uniform numbers in [0, 1) (common practice, no source). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A ReLU MLP with uniform weights in ±scale/√fan-in and biases in ±0.1, float32 values. */
export function randomMlp(rng: () => number, sizes: readonly number[], scale = 1): DenseLayer[] {
  const layers: DenseLayer[] = [];
  for (let i = 0; i + 1 < sizes.length; i++) {
    const fanIn = sizes[i]!;
    const weights = Array.from({ length: fanIn * sizes[i + 1]! }, () => Math.fround(((rng() * 2 - 1) * scale) / Math.sqrt(fanIn)));
    const bias = Array.from({ length: sizes[i + 1]! }, () => Math.fround((rng() * 2 - 1) * 0.1));
    layers.push({ inSize: fanIn, outSize: sizes[i + 1]!, weights, bias, activation: i + 2 < sizes.length ? 'relu' : 'none' });
  }
  return layers;
}

export interface TensorSpec {
  readonly name: string;
  readonly dims: readonly number[];
  readonly values: readonly number[];
  /** 'float' (default) or 'int64' */
  readonly type?: 'float' | 'int64';
}

function tensor(t: TensorSpec): onnxProto.onnx.ITensorProto {
  if (t.type === 'int64') return { name: t.name, dims: [...t.dims], dataType: onnx.TensorProto.DataType.INT64, int64Data: [...t.values] };
  return { name: t.name, dims: [...t.dims], dataType: onnx.TensorProto.DataType.FLOAT, floatData: [...t.values] };
}

/** An attribute of a node: float, int, tensor or float list. */
export function attr(name: string, value: number | TensorSpec, kind: 'f' | 'i' = 'f'): onnxProto.onnx.IAttributeProto {
  const T = onnx.AttributeProto.AttributeType;
  if (typeof value !== 'number') return { name, type: T.TENSOR, t: tensor(value) };
  return kind === 'i' ? { name, type: T.INT, i: value } : { name, type: T.FLOAT, f: value };
}

/** A one-input, one-output float graph from nodes and initializers, as ONNX bytes. */
export function graphModel(
  nodes: onnxProto.onnx.INodeProto[],
  initializers: readonly TensorSpec[],
  inWidth: number,
  outWidth: number,
  opset = 13,
  names: { input?: string; output?: string } = {},
): Uint8Array {
  const vi = (name: string, w: number): onnxProto.onnx.IValueInfoProto => ({
    name,
    type: { tensorType: { elemType: onnx.TensorProto.DataType.FLOAT, shape: { dim: [{ dimParam: 'batch' }, { dimValue: w }] } } },
  });
  const model: onnxProto.onnx.IModelProto = {
    irVersion: 7,
    opsetImport: [{ domain: '', version: opset }],
    graph: {
      name: 'test',
      node: nodes,
      initializer: initializers.map(tensor),
      input: [vi(names.input ?? 'x', inWidth)],
      output: [vi(names.output ?? 'y', outWidth)],
    },
  };
  return onnx.ModelProto.encode(onnx.ModelProto.create(model)).finish();
}

/** Runs a one-input model in onnxruntime on n rows (converted to float32). */
export async function runOrt(bytes: Uint8Array, x: ArrayLike<number>, n: number, d: number): Promise<Float32Array> {
  const session = await ort.InferenceSession.create(bytes);
  try {
    const input = session.inputNames[0]!;
    const out = await session.run({ [input]: new ort.Tensor('float32', Float32Array.from(x), [n, d]) });
    return out[session.outputNames[0]!]!.data as Float32Array;
  } finally {
    await session.release();
  }
}

/** The network with every output negated: its lower bounds are minus the upper bounds. */
export function negateOutputs(net: Network): Network {
  const last = net.layers[net.layers.length - 1]!;
  if (last.kind !== 'affine') throw new Error('negateOutputs needs a final affine layer');
  const neg = { ...last, weights: last.weights.map((v) => -v), bias: last.bias.map((v) => -v) };
  return { ...net, layers: [...net.layers.slice(0, -1), neg] };
}

/** Uniform random points in a box (row-major n × d), rounded to float32 as the model sees them. */
export function samplePoints(rng: () => number, lo: ArrayLike<number>, hi: ArrayLike<number>, n: number): Float64Array {
  const d = lo.length;
  const x = new Float64Array(n * d);
  for (let r = 0; r < n; r++) {
    for (let i = 0; i < d; i++) x[r * d + i] = Math.min(hi[i]!, Math.max(lo[i]!, Math.fround(lo[i]! + (hi[i]! - lo[i]!) * rng())));
  }
  return x;
}
