import { describe, expect, it } from 'vitest';
import { nearestField } from '../../src/scenario/nearest-field.js';

const FIELDS = ['name', 'title', 'model', 'decision', 'inputs', 'advisories', 'normalize'];

describe('nearestField', () => {
  it('suggests the field a misspelling was meant to be', () => {
    expect(nearestField('advisores', FIELDS)).toBe('advisories');
    expect(nearestField('normalise', FIELDS)).toBe('normalize');
    expect(nearestField('Inputs', FIELDS)).toBe('inputs');
  });

  it('suggests a field that is a longer or shorter form of the name found', () => {
    expect(nearestField('maximum', ['min', 'max'])).toBe('max');
    expect(nearestField('desc', ['name', 'description'])).toBe('description');
  });

  it('suggests nothing for an unrelated name', () => {
    expect(nearestField('seed', FIELDS)).toBeUndefined();
    expect(nearestField('x', FIELDS)).toBeUndefined();
  });

  // Levenshtein distance reference values: kitten→sitting is 3 (the textbook example,
  // from memory), beyond the 2-edit limit, so no suggestion; sitting→sittin is 1.
  it('uses the edit distance limit of 2', () => {
    expect(nearestField('kitten', ['sitting'])).toBeUndefined();
    expect(nearestField('sittin', ['sitting'])).toBe('sitting');
  });
});
