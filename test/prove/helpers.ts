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

/**
 * A float32 evaluation of a dense ReLU MLP that rounds after every operation, summing in the
 * given order: one of the evaluations a float32 runtime may perform.
 */
export function forwardFloat32(layers: readonly DenseLayer[], x: ArrayLike<number>, order: 'forward' | 'reverse'): Float64Array {
  let cur = Array.from(x, Math.fround);
  for (const layer of layers) {
    const next: number[] = [];
    for (let j = 0; j < layer.outSize; j++) {
      let s = 0;
      for (let t = 0; t < layer.inSize; t++) {
        const i = order === 'forward' ? t : layer.inSize - 1 - t;
        s = Math.fround(s + Math.fround(layer.weights[j * layer.inSize + i]! * cur[i]!));
      }
      s = Math.fround(s + layer.bias[j]!);
      next.push(layer.activation === 'relu' ? Math.max(0, s) : s);
    }
    cur = next;
  }
  return Float64Array.from(cur);
}

/**
 * The runtime's advisory for points in scenario units, as the model stage computes it:
 * fl32((x − offset) / scale), run by onnxruntime, then argmax/argmin (first index on ties).
 * Call `release` when done.
 */
export async function ortAdvisor(
  bytes: Uint8Array,
  d: number,
  decision: 'argmax' | 'argmin',
  normalize?: { offset: readonly number[]; scale: readonly number[] },
): Promise<{ confirm: (x: Float64Array, n: number) => Promise<Int32Array>; calls: () => number; release: () => Promise<void> }> {
  const session = await ort.InferenceSession.create(bytes);
  let calls = 0;
  const confirm = async (x: Float64Array, n: number): Promise<Int32Array> => {
    calls++;
    const input = new Float32Array(n * d);
    for (let r = 0; r < n; r++) {
      for (let i = 0; i < d; i++) {
        const v = x[r * d + i]!;
        input[r * d + i] = normalize ? (v - normalize.offset[i]!) / normalize.scale[i]! : v;
      }
    }
    const out = await session.run({ [session.inputNames[0]!]: new ort.Tensor('float32', input, [n, d]) });
    const y = out[session.outputNames[0]!]!.data as Float32Array;
    const k = y.length / n;
    const adv = new Int32Array(n);
    const sign = decision === 'argmax' ? 1 : -1;
    for (let r = 0; r < n; r++) {
      let best = 0;
      for (let j = 1; j < k; j++) if (sign * y[r * k + j]! > sign * y[r * k + best]!) best = j;
      adv[r] = best;
    }
    return adv;
  };
  return { confirm, calls: () => calls, release: () => session.release() };
}

/** A clock for proveBox that advances by `step` milliseconds per reading (no wall clock). */
export function steppingClock(step: number): () => number {
  let t = 0;
  return () => (t += step);
}
