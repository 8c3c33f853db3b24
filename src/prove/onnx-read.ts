import onnxProto from 'onnx-proto';
import { ModelError } from '../errors.js';
import type { Network } from './network.js';
import { layerOutSize } from './network.js';
import { ChainBuilder } from './chain-builder.js';
import { type ConstTensor, TensorReadError, onnxTensor } from './onnx-tensor.js';
import { translateNode } from './onnx-ops.js';
import { MAX_LAYER_WIDTH } from './float-error.js';

const { onnx } = onnxProto;

/** The network could not be turned into a layer list; nothing was thrown. */
export interface UnsupportedNetwork {
  readonly supported: false;
  /** ONNX operator type, or `graph` when the problem is the graph's structure. */
  readonly operator: string;
  /** Node name (or `#index` when unnamed), or the value / graph name concerned. */
  readonly node: string;
  readonly reason: string;
}

export type ReadNetworkResult = { readonly supported: true; readonly network: Network } | UnsupportedNetwork;

function unsupported(operator: string, node: string, reason: string): UnsupportedNetwork {
  return { supported: false, operator, node, reason };
}

function constantNode(node: onnxProto.onnx.INodeProto): ConstTensor {
  for (const a of node.attribute ?? []) {
    if (a.name === 'value' && a.t) return onnxTensor(a.t);
    if (a.name === 'value_float' && typeof a.f === 'number') return { dims: [], values: Float64Array.of(Math.fround(a.f)), dataType: 1 };
    if (a.name === 'value_floats' && a.floats) return { dims: [a.floats.length], values: Float64Array.from(a.floats, Math.fround), dataType: 1 };
    if (a.name === 'value_int' && a.i !== null && a.i !== undefined) return { dims: [], values: Float64Array.of(Number(a.i)), dataType: 7 };
    if (a.name === 'value_ints' && a.ints) return { dims: [a.ints.length], values: Float64Array.from(a.ints, Number), dataType: 7 };
  }
  throw new TensorReadError('Constant node without a supported value attribute');
}

/**
 * Reads a feed-forward network from ONNX model bytes into a layer list of affine layers and
 * elementwise activations (see network.ts). The graph must be a single chain from its one
 * data input to its one output through Gemm, MatMul, Add/Sub/Mul/Div by constants, Relu,
 * LeakyRelu, Clip, Sigmoid, Tanh, Identity, Flatten and Reshape; consecutive affine
 * operators are fused. Weights are exact float64 copies of the file's float32 values.
 *
 * @param bytes the ONNX file's contents
 * @param where file name used in error messages
 * @returns the network, or `{ supported: false, operator, node, reason }` for a graph outside
 *   that set (never thrown)
 * @throws ModelError when the bytes are not an ONNX model or the model has no graph
 */
export function readOnnxNetwork(bytes: Uint8Array, where = 'model'): ReadNetworkResult {
  let model: onnxProto.onnx.ModelProto;
  try {
    model = onnx.ModelProto.decode(bytes);
  } catch (e) {
    throw new ModelError('MODEL_INVALID', `${where}: cannot decode as ONNX: ${(e as Error).message}`);
  }
  const graph = model.graph;
  if (!graph) throw new ModelError('MODEL_INVALID', `${where}: the ONNX model has no graph`);
  const graphName = graph.name || 'graph';
  const consts = new Map<string, ConstTensor>();
  try {
    for (const t of graph.initializer ?? []) consts.set(t.name ?? '', onnxTensor(t));
  } catch (e) {
    return unsupported('graph', graphName, (e as Error).message);
  }
  const inputs = (graph.input ?? []).filter((v) => !consts.has(v.name ?? ''));
  if (inputs.length !== 1) return unsupported('graph', graphName, `expected one data input, found ${inputs.length}`);
  if ((graph.output ?? []).length !== 1) return unsupported('graph', graphName, `expected one output, found ${(graph.output ?? []).length}`);
  const input = inputs[0]!;
  const dims = input.type?.tensorType?.shape?.dim ?? undefined;
  const last = dims && dims.length > 0 ? dims[dims.length - 1]! : undefined;
  const declared = last?.dimValue !== undefined && last.dimValue !== null && Number(last.dimValue) > 0 ? Number(last.dimValue) : undefined;
  const builder = new ChainBuilder(declared);
  let current = input.name ?? '';
  const nodes = graph.node ?? [];
  for (let index = 0; index < nodes.length; index++) {
    const node = nodes[index]!;
    const name = node.name || `#${index}`;
    const op = node.opType ?? '';
    if (op === 'Constant') {
      try {
        consts.set(node.output?.[0] ?? '', constantNode(node));
      } catch (e) {
        return unsupported(op, name, (e as Error).message);
      }
      continue;
    }
    const data = (node.input ?? []).filter((v) => v !== '' && !consts.has(v));
    if (data.length !== 1 || data[0] !== current) {
      return unsupported(op, name, `the graph is not a single chain: node reads [${data.join(', ')}] while the chain is at ${current}`);
    }
    const reason = translateNode(node, { builder, consts, data: current, inputRank: dims?.length, name });
    if (reason !== null) return unsupported(op, name, reason);
    if (builder.width !== undefined && builder.width > MAX_LAYER_WIDTH) {
      return unsupported(op, name, `layer width ${builder.width} exceeds ${MAX_LAYER_WIDTH}`);
    }
    current = node.output?.[0] ?? '';
  }
  const outputName = graph.output![0]!.name ?? '';
  if (current !== outputName) return unsupported('graph', graphName, `the chain ends at ${current}, not at the output ${outputName}`);
  const layers = builder.finish();
  const first = layers[0];
  const inputSize = declared ?? (first ? (first.kind === 'affine' ? first.inSize : first.size) : undefined);
  if (inputSize === undefined) return unsupported('graph', graphName, 'the input width is unknown');
  const outputSize = layers.length > 0 ? layerOutSize(layers[layers.length - 1]!) : inputSize;
  return { supported: true, network: { inputSize, outputSize, layers, inputName: input.name ?? '', outputName } };
}

