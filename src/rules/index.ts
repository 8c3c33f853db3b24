// The rules stage: Tree -> Rule[], and the rule-file text format.

// stage entry
export { mineRules, type MineRulesOptions } from './mine-rules.js';

// tree to rules
export { treeToRules, type TreeToRulesOptions } from './tree-to-rules.js';
export { mergeRules, type MergeRulesOptions } from './merge-rules.js';
export { compareRules, sortRules } from './sort-rules.js';
export {
  roundThresholds,
  DEFAULT_ROUNDING_TOLERANCE,
  READABLE_STEP_MIN_FRACTION,
  type RoundingSamples,
  type RoundThresholdsOptions,
} from './round-thresholds.js';
export { readableSteps, stepMultiple, bracketingMultiples, type ReadableStep } from './readable-steps.js';

// using a table
export { tableLabel } from './table-label.js';

// rule files
export { formatRule } from './format-rule.js';
export { formatRules } from './format-rules.js';
export { formatNumber } from './format-number.js';
export { parseRules } from './parse-rules.js';
export { parseRuleFile, type ParsedRules } from './parse-rule-file.js';
export { RuleFileError, describeIssue, type RuleIssue } from './rule-file-error.js';
