import { describe, expect, it } from 'vitest';
import type { Issue } from '../../src/errors.js';
import type { InputSpec } from '../../src/types.js';
import { validateNormalize } from '../../src/scenario/validate-normalize.js';

const inputs: InputSpec[] = [
  { name: 'a', unit: '', min: 0, max: 10, description: '' },
  { name: 'b', unit: '', min: -1, max: 1, description: '' },
];

function run(value: unknown, width = 2): { result: unknown; issues: Issue[] } {
  const issues: Issue[] = [];
  return { result: validateNormalize(value, width, inputs.slice(0, width), issues), issues };
}

describe('validateNormalize', () => {
  it('is absent when the field is absent', () => {
    expect(run(undefined)).toEqual({ result: undefined, issues: [] });
  });

  it('returns offset and scale', () => {
    expect(run({ offset: [5, 0], scale: [5, -1] })).toEqual({ result: { offset: [5, 0], scale: [5, -1] }, issues: [] });
  });

  it('refuses a zero scale, naming its index', () => {
    expect(run({ offset: [0, 0], scale: [1, 0] }).issues).toEqual([
      { path: 'normalize.scale[1]', message: 'expected a finite non-zero number, found 0' },
    ]);
  });

  it('needs one number per input in each array', () => {
    expect(run({ offset: [0], scale: [1, 1, 1] }).issues).toEqual([
      { path: 'normalize.offset', message: 'expected 2 numbers (one per input), found 1' },
      { path: 'normalize.scale', message: 'expected 2 numbers (one per input), found 3' },
    ]);
  });

  it('needs both arrays and no other field', () => {
    expect(run({ offset: [0, 0], scales: [1, 1] }).issues).toEqual([
      { path: 'normalize.scales', message: 'unknown field (did you mean "scale"?)' },
      { path: 'normalize.scale', message: 'required field is missing (expected an array of non-zero numbers, one per input)' },
    ]);
  });

  it('refuses a scale so small that the normalised box leaves ±1e12', () => {
    expect(run({ offset: [0, 0], scale: [1e-12, 1] }).issues).toEqual([
      { path: 'normalize', message: 'input "a" maps to [0, 10000000000000], beyond ±1e12 (check scale[0])' },
    ]);
  });
});
