import { ScenarioError } from '../errors.js';
import type { Scenario } from '../types.js';
import { jsonRead } from './json-read.js';
import { validateScenario } from './validate-scenario.js';

function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const v of Object.values(value)) deepFreeze(v);
  }
  return value;
}

/**
 * Parses and validates the text of a scenario.json (format: docs/formats.md). A leading UTF-8
 * byte-order mark is ignored and CRLF line endings are accepted. Does no I/O: the model path is
 * only resolved against the scenario file's folder, not opened.
 * @param text the file's text
 * @param path the scenario file's path, used in messages and to resolve `model`
 * @param sha256 SHA-256 (hex) of the file's bytes, stored in the scenario
 * @returns the validated scenario, deeply frozen
 * @throws ScenarioError `SCENARIO_JSON` with the line and column of a syntax error, or
 *   `SCENARIO_INVALID` listing every problem found (field path, expected, found)
 */
export function parseScenario(text: string, path: string, sha256: string): Scenario {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const read = jsonRead(body);
  if (!read.ok) {
    throw new ScenarioError(path, [{ path: `line ${read.line}, column ${read.column}`, message: read.message }], 'SCENARIO_JSON');
  }
  const result = validateScenario(read.value, read.duplicates, { path, sha256 });
  if (result.scenario === undefined) throw new ScenarioError(path, result.issues);
  return deepFreeze(result.scenario);
}
