import { ToolError } from '../errors.js';
import { adamStepInPlace } from './adam-step-in-place.js';
import { createRng } from './create-rng.js';
import { heInit } from './he-init.js';
import { layerGradients, mlpLossGradient, mlpWorkspace } from './mlp-loss-gradient.js';
import type { TrainableLayer } from './trainable-layer.js';

/** Labelled training data: row-major n × d inputs (in the network's own units) and a class per row. */
export interface TrainData {
  readonly x: Float64Array;
  readonly n: number;
  readonly d: number;
  readonly labels: Int32Array;
  readonly classes: number;
}

export interface TrainOptions {
  /** Widths of the ReLU hidden layers, e.g. [32, 32]. */
  readonly hidden: readonly number[];
  readonly epochs: number;
  readonly batchSize: number;
  /** Adam step size α at the start. */
  readonly learningRate: number;
  /** Step size reached at the end by cosine annealing; default: learningRate (constant). */
  readonly finalLearningRate?: number;
  /** Seeds the initial weights and the shuffling: same seed, same data ⇒ same network. */
  readonly seed: number;
  /** Called after each epoch (1-based) with the epoch's mean training loss and accuracy. */
  readonly onEpoch?: (epoch: number, loss: number, accuracy: number) => void;
}

function invalid(message: string): ToolError {
  return new ToolError('TRAIN_INVALID', `trainMlp: ${message}`);
}

function validate(data: TrainData, options: TrainOptions): void {
  const { x, n, d, labels, classes } = data;
  const posInt = (v: number): boolean => Number.isInteger(v) && v >= 1;
  if (!posInt(n) || !posInt(d)) throw invalid(`n and d must be positive integers, found n ${n}, d ${d}`);
  if (x.length !== n * d) throw invalid(`x has ${x.length} values, expected n × d = ${n * d}`);
  if (labels.length !== n) throw invalid(`labels has ${labels.length} entries, expected n = ${n}`);
  if (!Number.isInteger(classes) || classes < 2) throw invalid(`classes must be an integer >= 2, found ${classes}`);
  for (let i = 0; i < x.length; i++) {
    if (!Number.isFinite(x[i])) throw invalid(`x[${i}] is ${x[i]}, expected a finite number`);
  }
  for (let i = 0; i < n; i++) {
    const y = labels[i]!;
    if (y < 0 || y >= classes) throw invalid(`labels[${i}] is ${y}, expected 0..${classes - 1}`);
  }
  if (!options.hidden.every(posInt)) throw invalid(`hidden widths must be positive integers, found [${options.hidden.join(', ')}]`);
  if (!Number.isInteger(options.epochs) || options.epochs < 0) throw invalid(`epochs must be an integer >= 0, found ${options.epochs}`);
  if (!posInt(options.batchSize)) throw invalid(`batchSize must be a positive integer, found ${options.batchSize}`);
  const rates = [options.learningRate, options.finalLearningRate ?? options.learningRate];
  if (!rates.every((r) => Number.isFinite(r) && r > 0)) throw invalid(`learning rates must be positive, found ${rates.join(', ')}`);
}

/**
 * Trains a multilayer perceptron classifier: ReLU hidden layers, a linear output layer whose
 * argmax is the class, softmax cross-entropy loss, mini-batch Adam (Kingma & Ba, ICLR 2015)
 * from He initialisation (He et al., ICCV 2015), the data reshuffled every epoch by
 * Fisher–Yates (R. Durstenfeld, "Algorithm 235: Random permutation", Communications of the ACM
 * 7(7):420, 1964). With finalLearningRate the step size follows cosine annealing,
 *   α_e = α_end + (α − α_end)(1 + cos(π e / epochs)) / 2 for epoch e = 0 … epochs − 1
 * (I. Loshchilov & F. Hutter, "SGDR: Stochastic gradient descent with warm restarts", ICLR 2017,
 * eq. (5), without restarts).
 *
 * Deterministic: all randomness comes from one xoshiro128** stream seeded by options.seed, and
 * the arithmetic is plain float64 in a fixed order.
 *
 * @param data the training set (not changed); scale the inputs to roughly unit range first
 * @param options architecture and optimiser settings
 * @returns the trained layers, input layer first; ready for writeMlpOnnx
 * @throws ToolError (code TRAIN_INVALID) on inconsistent data or options
 * @cost O(epochs × n × number of weights)
 */
export function trainMlp(data: TrainData, options: TrainOptions): TrainableLayer[] {
  validate(data, options);
  const { x, n, d, labels, classes } = data;
  const rng = createRng(options.seed);
  const layers = heInit([d, ...options.hidden, classes], rng);
  const grads = layerGradients(layers);
  const moments = layers.map((l) => ({
    mw: new Float64Array(l.weights.length),
    vw: new Float64Array(l.weights.length),
    mb: new Float64Array(l.outSize),
    vb: new Float64Array(l.outSize),
  }));
  const batchSize = Math.min(options.batchSize, n);
  const ws = mlpWorkspace(layers, batchSize);
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  const lr0 = options.learningRate;
  const lrEnd = options.finalLearningRate ?? lr0;
  let step = 0;
  for (let epoch = 0; epoch < options.epochs; epoch++) {
    for (let i = n - 1; i > 0; i--) {
      const j = Math.floor(rng() * (i + 1));
      const t = order[i]!;
      order[i] = order[j]!;
      order[j] = t;
    }
    const learningRate = lrEnd + ((lr0 - lrEnd) * (1 + Math.cos((Math.PI * epoch) / options.epochs))) / 2;
    let lossSum = 0;
    let correct = 0;
    for (let start = 0; start < n; start += batchSize) {
      const count = Math.min(batchSize, n - start);
      const r = mlpLossGradient(layers, x, labels, order, start, count, grads, ws);
      lossSum += r.lossSum;
      correct += r.correct;
      step++;
      for (let l = 0; l < layers.length; l++) {
        const m = moments[l]!;
        adamStepInPlace(layers[l]!.weights, grads[l]!.weights, m.mw, m.vw, step, { learningRate });
        adamStepInPlace(layers[l]!.bias, grads[l]!.bias, m.mb, m.vb, step, { learningRate });
      }
    }
    options.onEpoch?.(epoch + 1, lossSum / n, correct / n);
  }
  return layers;
}
