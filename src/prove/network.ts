/**
 * The network as the prover sees it: a chain of affine layers and elementwise activations,
 * read from the ONNX file by `readOnnxNetwork`. Weights are float64 copies of the file's
 * float32 values; each affine layer carries a bound on how far the runtime's float32
 * evaluation of the ONNX operators it was fused from may stray from the exact affine map.
 */

/**
 * `y = W x + b` in exact arithmetic. The float32 result computed by the runtime satisfies
 * `|ŷ_j − (W x̂ + b)_j| ≤ Σ_k errorWeights[j, k] · |x̂_k| + errorConst[j]` for the computed
 * input x̂ (see float-error.ts for the model and docs/proofs.md for the argument).
 */
export interface AffineLayer {
  readonly kind: 'affine';
  readonly inSize: number;
  readonly outSize: number;
  /** outSize × inSize, row-major. */
  readonly weights: Float64Array;
  readonly bias: Float64Array;
  /** outSize × inSize, non-negative. */
  readonly errorWeights: Float64Array;
  /** Row sums of errorWeights: the bound errorScale[j]·max_k |x̂_k| + errorConst[j] is coarser and cheaper. */
  readonly errorScale: Float64Array;
  readonly errorConst: Float64Array;
  /** Names of the ONNX nodes fused into this layer. */
  readonly nodes: readonly string[];
}

/**
 * An elementwise activation. ReLU is exact in floating point; sigmoid and tanh are computed
 * by the runtime with a small absolute error (ACTIVATION_ABS_ERROR). LeakyRelu and Clip are
 * rewritten exactly into ReLU layers by the reader.
 */
export interface ActivationLayer {
  readonly kind: 'relu' | 'sigmoid' | 'tanh';
  readonly size: number;
  readonly nodes: readonly string[];
}

export type Layer = AffineLayer | ActivationLayer;

export interface Network {
  readonly inputSize: number;
  readonly outputSize: number;
  readonly layers: readonly Layer[];
  readonly inputName: string;
  readonly outputName: string;
}

/** Width of a layer's input. */
export function layerInSize(layer: Layer): number {
  return layer.kind === 'affine' ? layer.inSize : layer.size;
}

/** Width of a layer's output. */
export function layerOutSize(layer: Layer): number {
  return layer.kind === 'affine' ? layer.outSize : layer.size;
}

/** The widest layer input or output: the size of per-box work vectors. */
export function maxWidth(net: Network): number {
  let w = net.inputSize;
  for (const layer of net.layers) w = Math.max(w, layerInSize(layer), layerOutSize(layer));
  return w;
}
