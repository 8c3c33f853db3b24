import { describe, expect, it } from 'vitest';
import type { Issue } from '../../src/errors.js';
import { MAX_INPUTS, validateInputs } from '../../src/scenario/validate-inputs.js';
import { SOBOL_MAX_DIMENSION } from '../../src/sampling/index.js';

function issuesOf(value: unknown): Issue[] {
  const issues: Issue[] = [];
  validateInputs(value, issues);
  return issues;
}

describe('validateInputs', () => {
  it('returns the inputs, with unit and description defaulting to empty text', () => {
    const issues: Issue[] = [];
    expect(validateInputs([{ name: 'pitch_rate', min: -5, max: 5 }], issues)).toEqual([
      { name: 'pitch_rate', unit: '', min: -5, max: 5, description: '' },
    ]);
    expect(issues).toEqual([]);
  });

  it('reports min >= max with the input name and unit', () => {
    expect(issuesOf([{ name: 'pitch_rate', unit: 'rad/s', min: 5, max: -5 }])).toEqual([
      { path: 'inputs[0] "pitch_rate"', message: 'min 5 >= max -5 (rad/s)' },
    ]);
    expect(issuesOf([{ name: 'x', min: 2, max: 2 }])).toEqual([{ path: 'inputs[0] "x"', message: 'min 2 >= max 2' }]);
  });

  it('refuses a non-finite bound and says why', () => {
    expect(issuesOf([{ name: 'x', min: 0, max: Infinity }])).toEqual([
      { path: 'inputs[0].max', message: 'expected a finite number, found Infinity (the number in the file does not fit a 64-bit float)' },
    ]);
  });

  it('refuses a bound beyond 1e12 and says why', () => {
    expect(issuesOf([{ name: 'x', min: -2e12, max: 0 }])).toEqual([
      {
        path: 'inputs[0].min',
        message: "expected a magnitude of at most 1e12, found -2000000000000 (the network's float32 inputs are 65536 units apart there)",
      },
    ]);
  });

  it('names a duplicate input and where it first appeared', () => {
    const item = { name: 'cpa_nm', min: 0, max: 1 };
    expect(issuesOf([item, item])).toEqual([{ path: 'inputs[1].name', message: 'duplicate "cpa_nm" (also inputs[0])' }]);
  });

  it('refuses names that rule text cannot spell, and words of the rule language', () => {
    expect(issuesOf([{ name: 'cpa nm', min: 0, max: 1 }, { name: 'in', min: 0, max: 1 }])).toEqual([
      { path: 'inputs[0].name', message: 'expected an identifier ([A-Za-z_][A-Za-z0-9_]*, as rule text needs), found "cpa nm"' },
      { path: 'inputs[1].name', message: '"in" is a word of the rule language (when, expect, and, or, in, not, always); choose another name' },
    ]);
  });

  it('reports missing fields, wrong types and unknown fields of one input together', () => {
    expect(issuesOf([{ name: 'x', min: '0', maximum: 1 }])).toEqual([
      { path: 'inputs[0].maximum', message: 'unknown field (did you mean "max"?)' },
      { path: 'inputs[0].min', message: 'expected a finite number, found string "0"' },
      { path: 'inputs[0].max', message: 'required field is missing (expected a finite number)' },
    ]);
  });

  it(`refuses more than ${MAX_INPUTS} inputs as a limit of the tool`, () => {
    const many = Array.from({ length: MAX_INPUTS + 1 }, (_, i) => ({ name: `x${i}`, min: 0, max: 1 }));
    expect(issuesOf(many)).toEqual([{ path: 'inputs', message: `expected at most ${MAX_INPUTS} inputs (a limit of this tool), found ${MAX_INPUTS + 1}` }]);
    expect(issuesOf(many.slice(0, MAX_INPUTS))).toEqual([]);
    // the sampler must be able to sample every scenario the loader accepts
    expect(MAX_INPUTS).toBe(SOBOL_MAX_DIMENSION);
  });

  it('refuses an empty list and a value that is not a list', () => {
    expect(issuesOf([])).toEqual([{ path: 'inputs', message: 'expected at least 1 input, found 0' }]);
    expect(issuesOf({ name: 'x' })).toEqual([{ path: 'inputs', message: 'expected an array of inputs, found an object' }]);
    expect(issuesOf(['x'])).toEqual([
      { path: 'inputs[0]', message: 'expected an object with fields name, unit, min, max, description, found string "x"' },
    ]);
  });
});
