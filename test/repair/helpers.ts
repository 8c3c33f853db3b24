/**
 * Test helpers for the repair stage: small networks written as ONNX, loaded through the model
 * stage (onnxruntime) and read by the proof stage, plus dense sampling. Not a test file itself.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadModel, writeMlpOnnx, type DenseLayer } from '../../src/model/index.js';
import { type Box, type Network, readOnnxNetwork } from '../../src/prove/index.js';
import { createRng } from '../../src/sampling/index.js';
import { loadScenario } from '../../src/scenario/index.js';
import type { Decision, InputSpec, Model, Normalization, Scenario } from '../../src/types.js';

/** A network to repair rules on: its ONNX bytes and the scenario fields. */
export interface TestNet {
  readonly bytes: Uint8Array;
  readonly inputs: InputSpec[];
  readonly advisories: string[];
  readonly decision: Decision;
  readonly normalize?: Normalization;
}

/** The network loaded both ways: onnxruntime (through loadModel) and the prover's layer list. */
export interface LoadedNet {
  readonly scenario: Scenario;
  readonly model: Model;
  readonly network: Network;
  /** The runtime's advisory for points in scenario units. */
  readonly confirm: (x: Float64Array, n: number) => Promise<Int32Array>;
}

/** Writes scenario.json and model.onnx to a fresh temporary folder and loads both. */
export async function loadNet(net: TestNet): Promise<LoadedNet> {
  const dir = mkdtempSync(join(tmpdir(), 'specula-repair-'));
  writeFileSync(join(dir, 'model.onnx'), net.bytes);
  const doc = {
    name: 'repair-test',
    title: 'Repair test network',
    model: 'model.onnx',
    decision: net.decision,
    inputs: net.inputs,
    advisories: net.advisories,
    ...(net.normalize !== undefined ? { normalize: net.normalize } : {}),
  };
  writeFileSync(join(dir, 'scenario.json'), JSON.stringify(doc));
  const scenario = loadScenario(join(dir, 'scenario.json'));
  const model = await loadModel(scenario);
  const read = readOnnxNetwork(net.bytes);
  if (!read.supported) throw new Error('test network not supported by the prover');
  return { scenario, model, network: read.network, confirm: async (x, n) => (await model.evaluate(x, n)).advisory };
}

const unitInputs = (): InputSpec[] => [
  { name: 'x1', unit: '', min: 0, max: 10, description: 'first input' },
  { name: 'x2', unit: '', min: 0, max: 10, description: 'second input' },
];

/**
 * Two inputs in [0, 10]; advisory `pocket` inside the square [4, 5]², `outside` elsewhere.
 * Scores: s_pocket = 0.5 − max(|x1 − 4.5|, |x2 − 4.5|) and s_outside = −s_pocket, built exactly
 * from ReLUs: |u| = relu(u) + relu(−u), max(a, b) = a + relu(b − a) with a = relu(a) for a >= 0.
 * At distance δ outside the square (L∞) outside wins by 2δ; on its boundary the scores tie.
 */
export function pocketNetwork(): TestNet {
  const layers: DenseLayer[] = [
    // u = relu(x1 − 4.5), relu(4.5 − x1), relu(x2 − 4.5), relu(4.5 − x2)
    { inSize: 2, outSize: 4, weights: [1, 0, -1, 0, 0, 1, 0, -1], bias: [-4.5, 4.5, -4.5, 4.5], activation: 'relu' },
    // h1 = relu(|x1 − 4.5|), h2 = relu(|x2 − 4.5| − |x1 − 4.5|)
    { inSize: 4, outSize: 2, weights: [1, 1, 0, 0, -1, -1, 1, 1], bias: [0, 0], activation: 'relu' },
    // outside = h1 + h2 − 0.5, pocket = 0.5 − h1 − h2
    { inSize: 2, outSize: 2, weights: [1, 1, -1, -1], bias: [-0.5, 0.5], activation: 'none' },
  ];
  return { bytes: writeMlpOnnx(layers), inputs: unitInputs(), advisories: ['outside', 'pocket'], decision: 'argmax' };
}

/**
 * A seeded random ReLU network 2-16-16-3 on [0, 10]² (weights uniform in ±1/√fan-in, float32),
 * with a normalisation to [−1, 1]: curved, slanted decision boundaries like a trained network's.
 */
export function randomNetwork(seed: number): TestNet {
  const rng = createRng(seed);
  const sizes = [2, 16, 16, 3];
  const layers: DenseLayer[] = [];
  for (let l = 0; l + 1 < sizes.length; l++) {
    const fanIn = sizes[l]!;
    const weights = Array.from({ length: fanIn * sizes[l + 1]! }, () => Math.fround((rng() * 2 - 1) / Math.sqrt(fanIn)));
    const bias = Array.from({ length: sizes[l + 1]! }, () => Math.fround((rng() * 2 - 1) * 0.3));
    layers.push({ inSize: fanIn, outSize: sizes[l + 1]!, weights, bias, activation: l + 2 < sizes.length ? 'relu' : 'none' });
  }
  return {
    bytes: writeMlpOnnx(layers),
    inputs: unitInputs(),
    advisories: ['a', 'b', 'c'],
    decision: 'argmax',
    normalize: { offset: [5, 5], scale: [5, 5] },
  };
}

/**
 * Dense sampling of a closed box through onnxruntime: n uniform points plus n points on its
 * surface (each input at its min or max with probability 1/2), seeded.
 * @returns how many of the 2n points get an advisory outside `allowed`
 */
export async function countViolations(model: Model, box: Box, allowed: readonly number[], n: number, seed: number): Promise<number> {
  const rng = createRng(seed);
  const d = box.length;
  const x = new Float64Array(2 * n * d);
  for (let r = 0; r < 2 * n; r++) {
    for (let i = 0; i < d; i++) {
      const [lo, hi] = box[i]!;
      x[r * d + i] = r >= n && rng() < 0.5 ? (rng() < 0.5 ? lo : hi) : lo + rng() * (hi - lo);
    }
  }
  const { advisory } = await model.evaluate(x, 2 * n);
  let bad = 0;
  for (const a of advisory) if (!allowed.includes(a)) bad++;
  return bad;
}

/** A clock for proveBox and repairRule that never advances: budgets are set by pieces only. */
export const frozenClock = (): number => 0;
