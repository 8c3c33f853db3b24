import type { Decision } from '../types.js';
import type { Network } from './network.js';
import { maxWidth } from './network.js';

/**
 * Evaluates the layer list on a batch of network inputs in float64. It is the reference the
 * prover uses to screen candidate counterexamples before the runtime confirms them; it
 * differs from onnxruntime's float32 result only by rounding (see docs/proofs.md).
 *
 * @param net the network from readOnnxNetwork
 * @param x n × inputSize network inputs, row-major (not changed)
 * @param n number of rows
 * @returns n × outputSize scores, row-major
 */
export function forward(net: Network, x: Float64Array, n: number): Float64Array {
  const d = net.inputSize;
  if (x.length < n * d) throw new RangeError(`forward expects ${n * d} input values, found ${x.length}`);
  const width = maxWidth(net);
  let cur = new Float64Array(width);
  let next = new Float64Array(width);
  const out = new Float64Array(n * net.outputSize);
  for (let r = 0; r < n; r++) {
    for (let i = 0; i < d; i++) cur[i] = x[r * d + i]!;
    for (const layer of net.layers) {
      if (layer.kind === 'affine') {
        const { inSize, outSize, weights, bias } = layer;
        for (let j = 0; j < outSize; j++) {
          let s = bias[j]!;
          const row = j * inSize;
          for (let i = 0; i < inSize; i++) s += weights[row + i]! * cur[i]!;
          next[j] = s;
        }
        const t = cur;
        cur = next;
        next = t;
      } else if (layer.kind === 'relu') {
        for (let j = 0; j < layer.size; j++) if (cur[j]! < 0) cur[j] = 0;
      } else if (layer.kind === 'sigmoid') {
        for (let j = 0; j < layer.size; j++) cur[j] = 1 / (1 + Math.exp(-cur[j]!));
      } else {
        for (let j = 0; j < layer.size; j++) cur[j] = Math.tanh(cur[j]!);
      }
    }
    for (let j = 0; j < net.outputSize; j++) out[r * net.outputSize + j] = cur[j]!;
  }
  return out;
}

/**
 * The advisory per row: index of the largest (argmax) or smallest (argmin) score, the first
 * one on ties.
 * @param scores n × k row-major
 */
export function decide(scores: ArrayLike<number>, n: number, k: number, decision: Decision): Int32Array {
  const adv = new Int32Array(n);
  const sign = decision === 'argmax' ? 1 : -1;
  for (let r = 0; r < n; r++) {
    let best = 0;
    for (let j = 1; j < k; j++) if (sign * scores[r * k + j]! > sign * scores[r * k + best]!) best = j;
    adv[r] = best;
  }
  return adv;
}
