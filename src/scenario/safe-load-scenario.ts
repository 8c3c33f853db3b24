import { ScenarioError } from '../errors.js';
import type { Scenario } from '../types.js';
import { loadScenario } from './load-scenario.js';

export type ScenarioResult =
  | { readonly ok: true; readonly scenario: Scenario }
  | { readonly ok: false; readonly error: ScenarioError };

/**
 * loadScenario that returns a result object instead of throwing a ScenarioError, for callers
 * that show every issue (the CLI). Other errors (defects) still throw.
 * @param path the scenario.json path
 */
export function safeLoadScenario(path: string): ScenarioResult {
  try {
    return { ok: true, scenario: loadScenario(path) };
  } catch (error) {
    if (error instanceof ScenarioError) return { ok: false, error };
    throw error;
  }
}
