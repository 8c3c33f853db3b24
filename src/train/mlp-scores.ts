import type { DenseLayer } from '../model/onnx-write.js';

/** Rows per forward chunk: keeps the scratch buffers small and in cache. */
const CHUNK_ROWS = 1024;

/**
 * Forward pass of a multilayer perceptron in float64 over n rows: the raw output scores.
 * The same arithmetic as the ONNX graph writeMlpOnnx produces (Gemm then Relu per layer), but
 * in float64, so argmax results can differ from a float32 runtime only at near-ties.
 *
 * @param layers the network (not changed)
 * @param x row-major n × layers[0].inSize inputs, already in the network's own units (not changed)
 * @param n number of rows
 * @returns n × k scores, row-major
 * @cost O(n × number of weights)
 */
export function mlpScores(layers: readonly DenseLayer[], x: Float64Array, n: number): Float64Array {
  const d = layers[0]!.inSize;
  const k = layers[layers.length - 1]!.outSize;
  const out = new Float64Array(n * k);
  const widest = Math.max(d, ...layers.map((l) => l.outSize));
  let a = new Float64Array(CHUNK_ROWS * widest);
  let z = new Float64Array(CHUNK_ROWS * widest);
  for (let start = 0; start < n; start += CHUNK_ROWS) {
    const count = Math.min(CHUNK_ROWS, n - start);
    for (let i = 0; i < count * d; i++) a[i] = x[start * d + i]!;
    for (const { inSize, outSize, weights: w, bias: b, activation } of layers) {
      for (let r = 0; r < count; r++) {
        for (let o = 0; o < outSize; o++) {
          let s = b[o]!;
          for (let i = 0; i < inSize; i++) s += w[o * inSize + i]! * a[r * inSize + i]!;
          z[r * outSize + o] = activation === 'relu' && s < 0 ? 0 : s;
        }
      }
      const t = a;
      a = z;
      z = t;
    }
    for (let i = 0; i < count * k; i++) out[start * k + i] = a[i]!;
  }
  return out;
}
