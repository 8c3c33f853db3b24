import type { DenseLayer } from '../model/onnx-write.js';

/** Gradient buffers, one pair per layer, same shapes as the layer's weights and bias. */
export interface LayerGradient {
  readonly weights: Float64Array;
  readonly bias: Float64Array;
}

/** Scratch memory for one mini-batch, reused across calls (no allocation per batch). */
export interface MlpWorkspace {
  readonly batchSize: number;
  /** acts[0]: the batch's inputs; acts[l + 1]: output of layer l; each batchSize × width. */
  readonly acts: Float64Array[];
  /** deltas[l]: dLoss/d(pre-activation of layer l), batchSize × outSize. */
  readonly deltas: Float64Array[];
}

/** Allocates a workspace for batches of up to `batchSize` rows. */
export function mlpWorkspace(layers: readonly DenseLayer[], batchSize: number): MlpWorkspace {
  const acts = [new Float64Array(batchSize * layers[0]!.inSize)];
  const deltas: Float64Array[] = [];
  for (const l of layers) {
    acts.push(new Float64Array(batchSize * l.outSize));
    deltas.push(new Float64Array(batchSize * l.outSize));
  }
  return { batchSize, acts, deltas };
}

/** Allocates zeroed gradient buffers shaped like the layers. */
export function layerGradients(layers: readonly DenseLayer[]): LayerGradient[] {
  return layers.map((l) => ({ weights: new Float64Array(l.weights.length), bias: new Float64Array(l.outSize) }));
}

/**
 * Mean softmax cross-entropy of a multilayer perceptron on a mini-batch, and its gradient with
 * respect to every weight and bias by back-propagation.
 *
 * Loss per row: −log softmax(z)_y = logsumexp(z) − z_y, computed with the maximum subtracted so
 * exp cannot overflow. Its gradient with respect to the scores is softmax(z) − onehot(y); the
 * chain rule then runs backwards through the layers (D. E. Rumelhart, G. E. Hinton &
 * R. J. Williams, "Learning representations by back-propagating errors", Nature 323:533–536,
 * 1986). The ReLU's derivative is taken as 0 at exactly 0 (a valid subgradient).
 *
 * @param layers the network (not changed); ReLU or identity activations, output layer last
 * @param x row-major samples, `d = layers[0].inSize` columns (not changed)
 * @param labels class index per sample, in [0, layers[last].outSize)
 * @param rows indices of the samples forming the batch: rows[start .. start + count)
 * @param grads buffers overwritten with the gradient of the batch's mean loss
 * @param ws workspace with batchSize >= count
 * @returns the batch's summed loss and its number of correctly classified rows (argmax)
 */
export function mlpLossGradient(
  layers: readonly DenseLayer[],
  x: Float64Array,
  labels: Int32Array,
  rows: Int32Array,
  start: number,
  count: number,
  grads: readonly LayerGradient[],
  ws: MlpWorkspace,
): { lossSum: number; correct: number } {
  const d = layers[0]!.inSize;
  const input = ws.acts[0]!;
  for (let r = 0; r < count; r++) {
    const src = rows[start + r]! * d;
    for (let j = 0; j < d; j++) input[r * d + j] = x[src + j]!;
  }
  // Forward pass.
  for (let l = 0; l < layers.length; l++) {
    const { inSize, outSize, weights: w, bias: b, activation } = layers[l]!;
    const a = ws.acts[l]!;
    const z = ws.acts[l + 1]!;
    for (let r = 0; r < count; r++) {
      for (let o = 0; o < outSize; o++) {
        let s = b[o]!;
        for (let i = 0; i < inSize; i++) s += w[o * inSize + i]! * a[r * inSize + i]!;
        z[r * outSize + o] = activation === 'relu' && s < 0 ? 0 : s;
      }
    }
  }
  // Loss and output delta: (softmax − onehot) / count.
  const last = layers.length - 1;
  const k = layers[last]!.outSize;
  const scores = ws.acts[last + 1]!;
  const delta = ws.deltas[last]!;
  let lossSum = 0;
  let correct = 0;
  for (let r = 0; r < count; r++) {
    const y = labels[rows[start + r]!]!;
    let max = -Infinity;
    let arg = 0;
    for (let c = 0; c < k; c++) {
      const s = scores[r * k + c]!;
      if (s > max) {
        max = s;
        arg = c;
      }
    }
    if (arg === y) correct++;
    let sum = 0;
    for (let c = 0; c < k; c++) sum += Math.exp(scores[r * k + c]! - max);
    lossSum += Math.log(sum) + max - scores[r * k + y]!;
    for (let c = 0; c < k; c++) {
      const p = Math.exp(scores[r * k + c]! - max) / sum;
      delta[r * k + c] = (p - (c === y ? 1 : 0)) / count;
    }
  }
  // Backward pass.
  for (let l = last; l >= 0; l--) {
    const { inSize, outSize, weights: w } = layers[l]!;
    const a = ws.acts[l]!;
    const dz = ws.deltas[l]!;
    const gw = grads[l]!.weights;
    const gb = grads[l]!.bias;
    gw.fill(0);
    gb.fill(0);
    for (let r = 0; r < count; r++) {
      for (let o = 0; o < outSize; o++) {
        const g = dz[r * outSize + o]!;
        if (g === 0) continue;
        gb[o] = gb[o]! + g;
        for (let i = 0; i < inSize; i++) gw[o * inSize + i] = gw[o * inSize + i]! + g * a[r * inSize + i]!;
      }
    }
    if (l === 0) break;
    // dLoss/d(pre-activation of layer l − 1): back through W, then the ReLU mask (a > 0 ⇔ z > 0).
    const prev = ws.deltas[l - 1]!;
    const reluBelow = layers[l - 1]!.activation === 'relu';
    for (let r = 0; r < count; r++) {
      for (let i = 0; i < inSize; i++) {
        if (reluBelow && a[r * inSize + i]! <= 0) {
          prev[r * inSize + i] = 0;
          continue;
        }
        let s = 0;
        for (let o = 0; o < outSize; o++) s += dz[r * outSize + o]! * w[o * inSize + i]!;
        prev[r * inSize + i] = s;
      }
    }
  }
  return { lossSum, correct };
}
