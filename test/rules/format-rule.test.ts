import { describe, expect, it } from 'vitest';
import { formatRule } from '../../src/rules/format-rule.js';
import type { Rule } from '../../src/types.js';
import { BOAT_ADVISORIES, BOAT_INPUTS } from './survey-boat.js';

const full = BOAT_INPUTS.map((i) => [i.min, i.max] as [number, number]);
const rule = (id: string, changes: Record<number, [number, number]>, allowed: number[]): Rule => ({
  id,
  box: full.map((iv, f) => changes[f] ?? iv),
  allowed,
  origin: { kind: 'mined' },
});
const show = (r: Rule): string => formatRule(r, BOAT_INPUTS, BOAT_ADVISORIES);

describe('formatRule', () => {
  it('prints the DESIGN.md example with closed comparisons', () => {
    const r = rule('R2', { 0: [0, 0.5], 2: [6, 112.5], 1: [0, 8] }, [2]);
    expect(show(r)).toBe('R2: when cpa_nm <= 0.5 and tcpa_min in [0, 8] and bearing_deg in [6, 112.5] expect starboard_large');
  });

  it('prints one-sided bounds as >= and <=', () => {
    expect(show(rule('R1', { 0: [1, 1.5] }, [0]))).toBe('R1: when cpa_nm >= 1 expect keep_course');
    expect(show(rule('R1', { 4: [0, 2.5] }, [3]))).toBe('R1: when own_speed_kn <= 2.5 expect slow_down');
  });

  it('prints a rule without conditions as always, and several advisories with or', () => {
    expect(show(rule('R9', {}, [0, 1, 2, 3]))).toBe('R9: always expect keep_course or starboard_small or starboard_large or slow_down');
  });

  it('prints a single-point interval and exact float bounds', () => {
    expect(show(rule('R3', { 1: [4, 4], 0: [0.1 + 0.2, 1.5] }, [1]))).toBe(
      'R3: when cpa_nm >= 0.30000000000000004 and tcpa_min in [4, 4] expect starboard_small',
    );
  });

  it('omits the id when it is empty', () => {
    expect(show(rule('', {}, [4]))).toBe('always expect port_small');
  });

  it('refuses a rule that does not fit the scenario', () => {
    expect(() => show({ ...rule('R1', {}, [7]) })).toThrowErrorMatchingInlineSnapshot(`[ToolError: rule R1: advisory index 7, scenario has 5 advisories]`);
    expect(() => show({ ...rule('R1', {}, [0]), box: [[0, 1]] })).toThrowErrorMatchingInlineSnapshot(
      `[ToolError: rule R1: box has 1 intervals, scenario has 5 inputs]`,
    );
  });
});
