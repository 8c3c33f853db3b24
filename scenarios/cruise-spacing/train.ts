/**
 * Trains the cruise-spacing demo network on the expert policy and writes model.onnx.
 *
 *   npx tsx scenarios/cruise-spacing/train.ts               (model.onnx)
 *   npx tsx scenarios/cruise-spacing/train.ts --retrained   (retrained.onnx: another seed, 20 epochs)
 *
 * Deterministic for the settings below (seeded sampling, initialisation and shuffling). Prints
 * per-epoch progress and the agreement with the policy on a fresh uniform sample; the same
 * figures go into the model's ONNX doc_string. The network sees the scenario's normalised
 * inputs, (x − offset) / scale from scenario.json, so rules stay in physical units.
 */
import { renameSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ToolError } from '../../src/errors.js';
import { writeMlpOnnx } from '../../src/model/onnx-write.js';
import { loadScenario } from '../../src/scenario/index.js';
import { createRng, mlpPredict, trainMlp } from '../../src/train/index.js';
import { ADVISORIES } from './policy.js';
import { CRUISE_SPACING_BOX } from './policy-boundaries.js';
import { samplePolicy } from './sample-policy.js';

const DEMO_TRAINING = {
  seed: 15622,
  uniform: 100_000,
  nearBoundary: 100_000,
  nearWidth: 0.02,
  hidden: [32, 32],
  epochs: 40,
  batchSize: 128,
  learningRate: 3e-3,
  finalLearningRate: 5e-5,
} as const;
/**
 * `--retrained` writes retrained.onnx instead: the same policy and network shape, another seed
 * and half the epochs, as a training team's next candidate might be (the "After retraining"
 * step of docs/walkthrough.md diffs it against model.onnx).
 */
const RETRAINED = process.argv.includes('--retrained');
const TRAINING = RETRAINED ? { ...DEMO_TRAINING, seed: 15623, epochs: 20 } : DEMO_TRAINING;
const EVALUATION = { seed: 7, samples: 1_000_000 } as const;

const here = dirname(fileURLToPath(import.meta.url));
const scenario = loadScenario(join(here, 'scenario.json'));
const mismatch = (what: string): ToolError => new ToolError('SCENARIO_MISMATCH', `scenario.json and the policy disagree: ${what}`);
if (scenario.advisories.join() !== ADVISORIES.join()) throw mismatch('advisories');
scenario.inputs.forEach((input, j) => {
  const [lo, hi] = CRUISE_SPACING_BOX[j]!;
  if (input.min !== lo || input.max !== hi) throw mismatch(`range of ${input.name}`);
});
const { offset, scale } = scenario.normalize!;

/** (x − offset) / scale per input: what the network sees. */
function normalise(x: Float64Array, d: number): Float64Array {
  const out = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) out[i] = (x[i]! - offset[i % d]!) / scale[i % d]!;
  return out;
}

const started = Date.now();
const train = samplePolicy(TRAINING, createRng(TRAINING.seed));
process.stdout.write(`training on ${train.n} policy samples (${TRAINING.uniform} uniform + ${TRAINING.nearBoundary} near boundaries)\n`);
const layers = trainMlp(
  { x: normalise(train.x, train.d), n: train.n, d: train.d, labels: train.labels, classes: ADVISORIES.length },
  {
    ...TRAINING,
    onEpoch: (epoch, loss, accuracy) =>
      process.stdout.write(`epoch ${String(epoch).padStart(2)}  loss ${loss.toFixed(4)}  train accuracy ${(100 * accuracy).toFixed(2)} %\n`),
  },
);
const trainSeconds = (Date.now() - started) / 1000;

// Agreement on a fresh uniform sample (a different seed, no near-boundary part): the share of
// the domain's volume where the network and the policy give the same advisory.
const test = samplePolicy({ uniform: EVALUATION.samples, nearBoundary: 0, nearWidth: 0 }, createRng(EVALUATION.seed));
const predicted = mlpPredict(layers, normalise(test.x, test.d), test.n);
const k = ADVISORIES.length;
const policyCount = new Array<number>(k).fill(0);
const agreeCount = new Array<number>(k).fill(0);
for (let i = 0; i < test.n; i++) {
  policyCount[test.labels[i]!]!++;
  if (predicted[i] === test.labels[i]) agreeCount[test.labels[i]!]!++;
}
const agreement = agreeCount.reduce((a, b) => a + b, 0) / test.n;
const perAdvisory = ADVISORIES.map((name, c) => `${name} ${((100 * agreeCount[c]!) / policyCount[c]!).toFixed(2)} % of ${policyCount[c]}`);
const balanced = ADVISORIES.reduce((s, _n, c) => s + agreeCount[c]! / policyCount[c]!, 0) / k;

const summary = [
  `agreement with the policy on ${test.n} fresh uniform samples (seed ${EVALUATION.seed}): ${(100 * agreement).toFixed(2)} %`,
  `balanced (mean per-advisory recall): ${(100 * balanced).toFixed(2)} %`,
  `per advisory (policy's advisory, share where the network agrees): ${perAdvisory.join('; ')}`,
];
const docString = [
  `Cruise-spacing demo controller${RETRAINED ? ', retrained candidate' : ''} (Specula demo scenario; not a vehicle controller).`,
  `Trained by scenarios/cruise-spacing/train.ts on scenarios/cruise-spacing/policy.ts: ${train.n} samples, ` +
    `3-${TRAINING.hidden.join('-')}-5 ReLU MLP, Adam, ${TRAINING.epochs} epochs, batch ${TRAINING.batchSize}, ` +
    `learning rate ${TRAINING.learningRate} cosine-annealed to ${TRAINING.finalLearningRate}, seed ${TRAINING.seed}.`,
  'Inputs are normalised by scenario.json: (x - offset) / scale.',
  ...summary,
].join('\n');

const target = join(here, RETRAINED ? 'retrained.onnx' : 'model.onnx');
writeFileSync(target + '.tmp', writeMlpOnnx(layers, { docString, graphName: 'cruise_spacing_advisory' }));
renameSync(target + '.tmp', target);
process.stdout.write(`${summary.join('\n')}\ntrained in ${trainSeconds.toFixed(0)} s; wrote ${target}\n`);
