import type { DenseLayer } from '../model/onnx-write.js';

/**
 * A dense layer whose parameters live in Float64Arrays, as the trainer keeps them. It is a
 * DenseLayer, so writeMlpOnnx accepts it directly (weights out × in, row-major).
 */
export interface TrainableLayer extends DenseLayer {
  readonly weights: Float64Array;
  readonly bias: Float64Array;
}

/**
 * Copies layers into fresh Float64Arrays (a deep copy): a caller can change the result
 * without touching the original.
 *
 * @param layers layers in order
 * @returns new layers with copied parameters
 */
export function trainableLayer(layers: readonly DenseLayer[]): TrainableLayer[] {
  return layers.map((l) => ({
    inSize: l.inSize,
    outSize: l.outSize,
    weights: Float64Array.from(l.weights),
    bias: Float64Array.from(l.bias),
    activation: l.activation,
  }));
}
