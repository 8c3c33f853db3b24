/**
 * Trains version 2 of the survey-boat demo network on a changed policy and writes model-v2.onnx:
 * the regression demo of `specula diff` (README, "Regression after retraining").
 *
 *   npx tsx scenarios/survey-boat/train-v2.ts
 *
 * The one change: the safe passing distance (`cpaLimitNm`) grows from 1.0 to 1.25 nmi, as an
 * operator might ask after a close-quarters report. Every other setting, the network shape, the
 * sample counts and the training settings are those of train.ts, with the same seed, so the
 * known policy change is the only intended difference between model.onnx and model-v2.onnx.
 * Deterministic. Prints the agreement with the v2 policy on a fresh uniform sample; the same
 * figures go into the model's ONNX doc_string.
 */
import { renameSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeMlpOnnx } from '../../src/model/onnx-write.js';
import { loadScenario } from '../../src/scenario/index.js';
import { createRng, mlpPredict, trainMlp } from '../../src/train/index.js';
import { ADVISORIES, SURVEY_BOAT_POLICY_DEFAULTS, surveyBoatPolicy, type SurveyBoatPolicySettings } from './policy.js';
import { policyThresholds, SURVEY_BOAT_BOX } from './policy-thresholds.js';

/** The v2 policy: a larger safe passing distance, everything else unchanged. */
const SURVEY_BOAT_POLICY_V2: SurveyBoatPolicySettings = Object.freeze({ ...SURVEY_BOAT_POLICY_DEFAULTS, cpaLimitNm: 1.25 });

const TRAINING = {
  seed: 1972,
  uniform: 150_000,
  nearThreshold: 150_000,
  nearWidth: 0.02,
  hidden: [32, 32],
  epochs: 50,
  batchSize: 128,
  learningRate: 3e-3,
  finalLearningRate: 5e-5,
} as const;
const EVALUATION = { seed: 7, samples: 1_000_000 } as const;

/**
 * Samples of the v2 policy: `uniform` rows uniform over the box, then `near` rows with one input
 * within ± nearWidth × its range of one of the v2 policy's thresholds (as sample-policy.ts does
 * for the default settings), labelled by the v2 policy.
 */
function sampleV2(uniform: number, near: number, nearWidth: number, rng: () => number): { x: Float64Array; labels: Int32Array; n: number; d: number } {
  const d = SURVEY_BOAT_BOX.length;
  const n = uniform + near;
  const x = new Float64Array(n * d);
  const labels = new Int32Array(n);
  const thresholds = policyThresholds(SURVEY_BOAT_POLICY_V2);
  const row = new Float64Array(d);
  for (let r = 0; r < n; r++) {
    for (let j = 0; j < d; j++) row[j] = SURVEY_BOAT_BOX[j]![0] + (SURVEY_BOAT_BOX[j]![1] - SURVEY_BOAT_BOX[j]![0]) * rng();
    if (r >= uniform) {
      const j = Math.floor(rng() * d);
      const [lo, hi] = SURVEY_BOAT_BOX[j]!;
      const list = thresholds[j]!;
      const t = list[Math.floor(rng() * list.length)]!;
      row[j] = Math.min(hi, Math.max(lo, t + (2 * rng() - 1) * nearWidth * (hi - lo)));
    }
    x.set(row, r * d);
    labels[r] = surveyBoatPolicy(row, SURVEY_BOAT_POLICY_V2);
  }
  return { x, labels, n, d };
}

const here = dirname(fileURLToPath(import.meta.url));
const { offset, scale } = loadScenario(join(here, 'scenario.json')).normalize!;

function normalise(x: Float64Array, d: number): Float64Array {
  const out = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) out[i] = (x[i]! - offset[i % d]!) / scale[i % d]!;
  return out;
}

const started = Date.now();
const train = sampleV2(TRAINING.uniform, TRAINING.nearThreshold, TRAINING.nearWidth, createRng(TRAINING.seed));
process.stdout.write(`training v2 (cpaLimitNm ${SURVEY_BOAT_POLICY_V2.cpaLimitNm}) on ${train.n} policy samples\n`);
const layers = trainMlp(
  { x: normalise(train.x, train.d), n: train.n, d: train.d, labels: train.labels, classes: ADVISORIES.length },
  {
    ...TRAINING,
    onEpoch: (epoch, loss, accuracy) =>
      process.stdout.write(`epoch ${String(epoch).padStart(2)}  loss ${loss.toFixed(4)}  train accuracy ${(100 * accuracy).toFixed(2)} %\n`),
  },
);
const trainSeconds = (Date.now() - started) / 1000;

const test = sampleV2(EVALUATION.samples, 0, 0, createRng(EVALUATION.seed));
const predicted = mlpPredict(layers, normalise(test.x, test.d), test.n);
let agree = 0;
for (let i = 0; i < test.n; i++) if (predicted[i] === test.labels[i]) agree++;
const summary = `agreement with the v2 policy on ${test.n} fresh uniform samples (seed ${EVALUATION.seed}): ${((100 * agree) / test.n).toFixed(2)} %`;
const docString = [
  'Survey-boat demo controller, version 2 (Specula demo scenario; not a navigation aid).',
  `Trained by scenarios/survey-boat/train-v2.ts on scenarios/survey-boat/policy.ts with cpaLimitNm ${SURVEY_BOAT_POLICY_V2.cpaLimitNm} ` +
    `(default 1.0): ${train.n} samples, 5-${TRAINING.hidden.join('-')}-5 ReLU MLP, Adam, ${TRAINING.epochs} epochs, seed ${TRAINING.seed}.`,
  'Inputs are normalised by scenario.json: (x - offset) / scale.',
  summary,
].join('\n');

const target = join(here, 'model-v2.onnx');
writeFileSync(target + '.tmp', writeMlpOnnx(layers, { docString, graphName: 'survey_boat_advisory_v2' }));
renameSync(target + '.tmp', target);
process.stdout.write(`${summary}\ntrained in ${trainSeconds.toFixed(0)} s; wrote ${target}\n`);
