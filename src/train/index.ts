/**
 * A small, seeded multilayer-perceptron trainer in plain TypeScript, used to make the demo
 * scenarios' networks from their expert policies. Not part of the rule-mining pipeline.
 */
export { trainMlp, type TrainData, type TrainOptions } from './train-mlp.js';
export { mlpScores } from './mlp-scores.js';
export { mlpPredict } from './mlp-predict.js';
export { mlpLossGradient, mlpWorkspace, layerGradients, type LayerGradient, type MlpWorkspace } from './mlp-loss-gradient.js';
export { adamStepInPlace, type AdamSettings } from './adam-step-in-place.js';
export { heInit } from './he-init.js';
export { createRng } from './create-rng.js';
export type { TrainableLayer } from './trainable-layer.js';
