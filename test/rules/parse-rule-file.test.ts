import { describe, expect, it } from 'vitest';
import { RuleSyntaxError } from '../../src/errors.js';
import { parseRuleFile } from '../../src/rules/parse-rule-file.js';
import { RuleFileError } from '../../src/rules/rule-file-error.js';
import { BOAT_ADVISORIES, BOAT_INPUTS } from './survey-boat.js';

const parse = (text: string, file?: string) => parseRuleFile(text, BOAT_INPUTS, BOAT_ADVISORIES, file);
const errorOf = (text: string, file?: string): RuleFileError => {
  try {
    parse(text, file);
  } catch (e) {
    if (e instanceof RuleFileError) return e;
    throw e;
  }
  throw new Error('no error thrown');
};
const FULL = { cpa: [0, 1.5], tcpa: [-2, 20], brg: [-180, 180], crs: [-180, 180], spd: [0, 10] } as const;

describe('parseRuleFile', () => {
  it('reads the DESIGN.md example file', () => {
    const text = [
      'R1: when cpa_nm >= 1.0 expect keep_course',
      'R2: when cpa_nm < 0.5 and bearing_deg in [6, 112.5] and tcpa_min in [0, 8] expect starboard_large',
      'R3: when 0 <= tcpa_min < 4 expect slow_down or starboard_large',
      'always expect not port_small        # optional forms may be added; document them',
    ].join('\n');
    const { rules, warnings } = parse(text, 'expectations.rules');
    expect(warnings).toEqual([]);
    expect(rules.map((r) => [r.id, r.box, r.allowed])).toEqual([
      ['R1', [[1, 1.5], FULL.tcpa, FULL.brg, FULL.crs, FULL.spd], [0]],
      ['R2', [[0, 0.5], [0, 8], [6, 112.5], FULL.crs, FULL.spd], [2]],
      ['R3', [FULL.cpa, [0, 4], FULL.brg, FULL.crs, FULL.spd], [2, 3]],
      ['R4', [FULL.cpa, FULL.tcpa, FULL.brg, FULL.crs, FULL.spd], [0, 1, 2, 3]],
    ]);
    expect(rules[3]!.origin).toEqual({ kind: 'expected', line: 4, file: 'expectations.rules' });
  });

  it('accepts a byte-order mark, CRLF and CR line ends, blank lines and comments', () => {
    const text = '\uFEFFR1: expect keep_course\r\n\r\n# note\r\nR2: when own_speed_kn <= 2.5e0 expect slow_down\rR3: when tcpa_min > -1.5 expect keep_course\n';
    const { rules } = parse(text);
    expect(rules.map((r) => [r.id, r.origin])).toEqual([
      ['R1', { kind: 'expected', line: 1 }],
      ['R2', { kind: 'expected', line: 4 }],
      ['R3', { kind: 'expected', line: 5 }],
    ]);
    expect(rules[1]!.box[4]).toEqual([0, 2.5]);
    expect(rules[2]!.box[1]).toEqual([-1.5, 20]);
  });

  it('intersects conditions on one input and numbers unnamed rules around explicit ids', () => {
    const text = 'when cpa_nm >= 0.2 and cpa_nm <= 1 and cpa_nm < 0.8 expect keep_course\nR1: always expect keep_course\nalways expect slow_down';
    const { rules } = parse(text);
    expect(rules.map((r) => [r.id, r.box[0]])).toEqual([
      ['R2', [0.2, 0.8]],
      ['R1', [0, 1.5]],
      ['R3', [0, 1.5]],
    ]);
  });

  it('clips bounds past the domain and returns a warning for each', () => {
    const { rules, warnings } = parse('R1: when cpa_nm < 2 and -5 <= tcpa_min <= 3 expect keep_course');
    expect(rules[0]!.box.slice(0, 2)).toEqual([
      [0, 1.5],
      [-2, 3],
    ]);
    expect(warnings).toMatchInlineSnapshot(`
      [
        {
          "column": 19,
          "line": 1,
          "message": "cpa_nm upper bound 2 is above the domain maximum 1.5, clipped to 1.5",
        },
        {
          "column": 25,
          "line": 1,
          "message": "tcpa_min lower bound -5 is below the domain minimum -2, clipped to -2",
        },
      ]
    `);
  });

  it('keeps a box that touches the domain edge at one point', () => {
    expect(parse('when cpa_nm < 0 expect keep_course').rules[0]!.box[0]).toEqual([0, 0]);
  });

  it('collects every error in the file and throws them once, with file, line and column', () => {
    const text = [
      'R1: when cpa_nm >= 1 expect keep_course',
      'R2: when cpa_nm < abc expect keep_course',
      'R3: when cpa_nm > 1 and cpa_nm < 0.5 expect starbord_large',
      'R4: when bearing in [0, 30] expect keep_course',
      'R1: when tcpa_min in [30, 40] expect keep_course',
      'R5: expect not keep_course and not starboard_small and not starboard_large and not slow_down and not port_small',
      'R6: when speed > 3 expect halt',
    ].join('\r\n');
    const e = errorOf(text, 'expectations.rules');
    expect(e).toBeInstanceOf(RuleSyntaxError);
    expect(e.code).toBe('RULE_SYNTAX');
    expect(e.file).toBe('expectations.rules');
    expect(e.issues.map((i) => [i.line, i.column])).toEqual([
      [2, 19],
      [3, 25],
      [3, 45],
      [4, 10],
      [5, 23],
      [5, 1],
      [6, 16],
      [7, 10],
      [7, 27],
    ]);
    expect(e.message).toMatchInlineSnapshot(`
      "expectations.rules line 2, col 19: expected a number after '<', found 'abc'
      expectations.rules line 3, col 25: contradictory bounds on cpa_nm: lower 1 > upper 0.5, the box is empty
      expectations.rules line 3, col 45: unknown advisory 'starbord_large' (did you mean 'starboard_large'?), advisories are: keep_course, starboard_small, starboard_large, slow_down, port_small
      expectations.rules line 4, col 10: unknown input 'bearing' (did you mean 'bearing_deg'?), inputs are: cpa_nm, tcpa_min, bearing_deg, rel_course_deg, own_speed_kn
      expectations.rules line 5, col 23: tcpa_min [30, 40] lies outside its domain [-2, 20]
      expectations.rules line 5, col 1: duplicate rule id 'R1', first used on line 1
      expectations.rules line 6, col 16: 'expect not' leaves no advisory allowed
      expectations.rules line 7, col 10: unknown input 'speed', inputs are: cpa_nm, tcpa_min, bearing_deg, rel_course_deg, own_speed_kn
      expectations.rules line 7, col 27: unknown advisory 'halt', advisories are: keep_course, starboard_small, starboard_large, slow_down, port_small"
    `);
  });

  it('names no file when none is given', () => {
    expect(errorOf('when cpa_nm > x expect keep_course').message).toMatchInlineSnapshot(
      `"line 1, col 15: expected a number after '>', found 'x'"`,
    );
  });

  it('reads an empty file as no rules', () => {
    expect(parse('')).toEqual({ rules: [], warnings: [] });
    expect(parse('\uFEFF# nothing yet\n')).toEqual({ rules: [], warnings: [] });
  });
});
