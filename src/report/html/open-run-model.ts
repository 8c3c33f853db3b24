import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { FileError } from '../../errors.js';
import { loadModel } from '../../model/index.js';
import { loadScenario } from '../../scenario/index.js';
import type { Model, Scenario } from '../../types.js';
import type { RulesJsonDocument } from '../rules-json.js';

export interface OpenRunModelOptions {
  /** The model file; default the one the run's manifest names. */
  readonly modelPath?: string;
  /** The scenario file; default the one the run's manifest names. */
  readonly scenarioPath?: string;
  /** onnxruntime intra-op threads. */
  readonly threads?: number;
}

function sha256File(path: string): string {
  try {
    return createHash('sha256').update(readFileSync(path)).digest('hex');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new FileError('RUN_MODEL_UNREADABLE', `${path}: cannot read the run's model (${code === 'ENOENT' ? 'no such file' : (e as Error).message})`);
  }
}

/**
 * Re-opens the model (and scenario) a run was mined from, refusing any file whose SHA-256
 * differs from the run's manifest: plots of another network beside these rules would mislead.
 * The model's hash is checked before onnxruntime loads it.
 * @param doc the run's rules.json document
 * @returns the loaded model (close it when done) and the scenario
 * @throws FileError `RUN_SCENARIO_CHANGED` / `RUN_MODEL_CHANGED` naming the file and both hashes,
 *   `RUN_MODEL_UNREADABLE`; ScenarioError and ModelError from loading
 */
export async function openRunModel(doc: RulesJsonDocument, options: OpenRunModelOptions = {}): Promise<{ model: Model; scenario: Scenario }> {
  const m = doc.manifest;
  const scenarioPath = options.scenarioPath ?? m.scenario.path;
  const scenario = loadScenario(scenarioPath);
  if (scenario.scenarioSha256 !== m.scenario.sha256) {
    throw new FileError(
      'RUN_SCENARIO_CHANGED',
      `${scenarioPath}: SHA-256 ${scenario.scenarioSha256} differs from the run's ${m.scenario.sha256} (rules.json manifest); pass the run's scenario with --scenario`,
    );
  }
  const modelPath = options.modelPath ?? m.model.path;
  const found = sha256File(modelPath);
  if (found !== m.model.sha256) {
    throw new FileError(
      'RUN_MODEL_CHANGED',
      `${modelPath}: SHA-256 ${found} differs from the run's ${m.model.sha256} (rules.json manifest); the report must show the model the rules came from (pass it with --model)`,
    );
  }
  const model = await loadModel(scenario, { modelPath, ...(options.threads !== undefined ? { threads: options.threads } : {}) });
  return { model, scenario };
}
