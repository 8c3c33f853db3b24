import { describe, expect, it } from 'vitest';
import { editDistance } from '../../src/rules/edit-distance.js';

describe('editDistance', () => {
  it('gives the textbook Levenshtein distances', () => {
    // kitten -> sitting = 3 and flaw -> lawn = 2: the usual worked examples (Wikipedia, "Levenshtein distance")
    expect(editDistance('kitten', 'sitting')).toBe(3);
    expect(editDistance('flaw', 'lawn')).toBe(2);
  });

  it('is the length of the other string against the empty one, and 0 for equal strings', () => {
    expect(editDistance('', 'abc')).toBe(3);
    expect(editDistance('abc', '')).toBe(3);
    expect(editDistance('cpa_nm', 'cpa_nm')).toBe(0);
  });

  it('is symmetric', () => {
    expect(editDistance('bearing', 'bearing_deg')).toBe(editDistance('bearing_deg', 'bearing'));
    expect(editDistance('bearing', 'bearing_deg')).toBe(4);
  });
});
