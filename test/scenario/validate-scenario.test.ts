import { describe, expect, it } from 'vitest';
import { validateScenario } from '../../src/scenario/validate-scenario.js';
import { validScenario } from './valid-scenario.js';

const SOURCE = { path: 'scenario.json', sha256: 'ab'.repeat(32) };

describe('validateScenario', () => {
  it('defaults the title to the name', () => {
    const s = validScenario();
    delete s['title'];
    expect(validateScenario(s, [], SOURCE).scenario?.title).toBe('survey-boat');
  });

  it('has no normalisation when the field is absent', () => {
    const s = validScenario();
    delete s['normalize'];
    const r = validateScenario(s, [], SOURCE);
    expect(r.issues).toEqual([]);
    expect(r.scenario !== undefined && 'normalize' in r.scenario).toBe(false);
  });

  it('reports every missing required field', () => {
    expect(validateScenario({}, [], SOURCE).issues).toEqual([
      { path: 'name', message: 'required field is missing (expected a non-empty string)' },
      { path: 'title', message: 'required field is missing (expected a string)' },
      { path: 'model', message: 'required field is missing (expected a non-empty string)' },
      { path: 'decision', message: 'required field is missing (expected "argmax" or "argmin")' },
      { path: 'inputs', message: 'required field is missing (expected an array of inputs)' },
      { path: 'advisories', message: 'required field is missing (expected an array of names, in output order)' },
    ]);
  });

  it('refuses a name that cannot name a run folder', () => {
    const s = validScenario();
    s['name'] = '../boat';
    expect(validateScenario(s, [], SOURCE).issues).toEqual([
      {
        path: 'name',
        message: `expected 1–64 letters, digits, '.', '_' or '-' starting with a letter or digit (it names run folders), found "../boat"`,
      },
    ]);
  });

  it('refuses an advisory that has the name of an input', () => {
    const s = validScenario();
    s['advisories'] = ['keep_course', 'cpa_nm'];
    expect(validateScenario(s, [], SOURCE).issues).toEqual([
      { path: 'advisories[1]', message: '"cpa_nm" is also the name of inputs[0]; rule text needs distinct names' },
    ]);
  });

  it('checks normalisation widths against the inputs even when an input is invalid', () => {
    const s = validScenario();
    (s['inputs'] as Array<Record<string, unknown>>)[0]!['max'] = 'big';
    s['normalize'] = { offset: [0, 0], scale: [1, 1, 1] };
    expect(validateScenario(s, [], SOURCE).issues).toEqual([
      { path: 'inputs[0].max', message: 'expected a finite number, found string "big"' },
      { path: 'normalize.offset', message: 'expected 3 numbers (one per input), found 2' },
    ]);
  });
});
