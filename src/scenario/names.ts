/**
 * What counts as a valid input or advisory name.
 *
 * Names appear bare in rule text (`when cpa_nm < 0.5 expect keep_course`), so they must be
 * identifiers, and must not be one of the rule language's words, or a rule such as
 * `when in < 3 expect and` could not be read back. The rule reader (rules/) relies on both.
 */

/** An identifier as rule text spells it: a letter or `_`, then letters, digits or `_`. */
export const IDENTIFIER = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** Words of the rule language; they cannot be input or advisory names (compared case-insensitively). */
export const RESERVED_NAMES: readonly string[] = ['when', 'expect', 'and', 'or', 'in', 'not', 'always'];

/**
 * Scenario names end up in run-folder names (`runs/<name>-<timestamp>`), so they are limited to
 * characters that are safe in file names on every common file system.
 */
export const SCENARIO_NAME = /^[A-Za-z0-9][A-Za-z0-9._-]{0,63}$/;

/**
 * Why `name` cannot be used as an input or advisory name, or undefined when it can.
 * @param name the candidate name
 * @returns a short reason (no final period), or undefined
 */
export function nameProblem(name: string): string | undefined {
  if (!IDENTIFIER.test(name)) {
    return `expected an identifier ([A-Za-z_][A-Za-z0-9_]*, as rule text needs), found ${JSON.stringify(name)}`;
  }
  if (RESERVED_NAMES.includes(name.toLowerCase())) {
    return `"${name}" is a word of the rule language (${RESERVED_NAMES.join(', ')}); choose another name`;
  }
  return undefined;
}
