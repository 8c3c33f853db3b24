import { RuleSyntaxError } from '../errors.js';

/** One problem in a rule file, with its 1-based line and column. */
export interface RuleIssue {
  readonly line: number;
  readonly column: number;
  readonly message: string;
}

/**
 * Places an issue for messages and logs: `expectations.rules line 4, col 18: message`
 * (without a file name when the text did not come from a file).
 */
export function describeIssue(issue: RuleIssue, file?: string): string {
  const where = `line ${issue.line}, col ${issue.column}`;
  return `${file === undefined ? '' : `${file} `}${where}: ${issue.message}`;
}

/**
 * Every problem found in one rule text, thrown once. It is a `RuleSyntaxError` (code
 * `RULE_SYNTAX`), so callers that map error classes to exit codes need nothing new; the issues
 * are also kept as data so a caller can show them its own way.
 */
export class RuleFileError extends RuleSyntaxError {
  readonly file: string | undefined;
  readonly issues: readonly RuleIssue[];
  constructor(issues: readonly RuleIssue[], file?: string) {
    super('RULE_SYNTAX', issues.map((i) => describeIssue(i, file)).join('\n'));
    this.file = file;
    this.issues = issues;
  }
}
