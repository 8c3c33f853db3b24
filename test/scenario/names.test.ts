import { describe, expect, it } from 'vitest';
import { nameProblem } from '../../src/scenario/names.js';

describe('nameProblem', () => {
  it('accepts identifiers', () => {
    for (const name of ['cpa_nm', '_x', 'A1', 'x']) expect(nameProblem(name)).toBeUndefined();
  });

  it('refuses names rule text cannot spell', () => {
    for (const name of ['1x', 'cpa-nm', 'a b', '', 'é']) expect(nameProblem(name)).toMatch(/^expected an identifier/);
  });

  it('refuses words of the rule language in any case', () => {
    expect(nameProblem('Expect')).toBe('"Expect" is a word of the rule language (when, expect, and, or, in, not, always); choose another name');
  });
});
