import onnxProto from 'onnx-proto';

const { onnx } = onnxProto;

/**
 * A fully connected layer `y = act(W x + b)` with W stored out × in, row-major (the layout of
 * ONNX Gemm with transB = 1 and of PyTorch's `nn.Linear.weight`).
 */
export interface DenseLayer {
  readonly inSize: number;
  readonly outSize: number;
  /** outSize × inSize, row-major. */
  readonly weights: ArrayLike<number>;
  readonly bias: ArrayLike<number>;
  readonly activation: 'relu' | 'none';
}

export interface OnnxWriteOptions {
  /** Graph input name; default `input`. */
  readonly inputName?: string;
  /** Graph output name; default `scores`. */
  readonly outputName?: string;
  readonly graphName?: string;
  /** Free text stored in the model's doc_string (e.g. how it was trained). */
  readonly docString?: string;
}

/** Opset 13 has every operator written here and is read by all current runtimes. */
const OPSET = 13;
/** IR version 7 goes with opset 13 (ONNX versioning table). */
const IR_VERSION = 7;

function floatTensor(name: string, dims: number[], values: ArrayLike<number>): onnxProto.onnx.ITensorProto {
  const data = new Float32Array(values.length);
  for (let i = 0; i < values.length; i++) data[i] = values[i]!;
  return {
    name,
    dims,
    dataType: onnx.TensorProto.DataType.FLOAT,
    // raw_data is little-endian by the ONNX spec; Float32Array is little-endian on every
    // platform Node supports (x64, arm64), checked below rather than assumed.
    rawData: new Uint8Array(data.buffer),
  };
}

function valueInfo(name: string, width: number): onnxProto.onnx.IValueInfoProto {
  return {
    name,
    type: {
      tensorType: {
        elemType: onnx.TensorProto.DataType.FLOAT,
        shape: { dim: [{ dimParam: 'batch' }, { dimValue: width }] },
      },
    },
  };
}

/**
 * Writes a multilayer perceptron as an ONNX model: one `Gemm` (transB = 1) per layer, followed
 * by `Relu` where the layer has one. The ONNX file is encoded from the onnx-proto schema, so any
 * ONNX reader (onnxruntime included) can load it.
 *
 * @param layers layers in order; each layer's inSize must equal the previous outSize
 * @returns the serialised ModelProto bytes
 * @throws Error when consecutive layer widths do not match or array lengths are wrong
 */
export function writeMlpOnnx(layers: readonly DenseLayer[], options: OnnxWriteOptions = {}): Uint8Array {
  if (new Uint8Array(new Float32Array([1]).buffer)[3] !== 0x3f) {
    throw new Error('writeMlpOnnx requires a little-endian platform');
  }
  if (layers.length === 0) throw new Error('writeMlpOnnx requires at least one layer');
  const inputName = options.inputName ?? 'input';
  const outputName = options.outputName ?? 'scores';
  const nodes: onnxProto.onnx.INodeProto[] = [];
  const initializer: onnxProto.onnx.ITensorProto[] = [];
  let current = inputName;
  layers.forEach((layer, i) => {
    if (i > 0 && layer.inSize !== layers[i - 1]!.outSize) {
      throw new Error(`layer ${i}: inSize ${layer.inSize} != previous outSize ${layers[i - 1]!.outSize}`);
    }
    if (layer.weights.length !== layer.inSize * layer.outSize || layer.bias.length !== layer.outSize) {
      throw new Error(`layer ${i}: weights must be ${layer.outSize}x${layer.inSize} and bias ${layer.outSize}`);
    }
    const w = `layer${i}.weight`;
    const b = `layer${i}.bias`;
    initializer.push(floatTensor(w, [layer.outSize, layer.inSize], layer.weights));
    initializer.push(floatTensor(b, [layer.outSize], layer.bias));
    const last = i === layers.length - 1;
    const gemmOut = last && layer.activation === 'none' ? outputName : `layer${i}.linear`;
    nodes.push({
      name: `gemm${i}`,
      opType: 'Gemm',
      input: [current, w, b],
      output: [gemmOut],
      attribute: [{ name: 'transB', type: onnx.AttributeProto.AttributeType.INT, i: 1 }],
    });
    current = gemmOut;
    if (layer.activation === 'relu') {
      const reluOut = last ? outputName : `layer${i}.relu`;
      nodes.push({ name: `relu${i}`, opType: 'Relu', input: [current], output: [reluOut] });
      current = reluOut;
    }
  });
  const model: onnxProto.onnx.IModelProto = {
    irVersion: IR_VERSION,
    producerName: 'specula',
    docString: options.docString ?? '',
    opsetImport: [{ domain: '', version: OPSET }],
    graph: {
      name: options.graphName ?? 'controller',
      node: nodes,
      initializer,
      input: [valueInfo(inputName, layers[0]!.inSize)],
      output: [valueInfo(outputName, layers[layers.length - 1]!.outSize)],
    },
  };
  return onnx.ModelProto.encode(onnx.ModelProto.create(model)).finish();
}
