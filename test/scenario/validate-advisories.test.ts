import { describe, expect, it } from 'vitest';
import type { Issue } from '../../src/errors.js';
import { validateAdvisories } from '../../src/scenario/validate-advisories.js';

function run(value: unknown): { names: string[] | undefined; issues: Issue[] } {
  const issues: Issue[] = [];
  return { names: validateAdvisories(value, issues), issues };
}

describe('validateAdvisories', () => {
  it('returns the names in output order', () => {
    expect(run(['keep_course', 'slow_down'])).toEqual({ names: ['keep_course', 'slow_down'], issues: [] });
  });

  it('needs at least two names', () => {
    expect(run(['keep_course']).issues).toEqual([{ path: 'advisories', message: 'expected at least 2 names, found 1' }]);
  });

  it('names every duplicate, bad name and non-string at once', () => {
    expect(run(['a', 'b', 'a', 'not', 3, 'x-y']).issues).toEqual([
      { path: 'advisories[2]', message: 'duplicate "a" (also advisories[0])' },
      { path: 'advisories[3]', message: '"not" is a word of the rule language (when, expect, and, or, in, not, always); choose another name' },
      { path: 'advisories[4]', message: 'expected a name (string), found number 3' },
      { path: 'advisories[5]', message: 'expected an identifier ([A-Za-z_][A-Za-z0-9_]*, as rule text needs), found "x-y"' },
    ]);
  });

  it('reports a missing field', () => {
    expect(run(undefined).issues).toEqual([
      { path: 'advisories', message: 'required field is missing (expected an array of names, in output order)' },
    ]);
  });
});
