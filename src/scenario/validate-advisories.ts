import type { Issue } from '../errors.js';
import { describeValue } from './describe-value.js';
import { nameProblem } from './names.js';

/**
 * Validates the `advisories` array: at least 2 distinct identifier names, in the network's
 * output order (one name per score). A single advisory would make every rule trivially true.
 * @param value the JSON value of `advisories` (undefined when the field is missing)
 * @param issues receives one issue per problem found; nothing is thrown
 * @returns the names when all are valid, else undefined
 */
export function validateAdvisories(value: unknown, issues: Issue[]): string[] | undefined {
  if (value === undefined) {
    issues.push({ path: 'advisories', message: 'required field is missing (expected an array of names, in output order)' });
    return undefined;
  }
  if (!Array.isArray(value)) {
    issues.push({ path: 'advisories', message: `expected an array of names, found ${describeValue(value)}` });
    return undefined;
  }
  if (value.length < 2) {
    issues.push({ path: 'advisories', message: `expected at least 2 names, found ${value.length}` });
    return undefined;
  }
  const before = issues.length;
  const firstIndexOf = new Map<string, number>();
  value.forEach((item: unknown, i: number) => {
    const path = `advisories[${i}]`;
    if (typeof item !== 'string') {
      issues.push({ path, message: `expected a name (string), found ${describeValue(item)}` });
      return;
    }
    const problem = nameProblem(item);
    if (problem !== undefined) issues.push({ path, message: problem });
    const first = firstIndexOf.get(item);
    if (first !== undefined) {
      issues.push({ path, message: `duplicate ${JSON.stringify(item)} (also advisories[${first}])` });
    } else {
      firstIndexOf.set(item, i);
    }
  });
  return issues.length === before ? (value as string[]) : undefined;
}
