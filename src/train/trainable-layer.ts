import type { DenseLayer } from '../model/onnx-write.js';

/**
 * A dense layer whose parameters live in Float64Arrays, as the trainer keeps them. It is a
 * DenseLayer, so writeMlpOnnx accepts it directly (weights out × in, row-major).
 */
export interface TrainableLayer extends DenseLayer {
  readonly weights: Float64Array;
  readonly bias: Float64Array;
}

