import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ScenarioError } from '../../src/errors.js';
import { parseScenario } from '../../src/scenario/parse-scenario.js';
import { validScenario } from './valid-scenario.js';

const PATH = '/data/boat/scenario.json';
const HASH = '0'.repeat(64);

function errorOf(text: string): ScenarioError {
  try {
    parseScenario(text, PATH, HASH);
  } catch (error) {
    if (error instanceof ScenarioError) return error;
    throw error;
  }
  throw new Error('expected a ScenarioError');
}

describe('parseScenario', () => {
  it('builds the scenario with the model resolved against the scenario folder', () => {
    const s = parseScenario(JSON.stringify(validScenario()), PATH, HASH);
    expect(s.modelPath).toBe(resolve('/data/boat/model.onnx'));
    expect(s.scenarioPath).toBe(resolve(PATH));
    expect(s.scenarioSha256).toBe(HASH);
    expect(s.inputs.map((i) => i.name)).toEqual(['cpa_nm', 'tcpa_min', 'bearing_deg']);
    expect(s.inputs[2]!.description).toBe('');
    expect(s.normalize).toEqual({ offset: [0, 9, 0], scale: [1.5, 11, 180] });
  });

  it('returns a deeply frozen scenario', () => {
    const s = parseScenario(JSON.stringify(validScenario()), PATH, HASH);
    expect(Object.isFrozen(s) && Object.isFrozen(s.inputs) && Object.isFrozen(s.inputs[0]) && Object.isFrozen(s.normalize!.scale)).toBe(true);
  });

  it('accepts a UTF-8 byte-order mark and CRLF line endings', () => {
    const text = '\uFEFF' + JSON.stringify(validScenario(), null, 2).replace(/\n/g, '\r\n');
    expect(parseScenario(text, PATH, HASH).name).toBe('survey-boat');
  });

  it('gives a JSON syntax error with its line and column (code SCENARIO_JSON)', () => {
    // line 5 holds "decision", line 6 "inputs", where the missing comma is noticed
    const text = JSON.stringify(validScenario(), null, 2).replace('"decision": "argmax",', '"decision": "argmax"');
    const error = errorOf(text);
    expect(error.code).toBe('SCENARIO_JSON');
    expect(error.message).toMatchInlineSnapshot(`"/data/boat/scenario.json: line 6, column 3: expected ',' or '}' after a field value, found '"'"`);
  });

  it('reports every problem of a scenario with three faults, in one error', () => {
    const s = validScenario();
    (s['inputs'] as Array<Record<string, unknown>>)[1]!['min'] = 25; // min 25 >= max 20
    s['decision'] = 'max';
    s['advisories'] = ['keep_course'];
    delete s['normalize']; // its width check would otherwise be a fourth issue
    const error = errorOf(JSON.stringify(s));
    expect(error.code).toBe('SCENARIO_INVALID');
    expect(error.issues).toEqual([
      { path: 'decision', message: 'expected "argmax" or "argmin", found "max"' },
      { path: 'inputs[1] "tcpa_min"', message: 'min 25 >= max 20 (min)' },
      { path: 'advisories', message: 'expected at least 2 names, found 1' },
    ]);
    expect(error.message).toMatchInlineSnapshot(
      `"/data/boat/scenario.json: decision: expected "argmax" or "argmin", found "max"; inputs[1] "tcpa_min": min 25 >= max 20 (min); advisories: expected at least 2 names, found 1"`,
    );
  });

  it('refuses a bound written as 1e999, which JSON readers turn into Infinity', () => {
    const text = JSON.stringify(validScenario()).replace('"max":1.5', '"max":1e999');
    expect(errorOf(text).issues).toEqual([
      { path: 'inputs[0].max', message: 'expected a finite number, found Infinity (the number in the file does not fit a 64-bit float)' },
    ]);
  });

  it('reports a misspelt top-level field instead of ignoring it', () => {
    const s = validScenario();
    s['advisores'] = s['advisories'];
    delete s['advisories'];
    expect(errorOf(JSON.stringify(s)).issues).toEqual([
      { path: 'advisores', message: 'unknown field (did you mean "advisories"?)' },
      { path: 'advisories', message: 'required field is missing (expected an array of names, in output order)' },
    ]);
  });

  it('reports a field written twice', () => {
    const text = JSON.stringify(validScenario(), null, 2).replace('"decision": "argmax",', '"decision": "argmax",\n  "decision": "argmin",');
    expect(errorOf(text).issues).toEqual([{ path: 'decision', message: 'field appears twice (again at line 6, column 3); keep one' }]);
  });

  it('refuses a top level that is not an object', () => {
    expect(errorOf('[1, 2]').message).toBe('/data/boat/scenario.json: expected a JSON object at the top level, found an array of 2');
  });
});
