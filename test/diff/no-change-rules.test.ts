/** The reason a diff gives for having no change rules tells "nothing changed" from "too thin". */
import { describe, expect, it } from 'vitest';
import { noChangeRulesText } from '../../src/diff/no-change-rules.js';

describe('noChangeRulesText', () => {
  it('says no region changed when no sample changed', () => {
    expect(noChangeRulesText({ value: 0, lower: 0, upper: 3e-5, n: 100_000 })).toMatch(/no region where the advisory changed/);
  });

  it('says the changes are too thin for a box when some samples changed', () => {
    const text = noChangeRulesText({ value: 0.00441, lower: 0.004, upper: 0.0048, n: 100_000 });
    expect(text).toMatch(/too thin for a readable box/);
    expect(text).not.toMatch(/no region/);
  });
});
