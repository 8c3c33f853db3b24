import type { DenseLayer } from '../model/onnx-write.js';
import { mlpScores } from './mlp-scores.js';

/**
 * The class a multilayer perceptron picks for each row: argmax of its scores (the first
 * maximum on exact ties).
 *
 * @param layers the network (not changed)
 * @param x row-major n × layers[0].inSize inputs in the network's own units (not changed)
 * @param n number of rows
 * @returns the winning class index per row
 */
export function mlpPredict(layers: readonly DenseLayer[], x: Float64Array, n: number): Int32Array {
  const k = layers[layers.length - 1]!.outSize;
  const scores = mlpScores(layers, x, n);
  const out = new Int32Array(n);
  for (let r = 0; r < n; r++) {
    let best = 0;
    for (let c = 1; c < k; c++) if (scores[r * k + c]! > scores[r * k + best]!) best = c;
    out[r] = best;
  }
  return out;
}
