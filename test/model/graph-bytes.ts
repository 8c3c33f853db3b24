import onnxProto from 'onnx-proto';

const { onnx } = onnxProto;
const FLOAT = onnx.TensorProto.DataType.FLOAT;

type Dim = number | string;

function valueInfo(name: string, dims: readonly Dim[]): onnxProto.onnx.IValueInfoProto {
  return {
    name,
    type: {
      tensorType: {
        elemType: FLOAT,
        shape: { dim: dims.map((d) => (typeof d === 'number' ? { dimValue: d } : { dimParam: d })) },
      },
    },
  };
}

function tensor(name: string, dims: number[], values: number[]): onnxProto.onnx.ITensorProto {
  return { name, dims, dataType: FLOAT, floatData: values };
}

/**
 * A one-node-at-a-time ONNX graph for shapes writeMlpOnnx does not write: `y = x·W + b` by
 * MatMul and Add (the pattern exporters emit for a rank-3 input), with the input and output
 * shapes given explicitly, or two graph inputs added together when `twoInputs` is set.
 * @param w d × k weights, row-major (MatMul's right operand)
 */
export function matMulGraph(options: {
  d: number;
  k: number;
  w: number[];
  b: number[];
  inputShape: readonly Dim[];
  outputShape: readonly Dim[];
  twoInputs?: boolean;
}): Uint8Array {
  const { d, k, w, b } = options;
  const nodes: onnxProto.onnx.INodeProto[] = [
    { opType: 'MatMul', input: ['x', 'W'], output: ['xw'] },
    { opType: 'Add', input: ['xw', 'B'], output: [options.twoInputs ? 'y0' : 'y'] },
  ];
  const inputs = [valueInfo('x', options.inputShape)];
  if (options.twoInputs) {
    nodes.push({ opType: 'Add', input: ['y0', 'extra'], output: ['y'] });
    inputs.push(valueInfo('extra', options.outputShape));
  }
  return onnx.ModelProto.encode(
    onnx.ModelProto.create({
      irVersion: 7,
      opsetImport: [{ domain: '', version: 13 }],
      graph: {
        name: 'matmul',
        node: nodes,
        initializer: [tensor('W', [d, k], w), tensor('B', [k], b)],
        input: inputs,
        output: [valueInfo('y', options.outputShape)],
      },
    }),
  ).finish();
}
