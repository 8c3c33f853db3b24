import type { CheckedRule, InputSpec, RuleTable } from '../types.js';
import { formatRule } from '../rules/index.js';
import { CAUTIONS } from './cautions.js';

/** Identifies the document type and layout version of rules.json. */
export const RULES_JSON_FORMAT = 'specula-rules';
export const RULES_JSON_VERSION = 1;

/** One rule as stored in rules.json: the box keyed by input name, advisories by name. */
export interface RuleJson {
  readonly id: string;
  readonly text: string;
  readonly allowed: readonly string[];
  readonly box: Readonly<Record<string, readonly [number, number]>>;
  readonly origin: CheckedRule['rule']['origin'];
  readonly evidence: CheckedRule['evidence'];
}

export interface RulesJsonDocument {
  readonly format: string;
  readonly formatVersion: number;
  readonly cautions: readonly string[];
  readonly manifest: RuleTable['manifest'];
  readonly decision: RuleTable['decision'];
  readonly inputs: readonly InputSpec[];
  readonly advisories: readonly string[];
  readonly fidelity?: RuleTable['fidelity'];
  readonly coverage?: RuleTable['coverage'];
  readonly notes?: RuleTable['notes'];
  readonly rules: readonly RuleJson[];
}

/** The canonical JSON document of a rule table (what rules.json holds). */
export function toRulesJson(table: RuleTable): RulesJsonDocument {
  const rules = table.rules.map(({ rule, evidence }): RuleJson => {
    const box: Record<string, readonly [number, number]> = {};
    table.inputs.forEach((inp, i) => {
      box[inp.name] = [rule.box[i]![0], rule.box[i]![1]];
    });
    return {
      id: rule.id,
      text: formatRule(rule, table.inputs, table.advisories),
      allowed: rule.allowed.map((a) => table.advisories[a]!),
      box,
      origin: rule.origin,
      evidence,
    };
  });
  return {
    format: RULES_JSON_FORMAT,
    formatVersion: RULES_JSON_VERSION,
    cautions: CAUTIONS,
    manifest: table.manifest,
    decision: table.decision,
    inputs: table.inputs,
    advisories: table.advisories,
    ...(table.fidelity ? { fidelity: table.fidelity } : {}),
    ...(table.coverage ? { coverage: table.coverage } : {}),
    ...(table.notes && table.notes.length > 0 ? { notes: table.notes } : {}),
    rules,
  };
}

/** rules.json text: two-space indentation, boxes on one line each for readable diffs. */
export function rulesJsonText(table: RuleTable): string {
  const text = JSON.stringify(toRulesJson(table), null, 2);
  // Put short numeric pairs ([min, max]) on one line.
  return text.replace(/\[\n\s+(-?[\d.eE+-]+),\n\s+(-?[\d.eE+-]+)\n\s+\]/g, '[$1, $2]') + '\n';
}
