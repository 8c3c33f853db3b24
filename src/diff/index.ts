/**
 * Checking given rules and regression between two models: rule sources (rule file, rules.json,
 * rules.csv), checking a table on one model, and `diff` (rules re-checked, changed share, change
 * rules, gates) -> DiffResult -> diff.json / diff.md.
 */

// stage entries
export { diffModels, type DiffSettings } from './diff-models.js';
export { diffPart, diffResultOf, type DiffPart, type DiffShare } from './diff-part.js';
export { diffChange, type DiffChange } from './diff-change.js';
export { acceptedTable, type AcceptedTable } from './accepted-table.js';
export { checkTable, type CheckTableSettings, type CheckTableOptions } from './check-table.js';
export { readRuleSource, ruleSourceKind, type RuleSource, type RuleSourceKind } from './read-rule-source.js';

// parts of a diff
export { regressionVerdict, clearlyHigherRate, DEGRADED_FACTOR } from './regression-verdict.js';
export { measureChange, type ChangeSample, type MeasureChangeOptions } from './measure-change.js';
export { changeEvaluator } from './change-evaluator.js';
export { mineChangeRules, CHANGE_MIN_SHARE_DEFAULT, type MineChangeOptions } from './mine-change-rules.js';
export { checkChangeRules, type CheckChangeOptions } from './check-change-rules.js';
export { changeCapture } from './change-capture.js';
export { rulesFromRun, type RulesFromRun } from './rules-from-run.js';
export { clipToDomain, type ClippedBox } from './clip-to-domain.js';
export { proportionOf } from './proportion-of.js';
export {
  CHANGE_LABELS,
  CHANGED,
  SAME,
  REGRESSION_VERDICTS,
  type ChangeCapture,
  type ChangeRule,
  type DiffManifest,
  type DiffResult,
  type RegressionVerdict,
  type RuleRegression,
  type Transition,
} from './diff-result.js';

// gates and outputs
export { parseFailOn, evaluateGates, type Gate, type GateOutcome } from './fail-on.js';
export { diffJson, diffJsonText, DIFF_JSON_FORMAT, DIFF_JSON_VERSION, DIFF_CAUTIONS } from './diff-json.js';
export { diffMdText } from './diff-md.js';
export { diffSummaryText, SUMMARY_CHANGE_RULES, SUMMARY_VERDICT_RULES } from './diff-summary.js';
export { writeDiffFolder } from './write-diff-folder.js';
export { pct, pctInterval, count, pointText, counterexampleText } from './format-figures.js';
