import type { Network } from '../prove/index.js';

/**
 * The size of a network for the cost model: weights and biases of its affine layers, and the
 * number of those layers (output layer included).
 * @param network the layer list read by readOnnxNetwork
 */
export function networkSize(network: Network): { weights: number; layers: number } {
  let weights = 0;
  let layers = 0;
  for (const l of network.layers) {
    if (l.kind !== 'affine') continue;
    weights += l.weights.length + l.bias.length;
    layers++;
  }
  return { weights, layers };
}
