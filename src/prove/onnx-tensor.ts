import onnxProto from 'onnx-proto';

const { onnx } = onnxProto;
const DataType = onnx.TensorProto.DataType;

/** A constant tensor of a graph, its values widened to float64 (float32 values exactly). */
export interface ConstTensor {
  readonly dims: readonly number[];
  readonly values: Float64Array;
  /** ONNX data type code (1 float, 6 int32, 7 int64, 11 double). */
  readonly dataType: number;
}

/** Why a tensor could not be read: becomes the reason of an unsupported-graph result. */
export class TensorReadError extends Error {}

function elementCount(dims: readonly number[]): number {
  let n = 1;
  for (const d of dims) n *= d;
  return n;
}

/**
 * Reads an ONNX TensorProto's values into a Float64Array. Handles the typed fields
 * (float_data, int32_data, int64_data, double_data) and raw_data, which is little-endian and
 * may sit at any byte offset of the file buffer, so it is read through a DataView.
 *
 * @throws TensorReadError for external data, unsupported types or a size that does not match dims
 */
export function onnxTensor(t: onnxProto.onnx.ITensorProto): ConstTensor {
  const dims = (t.dims ?? []).map((d) => Number(d));
  const n = elementCount(dims);
  const dataType = t.dataType ?? 0;
  if (t.dataLocation === onnx.TensorProto.DataLocation.EXTERNAL) {
    throw new TensorReadError(`tensor ${t.name ?? ''} stores its data in an external file`);
  }
  const values = new Float64Array(n);
  const raw = t.rawData;
  const width =
    dataType === DataType.FLOAT || dataType === DataType.INT32 ? 4 : dataType === DataType.INT64 || dataType === DataType.DOUBLE ? 8 : 0;
  if (width === 0) throw new TensorReadError(`tensor ${t.name ?? ''} has data type ${dataType}, expected float, double, int32 or int64`);
  if (raw && raw.length > 0) {
    if (raw.length !== n * width) {
      throw new TensorReadError(`tensor ${t.name ?? ''} has ${raw.length} raw bytes, expected ${n * width} for dims [${dims.join(', ')}]`);
    }
    const view = new DataView(raw.buffer, raw.byteOffset, raw.byteLength);
    for (let i = 0; i < n; i++) {
      if (dataType === DataType.FLOAT) values[i] = view.getFloat32(4 * i, true);
      else if (dataType === DataType.INT32) values[i] = view.getInt32(4 * i, true);
      else if (dataType === DataType.INT64) values[i] = Number(view.getBigInt64(8 * i, true));
      else values[i] = view.getFloat64(8 * i, true);
    }
    return { dims, values, dataType };
  }
  const field: ArrayLike<unknown> | null | undefined =
    dataType === DataType.FLOAT ? t.floatData : dataType === DataType.INT32 ? t.int32Data : dataType === DataType.INT64 ? t.int64Data : t.doubleData;
  const list = field ?? [];
  if (list.length !== n) {
    throw new TensorReadError(`tensor ${t.name ?? ''} has ${list.length} values, expected ${n} for dims [${dims.join(', ')}]`);
  }
  for (let i = 0; i < n; i++) {
    const v = Number(list[i]);
    // float_data holds float32 values; protobufjs may decode them to float64 already, fround is exact then
    values[i] = dataType === DataType.FLOAT ? Math.fround(v) : v;
  }
  return { dims, values, dataType };
}
