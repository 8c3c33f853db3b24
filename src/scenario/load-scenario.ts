import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { ScenarioError } from '../errors.js';
import type { Scenario } from '../types.js';
import { parseScenario } from './parse-scenario.js';

function unreadable(path: string, message: string, code = 'SCENARIO_UNREADABLE'): ScenarioError {
  return new ScenarioError(path, [{ path: '', message }], code);
}

function reason(error: unknown): string {
  const code = (error as NodeJS.ErrnoException).code;
  if (code === 'ENOENT') return 'no such file';
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
  if (code === 'EISDIR') return 'it is a folder, not a file';
  return (error as Error).message.split('\n')[0]!;
}

/**
 * Reads, hashes and validates a scenario file (format: docs/formats.md).
 * @param path the scenario.json path; `model` inside it is resolved against its folder
 * @returns the validated scenario, with the SHA-256 of the file's bytes
 * @throws ScenarioError `SCENARIO_UNREADABLE` (missing or unreadable file),
 *   `SCENARIO_ENCODING` (not UTF-8 text), `SCENARIO_JSON` (syntax error, with line and column)
 *   or `SCENARIO_INVALID` (every validation issue at once)
 */
export function loadScenario(path: string): Scenario {
  let bytes: Buffer;
  try {
    bytes = readFileSync(path);
  } catch (error) {
    throw unreadable(path, `cannot read the scenario file (${reason(error)})`);
  }
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    throw unreadable(path, 'the file is UTF-16 text; save it as UTF-8', 'SCENARIO_ENCODING');
  }
  let text: string;
  try {
    // fatal: refuse malformed UTF-8 instead of replacing it with U+FFFD; a BOM is dropped
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw unreadable(path, 'the file is not valid UTF-8 text', 'SCENARIO_ENCODING');
  }
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  return parseScenario(text, path, sha256);
}
