import type { InputSpec, Rule } from '../types.js';
import { parseRuleFile } from './parse-rule-file.js';

/**
 * The rules of a rule file, without the clipping warnings (use `parseRuleFile` to get those).
 * `parseRules(formatRules(rules, inputs, advisories), inputs, advisories)` gives back the same
 * boxes, allowed sets and ids for any rules whose boxes lie in the domain.
 * @throws RuleFileError (a RuleSyntaxError) listing every problem with line and column
 */
export function parseRules(text: string, inputs: readonly InputSpec[], advisories: readonly string[], file?: string): Rule[] {
  return parseRuleFile(text, inputs, advisories, file).rules;
}
