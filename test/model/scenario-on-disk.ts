import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadScenario } from '../../src/scenario/index.js';
import type { Decision, Scenario } from '../../src/types.js';

/**
 * Writes a scenario.json (and the model bytes, when given) into a fresh temporary folder and
 * loads it, for model tests that need a real scenario next to a real file.
 */
export function scenarioOnDisk(spec: {
  inputs: Array<{ name: string; min: number; max: number; unit?: string }>;
  advisories: string[];
  decision?: Decision;
  normalize?: { offset: number[]; scale: number[] };
  model?: Uint8Array | string;
}): Scenario {
  const dir = mkdtempSync(join(tmpdir(), 'specula-model-'));
  if (spec.model !== undefined) writeFileSync(join(dir, 'model.onnx'), spec.model);
  const text = JSON.stringify({
    name: 'test',
    model: 'model.onnx',
    decision: spec.decision ?? 'argmax',
    inputs: spec.inputs,
    advisories: spec.advisories,
    ...(spec.normalize !== undefined ? { normalize: spec.normalize } : {}),
  });
  writeFileSync(join(dir, 'scenario.json'), text);
  return loadScenario(join(dir, 'scenario.json'));
}
