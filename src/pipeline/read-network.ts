import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { ModelError } from '../errors.js';
import type { Model } from '../types.js';
import { readOnnxNetwork, type ReadNetworkResult } from '../prove/index.js';

/**
 * Reads the layer list for proofs from the same bytes onnxruntime runs: the file is read again
 * and its SHA-256 must equal the loaded model's, so a file replaced in between is caught.
 */
export function readNetworkOf(model: Model): ReadNetworkResult {
  const bytes = readFileSync(model.path);
  const sha = createHash('sha256').update(bytes).digest('hex');
  if (sha !== model.sha256) {
    throw new ModelError('MODEL_CHANGED', `${model.path}: the file changed while the run was going (SHA-256 ${sha.slice(0, 12)}…, loaded ${model.sha256.slice(0, 12)}…)`);
  }
  return readOnnxNetwork(bytes, model.path);
}
