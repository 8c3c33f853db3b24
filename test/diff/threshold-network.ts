/**
 * A two-input ReLU network with movable thresholds, for regression tests whose changed region is
 * known in closed form. Inputs x1, x2 in [0, 10], advisories A, B, C:
 * A where x1 < t1; B where x1 >= t1 and x2 < t2; C where x1 >= t1 and x2 >= t2
 * (the regions of boxNetwork2d in test/fixtures/box-network.ts, which fixes t1 = 4, t2 = 6).
 *
 * Two hidden layers of four ReLUs, with p = x1 − t1 and q = t2 − x2:
 *   layer 1: u0 = relu(p), u1 = relu(−p), u2 = relu(q), u3 = relu(−q)
 *   layer 2: v0 = relu(p), v1 = relu(−p), v2 = relu(p − q), v3 = relu(p + q)
 *            (p = u0 − u1, q = u2 − u3)
 *   scores:  A = −p = v1 − v0; B = min(p, q) = p − v2; C = min(p, −q) = p − v3,
 * using min(a, b) = a − relu(a − b) and p = relu(p) − relu(−p). Inside A's region B, C ≤ p < 0 < A;
 * inside B's region A = −p < 0 and C < 0 < B; likewise for C.
 *
 * Why two layers: p and q are each formed by one subtraction, so on a threshold (x2 = t2, say)
 * u2 = u3 = 0 exactly and B and C are computed from the same float32 values: the neighbours tie
 * exactly on their shared face instead of differing by a rounding error, and a closed box ending
 * on a threshold holds (ties are not violations). A one-layer form (relu(x1 + x2 − t1 − t2)
 * against relu(x1 − x2 − t1 + t2)) rounds the two differently there.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { writeMlpOnnx } from '../../src/model/onnx-write.js';
import type { InputSpec } from '../../src/types.js';

export const THRESHOLD_INPUTS: InputSpec[] = [
  { name: 'x1', unit: '', min: 0, max: 10, description: 'first input' },
  { name: 'x2', unit: '', min: 0, max: 10, description: 'second input' },
];

export const THRESHOLD_ADVISORIES = ['A', 'B', 'C'];

/** The ONNX bytes of the network with thresholds t1 (on x1) and t2 (on x2). */
export function thresholdNetwork(t1: number, t2: number): Uint8Array {
  return writeMlpOnnx([
    // rows u0..u3 over (x1, x2)
    { inSize: 2, outSize: 4, weights: [1, 0, -1, 0, 0, -1, 0, 1], bias: [-t1, t1, t2, -t2], activation: 'relu' },
    // rows v0..v3 over (u0, u1, u2, u3)
    { inSize: 4, outSize: 4, weights: [1, -1, 0, 0, -1, 1, 0, 0, 1, -1, -1, 1, 1, -1, 1, -1], bias: [0, 0, 0, 0], activation: 'relu' },
    // rows A, B, C over (v0, v1, v2, v3)
    { inSize: 4, outSize: 3, weights: [-1, 1, 0, 0, 1, -1, -1, 0, 1, -1, 0, -1], bias: [0, 0, 0], activation: 'none' },
  ]);
}
/** The advisory by the region definitions, for checking the network and the closed forms. */
export function thresholdLabel(x1: number, x2: number, t1: number, t2: number): number {
  if (x1 < t1) return 0;
  return x2 < t2 ? 1 : 2;
}

/**
 * Writes scenario.json (model a.onnx), a.onnx and b.onnx of two threshold networks into a fresh
 * temporary folder, for CLI and loading tests.
 */
export function writeThresholdPair(before: readonly [number, number], after: readonly [number, number]): { dir: string; scenarioPath: string } {
  const dir = mkdtempSync(join(tmpdir(), 'specula-diff-'));
  writeFileSync(join(dir, 'a.onnx'), thresholdNetwork(before[0], before[1]));
  writeFileSync(join(dir, 'b.onnx'), thresholdNetwork(after[0], after[1]));
  const scenario = { name: 'thresholds', title: 'Two threshold networks', model: 'a.onnx', decision: 'argmax', inputs: THRESHOLD_INPUTS, advisories: THRESHOLD_ADVISORIES };
  const scenarioPath = join(dir, 'scenario.json');
  writeFileSync(scenarioPath, JSON.stringify(scenario, null, 2) + '\n');
  return { dir, scenarioPath };
}
