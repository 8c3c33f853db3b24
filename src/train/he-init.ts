import type { TrainableLayer } from './trainable-layer.js';

/**
 * A standard normal deviate by the Box–Muller transform (one of the pair; the other is
 * dropped, which keeps the generator's stream simple to reason about).
 * G. E. P. Box & M. E. Muller, "A note on the generation of random normal deviates", Annals of
 * Mathematical Statistics 29(2):610–611, 1958.
 */
function standardNormal(rng: () => number): number {
  // 1 - u lies in (0, 1], so the logarithm is finite.
  const u = 1 - rng();
  const v = rng();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

/**
 * Initial weights for a ReLU multilayer perceptron: W ~ N(0, 2 / fan_in), biases 0, which keeps
 * the variance of the activations roughly constant from layer to layer.
 * K. He, X. Zhang, S. Ren & J. Sun, "Delving deep into rectifiers: surpassing human-level
 * performance on ImageNet classification", ICCV 2015, eq. (10). The same rule is used for the
 * linear output layer, a common simplification.
 *
 * @param sizes layer widths, input first, output last (e.g. [5, 32, 32, 5])
 * @param rng uniform random source on [0, 1)
 * @returns the layers; ReLU on every layer but the last
 */
export function heInit(sizes: readonly number[], rng: () => number): TrainableLayer[] {
  const layers: TrainableLayer[] = [];
  for (let l = 0; l + 1 < sizes.length; l++) {
    const inSize = sizes[l]!;
    const outSize = sizes[l + 1]!;
    const sd = Math.sqrt(2 / inSize);
    const weights = new Float64Array(inSize * outSize);
    for (let i = 0; i < weights.length; i++) weights[i] = sd * standardNormal(rng);
    layers.push({
      inSize,
      outSize,
      weights,
      bias: new Float64Array(outSize),
      activation: l + 2 < sizes.length ? 'relu' : 'none',
    });
  }
  return layers;
}
