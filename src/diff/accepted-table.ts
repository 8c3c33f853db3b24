import type { Evidence, Model, Rule, RuleTable, Scenario } from '../types.js';
import { mine } from '../pipeline/mine.js';
import type { MineHooks } from '../pipeline/mine-hooks.js';
import { checkTable } from './check-table.js';
import type { DiffSettings } from './diff-models.js';
import type { RuleSource } from './read-rule-source.js';

/** The accepted rules a diff compares, with their evidence on the old model and notes about it. */
export interface AcceptedTable {
  readonly rules: Rule[];
  readonly evidence: Map<string, Evidence>;
  readonly notes: string[];
}

export function evidenceById(table: RuleTable): Map<string, Evidence> {
  return new Map(table.rules.map((r) => [r.rule.id, r.evidence]));
}

/**
 * Where the accepted table's evidence on the old model comes from, and that evidence: mined from
 * `before` when no table is given; taken from a rules.json made on the same model and scenario
 * files (by SHA-256) when it holds every rule of the source; else the rules are checked on
 * `before`. With `only`, just those rules of the source are checked (a shard's share); whether
 * the run's evidence applies is still judged on the whole source, as in the single run.
 * Mining needs the whole table, so `only` is ignored without a source (the CLI refuses that case).
 */
export async function acceptedTable(
  scenario: Scenario,
  before: Model,
  source: RuleSource | undefined,
  settings: DiffSettings,
  hooks: MineHooks,
  only?: readonly Rule[],
): Promise<AcceptedTable> {
  if (source === undefined) {
    const table = await mine(scenario, before, { ...settings.mine, prove: settings.prove }, hooks);
    return { rules: table.rules.map((r) => r.rule), evidence: evidenceById(table), notes: (table.notes ?? []).map((n) => `before: ${n}`) };
  }
  const rules = only ? [...only] : source.rules;
  const run = source.run;
  if (run && run.modelSha256 === before.sha256 && run.scenarioSha256 === scenario.scenarioSha256 && source.rules.every((r) => run.evidence.has(r.id))) {
    return {
      rules,
      evidence: new Map(run.evidence),
      notes: [`before: evidence taken from ${source.path} (made on the same model and scenario files, by SHA-256)`],
    };
  }
  const table = await checkTable(scenario, before, rules, settings, { command: 'diff', source: source.path }, hooks);
  return { rules, evidence: evidenceById(table), notes: (table.notes ?? []).map((n) => `before: ${n}`) };
}
