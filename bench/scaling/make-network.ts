/**
 * Networks and scenarios for the scaling study, written to a scratch folder: a network trained
 * briefly on the study's policy (sweeps over inputs and rules) or a seeded random network of a
 * given shape (sweep over network size). Each comes with a scenario.json naming it.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { writeMlpOnnx } from '../../src/model/index.js';
import { createRng, heInit, mlpPredict, trainMlp, type TrainableLayer } from '../../src/train/index.js';
import { SCALING_ADVISORIES, samplePolicy } from './policy.js';

/** A network on disk with its scenario and its size. */
export interface StudyNetwork {
  readonly scenarioPath: string;
  readonly inputs: number;
  /** Weights and biases of all layers. */
  readonly weights: number;
  /** Affine (Gemm) layers, output layer included. */
  readonly layers: number;
  /** Agreement with the policy on fresh uniform samples (trained networks only). */
  readonly agreement?: number;
}

/** Short training: a few seconds per network on this machine, enough for ~97 % agreement. */
export const TRAINING = { samples: 20_000, hidden: [32, 32], epochs: 8, batchSize: 64, learningRate: 3e-3, finalLearningRate: 3e-4 } as const;
/** Fresh samples for the agreement figure. */
const AGREEMENT_SAMPLES = 20_000;
/** Random biases are uniform in ± this, so decision regions are not cones through the origin. */
const RANDOM_BIAS = 0.5;

function countWeights(layers: readonly TrainableLayer[]): number {
  return layers.reduce((t, l) => t + l.weights.length + l.bias.length, 0);
}

function writeScenario(dir: string, name: string, d: number, layers: readonly TrainableLayer[], doc: string): string {
  mkdirSync(dir, { recursive: true });
  writeFileSync(join(dir, 'model.onnx'), writeMlpOnnx(layers, { docString: doc, graphName: name.replace(/-/g, '_') }));
  const inputs = Array.from({ length: d }, (_, j) => ({ name: `x${j + 1}`, unit: '1', min: -1, max: 1, description: `input ${j + 1}` }));
  const scenario = { name, title: `Scaling study: ${doc}`, model: 'model.onnx', decision: 'argmax', inputs, advisories: [...SCALING_ADVISORIES] };
  const path = join(dir, 'scenario.json');
  writeFileSync(path, JSON.stringify(scenario, null, 2) + '\n');
  return path;
}

/**
 * Trains a d-input network on the study's policy (TRAINING settings) and writes it.
 * @param root scratch folder; the network goes to root/trained-<d>
 */
export function trainedNetwork(root: string, d: number, seed: number): StudyNetwork {
  const rng = createRng(seed);
  const data = samplePolicy(TRAINING.samples, d, rng);
  const layers = trainMlp({ x: data.x, n: TRAINING.samples, d, labels: data.labels, classes: SCALING_ADVISORIES.length }, { ...TRAINING, seed });
  const test = samplePolicy(AGREEMENT_SAMPLES, d, rng);
  const predicted = mlpPredict(layers, test.x, AGREEMENT_SAMPLES);
  let agree = 0;
  for (let i = 0; i < AGREEMENT_SAMPLES; i++) if (predicted[i] === test.labels[i]) agree++;
  const name = `trained-${d}`;
  const doc = `${d} inputs, ${d}-${TRAINING.hidden.join('-')}-4 ReLU network trained on the study policy`;
  const scenarioPath = writeScenario(join(root, name), name, d, layers, doc);
  return { scenarioPath, inputs: d, weights: countWeights(layers), layers: layers.length, agreement: agree / AGREEMENT_SAMPLES };
}

/**
 * A seeded random ReLU network (He-initialised weights, uniform random biases) with `depth`
 * hidden layers of `width` units, d inputs and four outputs.
 * @param root scratch folder; the network goes to root/random-<width>x<depth>
 */
export function randomNetwork(root: string, d: number, width: number, depth: number, seed: number): StudyNetwork {
  const rng = createRng(seed);
  const layers = heInit([d, ...new Array<number>(depth).fill(width), SCALING_ADVISORIES.length], rng);
  for (const l of layers) for (let i = 0; i < l.bias.length; i++) l.bias[i] = RANDOM_BIAS * (2 * rng() - 1);
  const name = `random-${width}x${depth}`;
  const scenarioPath = writeScenario(join(root, name), name, d, layers, `${d} inputs, ${depth} hidden layers of ${width}, random weights (seed ${seed})`);
  return { scenarioPath, inputs: d, weights: countWeights(layers), layers: layers.length };
}
