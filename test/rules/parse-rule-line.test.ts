import { describe, expect, it } from 'vitest';
import { parseRuleLine } from '../../src/rules/parse-rule-line.js';

const rule = (text: string) => {
  const p = parseRuleLine(text);
  if (p.kind !== 'rule') throw new Error(`not a rule: ${JSON.stringify(p)}`);
  return p.rule;
};
const bounds = (text: string) => rule(text).conditions.map((c) => [c.name.value, c.lower?.value, c.upper?.value]);
const error = (text: string) => {
  const p = parseRuleLine(text);
  return p.kind === 'error' ? `col ${p.column}: ${p.message}` : p.kind;
};

describe('parseRuleLine', () => {
  it('reads every condition form, strict and non-strict alike', () => {
    expect(bounds('when a < 1 and b >= 2 and c in [3, 4] and 5 <= d < 6 and 7 > e >= -8 and 9 < f expect z')).toEqual([
      ['a', undefined, 1],
      ['b', 2, undefined],
      ['c', 3, 4],
      ['d', 5, 6],
      ['e', -8, 7],
      ['f', 9, undefined],
    ]);
  });

  it('reads ids, always, bare expect, or-lists and expect not', () => {
    const r = rule('R7: always expect a or b');
    expect([r.id?.value, r.conditions.length, r.negated, r.advisories.map((a) => a.value)]).toEqual(['R7', 0, false, ['a', 'b']]);
    const n = rule('expect not a and not b # comment');
    expect([n.id, n.negated, n.advisories.map((a) => a.value)]).toEqual([undefined, true, ['a', 'b']]);
  });

  it('treats blank and comment-only lines as blank', () => {
    expect(parseRuleLine('   ').kind).toBe('blank');
    expect(parseRuleLine('  # note').kind).toBe('blank');
  });

  it('says what it expected and what it found, at the right column', () => {
    expect(error('R1: when cpa_nm < abc expect x')).toBe("col 19: expected a number after '<', found 'abc'");
    expect(error('when cpa_nm <')).toBe("col 14: expected a number after '<', found end of line");
    expect(error('when cpa_nm < 1 # trailing')).toBe("col 16: expected 'and' or 'expect', found end of line");
    expect(error('when x in (0, 1) expect a')).toBe("col 11: unexpected character '('");
    expect(error('when x in [0 1] expect a')).toBe("col 14: expected ',' after the lower bound, found '1'");
    expect(error('when 3 < x > 4 expect a')).toBe("col 12: expected '<' or '<=' (a chain goes one way), found '>'");
    expect(error('when x expect a')).toBe("col 8: expected <, <=, >, >= or 'in' after 'x', found 'expect'");
    expect(error('when expect a')).toBe("col 6: expected an input name or a number after 'when', found 'expect'");
    expect(error('R9 when x < 1 expect a')).toBe("col 4: expected ':' after rule id 'R9', found 'when'");
    expect(error('1: expect a')).toBe("col 1: expected a rule id (a name such as R1) before ':', found '1'");
    expect(error('always a')).toBe("col 8: expected 'expect' after 'always', found 'a'");
    expect(error('expect a or')).toBe("col 12: expected an advisory name after 'or', found end of line");
    expect(error('expect not a or b')).toBe("col 14: expected 'and' or end of line, found 'or'");
    expect(error('expect not a and b')).toBe("col 18: expected 'not' after 'and', found 'b'");
    expect(error('when x < 1e999 expect a')).toBe('col 10: number 1e999 is out of range');
  });
});
