/**
 * Model stage: the only importer of onnxruntime-node. Loads a scenario's ONNX model, checks it
 * against the scenario and evaluates it in batches -> Model.
 */
export { loadModel, DEFAULT_BATCH_SIZE, type LoadModelOptions, type OnnxModel } from './load-model.js';
export type { LabelInPlace } from './batch-evaluator.js';
export { decideInPlace } from './decide-in-place.js';
export { writeMlpOnnx, type DenseLayer, type OnnxWriteOptions } from './onnx-write.js';
