import { describe, expect, it } from 'vitest';
import { tokenizeRuleLine } from '../../src/rules/rule-tokens.js';

const kinds = (text: string): string[] => tokenizeRuleLine(text).tokens.map((t) => `${t.kind}:${t.text}@${t.column}`);

describe('tokenizeRuleLine', () => {
  it('splits names, numbers, operators and punctuation with 1-based columns', () => {
    expect(kinds('R3: when 0 <= tcpa_min<4')).toEqual([
      'word:R3@1',
      'punct::@3',
      'word:when@5',
      'number:0@10',
      'op:<=@12',
      'word:tcpa_min@15',
      'op:<@23',
      'number:4@24',
    ]);
  });

  it('reads signs, decimals and exponents as one number', () => {
    expect(kinds('-2 +.5 1. 6.02e23 1E-3')).toEqual(['number:-2@1', 'number:+.5@4', 'number:1.@8', 'number:6.02e23@11', 'number:1E-3@19']);
  });

  it('stops at a comment and skips tabs', () => {
    expect(kinds('\tx >= 1 # x >= 2')).toEqual(['word:x@2', 'op:>=@4', 'number:1@7']);
    expect(kinds('# only a comment')).toEqual([]);
  });

  it('marks a number run into letters as one bad token', () => {
    expect(kinds('x < 3abc')).toEqual(['word:x@1', 'op:<@3', 'bad:3abc@5']);
    expect(kinds('x < 1.2.3')).toEqual(['word:x@1', 'op:<@3', 'bad:1.2.3@5']);
  });

  it('reports a character that fits nothing', () => {
    expect(tokenizeRuleLine('when x = 3').error).toEqual({ column: 8, message: "unexpected character '=', conditions use <, <=, >, >= or in [a, b]" });
    expect(tokenizeRuleLine('when x ≤ 3').error).toEqual({ column: 8, message: "unexpected character '≤'" });
  });
});
