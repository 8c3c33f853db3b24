import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ScenarioError } from '../../src/errors.js';
import { loadScenario } from '../../src/scenario/load-scenario.js';
import { validScenario } from './valid-scenario.js';

function tempFile(name: string, bytes: string | Uint8Array): string {
  const path = join(mkdtempSync(join(tmpdir(), 'specula-scenario-')), name);
  writeFileSync(path, bytes);
  return path;
}

function codeOf(path: string): { code: string; message: string } {
  try {
    loadScenario(path);
  } catch (error) {
    if (error instanceof ScenarioError) return { code: error.code, message: error.message };
    throw error;
  }
  throw new Error('expected a ScenarioError');
}

describe('loadScenario', () => {
  it('stores the SHA-256 of the file bytes, as coreutils sha256sum computes it', () => {
    const path = tempFile('scenario.json', JSON.stringify(validScenario()));
    // independent implementation: GNU coreutils sha256sum
    const reference = execFileSync('sha256sum', [path], { encoding: 'utf8' }).split(' ')[0];
    expect(loadScenario(path).scenarioSha256).toBe(reference);
  });

  it('resolves the model next to the scenario file', () => {
    const path = tempFile('scenario.json', JSON.stringify(validScenario()));
    expect(loadScenario(path).modelPath).toBe(join(path, '..', 'model.onnx'));
  });

  it('reads a file saved with a byte-order mark and CRLF line endings', () => {
    const text = JSON.stringify(validScenario(), null, 2).replace(/\n/g, '\r\n');
    const bytes = Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(text, 'utf8')]);
    expect(loadScenario(tempFile('scenario.json', bytes)).advisories).toHaveLength(3);
  });

  it('gives SCENARIO_UNREADABLE for a missing file, naming it', () => {
    const path = join(tmpdir(), 'specula-no-such-folder', 'scenario.json');
    expect(codeOf(path)).toEqual({ code: 'SCENARIO_UNREADABLE', message: `${path}: cannot read the scenario file (no such file)` });
  });

  it('gives SCENARIO_UNREADABLE for a folder', () => {
    const dir = mkdtempSync(join(tmpdir(), 'specula-scenario-'));
    expect(codeOf(dir)).toEqual({ code: 'SCENARIO_UNREADABLE', message: `${dir}: cannot read the scenario file (it is a folder, not a file)` });
  });

  it('refuses UTF-16 and malformed UTF-8 text (SCENARIO_ENCODING)', () => {
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(JSON.stringify(validScenario()), 'utf16le')]);
    expect(codeOf(tempFile('a.json', utf16)).message).toMatch(/: the file is UTF-16 text; save it as UTF-8$/);
    const bad = Buffer.from([0x7b, 0x22, 0xc3, 0x28, 0x22, 0x7d]); // {"\xC3("} — 0xC3 0x28 is not UTF-8
    expect(codeOf(tempFile('b.json', bad))).toMatchObject({ code: 'SCENARIO_ENCODING' });
  });
});
