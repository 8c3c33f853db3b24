import type { Model, Rule, Scenario } from '../types.js';
import type { MineHooks } from '../pipeline/mine-hooks.js';
import { toolVersion } from '../version.js';
import { acceptedTable, evidenceById } from './accepted-table.js';
import { checkTable } from './check-table.js';
import { diffChange, type DiffChange } from './diff-change.js';
import type { DiffSettings } from './diff-models.js';
import type { DiffResult, RuleRegression } from './diff-result.js';
import type { RuleSource } from './read-rule-source.js';
import { regressionVerdict } from './regression-verdict.js';

/** A share of a diff: some accepted rules on both models, and the change figures if asked for. */
export type DiffPart = Omit<DiffResult, 'changed' | 'confusion' | 'changeRules' | 'capture'> & { readonly change?: DiffChange };

/** Which work a share of a diff does: these rules of the source (default all), and the change part or not. */
export interface DiffShare {
  readonly rules?: readonly Rule[];
  readonly change: boolean;
}

/**
 * Computes a share of a diff: the chosen accepted rules checked and proved on both models and
 * classified (`regressionVerdict`), and, when asked, the change figures (`diffChange`). Each
 * rule's evidence depends only on the seed and the rule's id, so shares computed apart give the
 * same evidence as the whole diff. The manifest's counts are this share's.
 */
export async function diffPart(
  scenario: Scenario,
  before: Model,
  after: Model,
  source: RuleSource | undefined,
  settings: DiffSettings,
  share: DiffShare,
  hooks: MineHooks = {},
): Promise<DiffPart> {
  const accepted = await acceptedTable(scenario, before, source, settings, hooks, share.rules);
  const afterTable = await checkTable(scenario, after, accepted.rules, settings, { command: 'diff', source: source?.path ?? 'mined' }, hooks);
  const afterEvidence = evidenceById(afterTable);
  const rules: RuleRegression[] = [];
  for (const rule of accepted.rules) {
    const b = accepted.evidence.get(rule.id);
    const a = afterEvidence.get(rule.id);
    if (b && a) rules.push({ rule, before: b, after: a, verdict: regressionVerdict(b, a) });
  }
  const change = share.change ? await diffChange(scenario, before, after, settings, hooks) : undefined;
  const notes = [...(source?.warnings ?? []), ...accepted.notes, ...(afterTable.notes ?? []).map((n) => `after: ${n}`)];
  if (before.sha256 === after.sha256) notes.push('the two model files are identical (same SHA-256)');
  const { tool, version } = toolVersion();
  // jobs changes the speed, never the result, so it is left out of the manifest (as mine does)
  const { mine: mineSettings, jobs: _jobs, ...rest } = settings;
  return {
    manifest: {
      tool,
      toolVersion: version,
      command: 'diff',
      date: new Date().toISOString(),
      scenario: { path: scenario.scenarioPath, sha256: scenario.scenarioSha256, name: scenario.name },
      before: { path: before.path, sha256: before.sha256 },
      after: { path: after.path, sha256: after.sha256 },
      seed: settings.seed,
      settings: { ...rest, ...(source === undefined ? { mineSamples: mineSettings.budget, mineMaxRules: mineSettings.maxRules } : {}) },
      counts: { rules: rules.length },
    },
    inputs: scenario.inputs,
    advisories: scenario.advisories,
    decision: scenario.decision,
    rulesSource: source?.path ?? 'mined from the before model',
    rules,
    notes,
    ...(change ? { change } : {}),
  };
}

/**
 * The diff result of rule shares and the change figures: the whole diff, or merged shares (whose
 * manifest's rule count is the whole run's). Adds the change counts to the manifest.
 */
export function diffResultOf(part: DiffPart, change: DiffChange): DiffResult {
  const { change: _held, notes, manifest, ...rest } = part;
  return {
    ...rest,
    manifest: { ...manifest, counts: { ...manifest.counts, changeSamples: change.samples, changeRules: change.changeRules.length } },
    changed: change.changed,
    confusion: change.confusion,
    changeRules: change.changeRules,
    capture: change.capture,
    notes,
  };
}
