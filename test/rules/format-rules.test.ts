import { describe, expect, it } from 'vitest';
import { formatRules } from '../../src/rules/format-rules.js';
import type { Rule } from '../../src/types.js';
import { BOAT_ADVISORIES, BOAT_INPUTS } from './survey-boat.js';

describe('formatRules', () => {
  it('writes a header comment and one line per rule, newline-terminated', () => {
    const full = BOAT_INPUTS.map((i) => [i.min, i.max] as [number, number]);
    const rules: Rule[] = [
      { id: 'R1', box: full.map((iv, f) => (f === 0 ? [1, 1.5] : iv)), allowed: [0], origin: { kind: 'mined' } },
      { id: 'R2', box: full, allowed: [0, 1, 2, 3], origin: { kind: 'mined' } },
    ];
    expect(formatRules(rules, BOAT_INPUTS, BOAT_ADVISORIES)).toMatchInlineSnapshot(`
      "# inputs: cpa_nm [0, 1.5] nmi, tcpa_min [-2, 20] min, bearing_deg [-180, 180] deg, rel_course_deg [-180, 180] deg, own_speed_kn [0, 10] kn; advisories: keep_course, starboard_small, starboard_large, slow_down, port_small
      R1: when cpa_nm >= 1 expect keep_course
      R2: always expect keep_course or starboard_small or starboard_large or slow_down
      "
    `);
  });

  it('writes only the header for an empty table', () => {
    expect(formatRules([], BOAT_INPUTS.slice(0, 1), ['a'])).toBe('# inputs: cpa_nm [0, 1.5] nmi; advisories: a\n');
  });
});
