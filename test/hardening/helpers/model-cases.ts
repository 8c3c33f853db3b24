import onnxProto from 'onnx-proto';
import { createRng } from '../../../src/train/index.js';

const { onnx } = onnxProto;

/** One fuzzed model file. */
export interface ModelCase {
  readonly kind: 'truncated' | 'bit-flipped' | 'random bytes' | 'wrong message';
  readonly label: string;
  readonly bytes: Uint8Array;
}

/**
 * Model files broken the ways files break in real projects, from a valid ONNX model, all from
 * one seed: truncated (an interrupted copy or download) at every `truncateStep`-th byte and at
 * the first and last few bytes; bit-flipped (storage or transfer errors) at 1, 2, 4 or 8 random
 * bits; random bytes of random length; and valid protobuf messages of another type, or a model
 * message with parts missing, which a protobuf reader decodes without complaint.
 */
export function modelCases(base: Uint8Array, options: { seed: number; truncateStep: number; bitFlips: number; random: number }): ModelCase[] {
  const rng = createRng(options.seed);
  const cases: ModelCase[] = [];
  const cuts = new Set<number>([0, 1, 2, 3, base.length - 3, base.length - 2, base.length - 1]);
  for (let at = options.truncateStep; at < base.length; at += options.truncateStep) cuts.add(at);
  for (const at of [...cuts].sort((a, b) => a - b)) cases.push({ kind: 'truncated', label: `first ${at} of ${base.length} bytes`, bytes: base.slice(0, at) });
  for (let i = 0; i < options.bitFlips; i++) {
    const flips = [1, 2, 4, 8][i % 4]!;
    const bytes = base.slice();
    const where: number[] = [];
    for (let f = 0; f < flips; f++) {
      const bit = Math.floor(rng() * bytes.length * 8);
      bytes[bit >> 3] ^= 1 << (bit & 7);
      where.push(bit);
    }
    cases.push({ kind: 'bit-flipped', label: `bits ${where.join(', ')}`, bytes });
  }
  for (let i = 0; i < options.random; i++) {
    const bytes = new Uint8Array(Math.floor(rng() * 8192));
    for (let j = 0; j < bytes.length; j++) bytes[j] = Math.floor(rng() * 256);
    cases.push({ kind: 'random bytes', label: `${bytes.length} random bytes`, bytes });
  }
  for (const [label, bytes] of wrongMessages(base)) cases.push({ kind: 'wrong message', label, bytes });
  return cases;
}

/** Valid protobuf that is not a usable model: other message types, or the model with parts removed. */
function wrongMessages(base: Uint8Array): Array<[string, Uint8Array]> {
  const model = onnx.ModelProto.decode(base);
  const graph = model.graph!;
  const encodeModel = (edit: (m: onnxProto.onnx.IModelProto) => onnxProto.onnx.IModelProto): Uint8Array =>
    onnx.ModelProto.encode(onnx.ModelProto.create(edit(onnx.ModelProto.toObject(model) as onnxProto.onnx.IModelProto))).finish();
  const g = (m: onnxProto.onnx.IModelProto): onnxProto.onnx.IGraphProto => m.graph!;
  return [
    ['a GraphProto alone', onnx.GraphProto.encode(graph).finish()],
    ['a TensorProto (the first initializer)', onnx.TensorProto.encode(graph.initializer![0]!).finish()],
    ['a NodeProto', onnx.NodeProto.encode(graph.node![0]!).finish()],
    ['an empty message', new Uint8Array(0)],
    ['a ModelProto without a graph', encodeModel((m) => ({ ...m, graph: null }))],
    ['a ModelProto whose graph has no nodes', encodeModel((m) => ({ ...m, graph: { ...g(m), node: [] } }))],
    ['a ModelProto whose graph has no initializers', encodeModel((m) => ({ ...m, graph: { ...g(m), initializer: [] } }))],
    ['a ModelProto whose graph has no inputs', encodeModel((m) => ({ ...m, graph: { ...g(m), input: [] } }))],
    ['a ModelProto whose graph has no outputs', encodeModel((m) => ({ ...m, graph: { ...g(m), output: [] } }))],
    ['a ModelProto without an opset', encodeModel((m) => ({ ...m, opsetImport: [] }))],
    ['a ModelProto with opset 999', encodeModel((m) => ({ ...m, opsetImport: [{ domain: '', version: 999 }] }))],
    ['a ModelProto with IR version 99', encodeModel((m) => ({ ...m, irVersion: 99 }))],
    ['a ModelProto with an unknown operator', encodeModel((m) => ({ ...m, graph: { ...g(m), node: g(m).node!.map((n, i) => (i === 0 ? { ...n, opType: 'NoSuchOp' } : n)) } }))],
  ];
}
