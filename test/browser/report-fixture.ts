import { createHash } from 'node:crypto';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { writeMlpOnnx } from '../../src/model/index.js';
import { writeRunFolder } from '../../src/report/index.js';
import type { CheckedRule, Decision, Evidence, Fidelity, InputSpec, Manifest, RuleStatus, RuleTable } from '../../src/types.js';

/**
 * Report and export fixtures: a small ReLU network written as ONNX with known regions, a
 * scenario beside it, and a hand-made rule table whose manifest names both with their real
 * SHA-256, written as a run folder by the project's own run-folder writer.
 *
 * The network (inputs range_m x ∈ [0, 10], lateral_m y ∈ [0, 8], climb_mps z ∈ [-1, 1]):
 * hidden = relu(x, y, z + 1) (all >= 0 on the domain, so relu is the identity there), then
 * scores s0 = x - y (go_left), s1 = y - x (go_right), s2 = 4z - 2 (climb). y's range differs
 * from x's so no grid cell centre sits on the tie x = y.
 */
export const FIXTURE_INPUTS: readonly InputSpec[] = [
  { name: 'range_m', unit: 'm', min: 0, max: 10, description: 'distance ahead' },
  { name: 'lateral_m', unit: 'm', min: 0, max: 8, description: 'offset to the side' },
  { name: 'climb_mps', unit: 'm/s', min: -1, max: 1, description: 'vertical speed' },
];
export const FIXTURE_ADVISORIES = ['go_left', 'go_right', 'climb'] as const;

/** The network's scores in closed form, for checks that do not go through onnxruntime. */
export function fixtureScores(x: number, y: number, z: number): [number, number, number] {
  return [x - y, y - x, 4 * z - 2];
}

export function fixtureModelBytes(): Uint8Array {
  return writeMlpOnnx([
    { inSize: 3, outSize: 3, weights: [1, 0, 0, 0, 1, 0, 0, 0, 1], bias: [0, 0, 1], activation: 'relu' },
    { inSize: 3, outSize: 3, weights: [1, -1, 0, -1, 1, 0, 0, 0, 4], bias: [0, 0, -6], activation: 'none' },
  ]);
}

function evidence(status: RuleStatus, box: ReadonlyArray<readonly [number, number]>, extra: Partial<Evidence> = {}): Evidence {
  const volumeFraction = box.reduce((p, [lo, hi], i) => (p * (hi - lo)) / (FIXTURE_INPUTS[i]!.max - FIXTURE_INPUTS[i]!.min), 1);
  return { status, samples: 20000, violations: status === 'refuted' ? 37 : 0, violationBound: status === 'refuted' ? 0.0025 : 1.5e-4, confidence: 0.95, volumeFraction, ...extra };
}

function rule(id: string, box: Array<[number, number]>, allowed: number[], status: RuleStatus, extra: Partial<Evidence> = {}): CheckedRule {
  return { rule: { id, box, allowed, origin: { kind: 'mined' } }, evidence: evidence(status, box, extra) };
}

/** The fixture's six rules (largest first: R4, R5, then R1, R3, R6 tie and go by id). */
export function fixtureRules(): CheckedRule[] {
  return [
    rule('R1', [[5, 10], [0, 4], [-1, 0]], [0], 'proven', {
      proof: { method: 'interval bound propagation', pieces: 3, provenFraction: 1, seconds: 0.02, margin: 1e-5 },
    }),
    rule('R2', [[0, 4], [5, 8], [-1, 0]], [1], 'sampled'),
    rule('R3', [[0, 10], [0, 8], [0.75, 1]], [2], 'unknown', {
      proof: { method: 'interval bound propagation', pieces: 40, provenFraction: 0.4, seconds: 1.5, margin: 1e-5, note: 'budget reached' },
    }),
    rule('R4', [[0, 10], [0, 8], [0, 0.75]], [0, 1], 'refuted', {
      counterexample: { x: [5, 5.2, 0.7], scores: [-0.2, 0.2, 0.8], advisory: 2, margin: 0.6 },
    }),
    rule('R5', [[0, 5], [0, 5], [-1, 0]], [0, 1], 'sampled'),
    rule('R6', [[5, 10], [4, 8], [-1, 0]], [0, 1], 'sampled'),
  ];
}

function fidelity(k: number): Fidelity {
  const p = { value: 0.991, lower: 0.9894, upper: 0.9924, n: 20000 };
  return { samples: 20000, confidence: 0.95, overall: p, balanced: 0.982, perAdvisory: new Array(k).fill(p), share: new Array(k).fill(1 / k), uncovered: 0 };
}

export function fixtureManifest(paths: { model: string; modelSha: string; scenario: string; scenarioSha: string }): Manifest {
  return {
    tool: 'specula',
    toolVersion: '0.1.0',
    command: 'mine',
    date: '2025-03-01T12:00:00.000Z',
    scenario: { path: paths.scenario, sha256: paths.scenarioSha, name: 'fixture-drone' },
    model: { path: paths.model, sha256: paths.modelSha },
    seed: 7,
    settings: { budget: 20000, maxRules: 60, confidence: 0.95 },
    counts: { samples: 20000, rules: 6 },
  };
}

/** The fixture's rule table with placeholder file names (for tests that never open the model). */
export function fixtureTable(decision: Decision = 'argmax'): RuleTable {
  const manifest = fixtureManifest({ model: '/runs/x/model.onnx', modelSha: 'ab'.repeat(32), scenario: '/runs/x/scenario.json', scenarioSha: 'cd'.repeat(32) });
  return { manifest, inputs: FIXTURE_INPUTS, advisories: [...FIXTURE_ADVISORIES], decision, rules: fixtureRules(), fidelity: fidelity(3) };
}

const sha256 = (b: Uint8Array | string): string => createHash('sha256').update(b).digest('hex');

export interface FixtureRun {
  readonly dir: string;
  readonly table: RuleTable;
  readonly modelPath: string;
  readonly scenarioPath: string;
}

/**
 * A run folder in a fresh temporary directory: model.onnx, scenario.json, and rules.json /
 * rules.csv / rules.md of `table` (default: the fixture table) with a manifest naming them.
 */
export function writeFixtureRun(spec: { inputs?: readonly InputSpec[]; advisories?: readonly string[]; model?: Uint8Array; rules?: CheckedRule[] } = {}): FixtureRun {
  const dir = mkdtempSync(join(tmpdir(), 'specula-report-'));
  const inputs = spec.inputs ?? FIXTURE_INPUTS;
  const advisories = spec.advisories ?? [...FIXTURE_ADVISORIES];
  const model = spec.model ?? fixtureModelBytes();
  const modelPath = join(dir, 'model.onnx');
  const scenarioPath = join(dir, 'scenario.json');
  const scenarioText = JSON.stringify({ name: 'fixture-drone', title: 'Fixture: three-input avoidance', model: 'model.onnx', decision: 'argmax', inputs, advisories }, null, 2);
  writeFileSync(modelPath, model);
  writeFileSync(scenarioPath, scenarioText);
  const manifest = fixtureManifest({ model: modelPath, modelSha: sha256(model), scenario: scenarioPath, scenarioSha: sha256(scenarioText) });
  const table: RuleTable = { manifest, inputs, advisories, decision: 'argmax', rules: spec.rules ?? fixtureRules(), fidelity: fidelity(advisories.length) };
  writeRunFolder(dir, table);
  return { dir, table, modelPath, scenarioPath };
}
