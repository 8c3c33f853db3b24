import { statSync } from 'node:fs';
import type { Model } from '../types.js';
import { readNetworkOf } from '../pipeline/read-network.js';
import { networkSize } from './network-size.js';

/** Bytes per stored weight in a float32 ONNX file, for graphs the prover cannot read. */
const BYTES_PER_WEIGHT = 4;
/** Layers assumed for a graph the prover cannot read (it is not proved, so this only scales sampling). */
const UNREAD_LAYERS = 2;

/**
 * The network size of a loaded model for the cost model. Reads the model file again (I/O):
 * the prover's layer list when the graph is supported, else the file size over 4 bytes per
 * weight (float32) and UNREAD_LAYERS layers.
 * @param model a loaded model
 */
export function networkSizeOfModel(model: Model): { weights: number; layers: number } {
  const read = readNetworkOf(model);
  if (read.supported) return networkSize(read.network);
  return { weights: Math.ceil(statSync(model.path).size / BYTES_PER_WEIGHT), layers: UNREAD_LAYERS };
}
