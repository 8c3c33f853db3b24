import { describe, expect, it } from 'vitest';
import { RuleSyntaxError, ToolError } from '../../src/errors.js';
import { describeIssue, RuleFileError } from '../../src/rules/rule-file-error.js';

describe('RuleFileError', () => {
  const issues = [
    { line: 4, column: 18, message: "unknown input 'bearing'" },
    { line: 9, column: 1, message: "duplicate rule id 'R2', first used on line 2" },
  ];

  it('is a RuleSyntaxError with a stable code, the file and every issue as data', () => {
    const e = new RuleFileError(issues, 'expectations.rules');
    expect(e).toBeInstanceOf(RuleSyntaxError);
    expect(e).toBeInstanceOf(ToolError);
    expect([e.name, e.code, e.file, e.issues]).toEqual(['RuleFileError', 'RULE_SYNTAX', 'expectations.rules', issues]);
  });

  it('lists one issue a line, file first, with no final period', () => {
    expect(new RuleFileError(issues, 'expectations.rules').message).toMatchInlineSnapshot(`
      "expectations.rules line 4, col 18: unknown input 'bearing'
      expectations.rules line 9, col 1: duplicate rule id 'R2', first used on line 2"
    `);
  });

  it('leaves out the file when there is none', () => {
    expect(describeIssue(issues[0]!)).toBe("line 4, col 18: unknown input 'bearing'");
    expect(new RuleFileError(issues.slice(1)).file).toBeUndefined();
  });
});
