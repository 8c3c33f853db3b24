import type { Evidence, Model, Rule, RuleTable, Scenario } from '../types.js';
import { mine, type MineSettings } from '../pipeline/mine.js';
import type { MineHooks } from '../pipeline/mine-hooks.js';
import { toolVersion } from '../version.js';
import { changeCapture } from './change-capture.js';
import { checkChangeRules } from './check-change-rules.js';
import { checkTable, type CheckTableSettings } from './check-table.js';
import type { DiffResult, RuleRegression } from './diff-result.js';
import { measureChange } from './measure-change.js';
import { mineChangeRules } from './mine-change-rules.js';
import type { RuleSource } from './read-rule-source.js';
import { regressionVerdict } from './regression-verdict.js';

export interface DiffSettings extends CheckTableSettings {
  /** Settings of the mining pipeline, used when no accepted table is given. */
  readonly mine: MineSettings;
  /** Fresh uniform samples for the changed share and the confusion matrix. */
  readonly changeSamples: number;
  /** Samples of both models for learning the change rules. */
  readonly changeBudget: number;
  readonly maxChangeRules: number;
  readonly minLeaf: number;
  readonly roundTolerance: number;
  /** Dense samples per change rule. */
  readonly changeCheckSamples: number;
  /** Smallest share of the domain a split of the change tree must explain, per leaf. */
  readonly changeMinShare: number;
}

/** Where the accepted table's evidence on the old model comes from, and that evidence. */
async function acceptedTable(
  scenario: Scenario,
  before: Model,
  source: RuleSource | undefined,
  settings: DiffSettings,
  hooks: MineHooks,
): Promise<{ rules: Rule[]; evidence: Map<string, Evidence>; notes: string[] }> {
  if (source === undefined) {
    const table = await mine(scenario, before, { ...settings.mine, prove: settings.prove }, hooks);
    return { rules: table.rules.map((r) => r.rule), evidence: evidenceById(table), notes: (table.notes ?? []).map((n) => `before: ${n}`) };
  }
  const run = source.run;
  if (run && run.modelSha256 === before.sha256 && run.scenarioSha256 === scenario.scenarioSha256 && source.rules.every((r) => run.evidence.has(r.id))) {
    return {
      rules: source.rules,
      evidence: new Map(run.evidence),
      notes: [`before: evidence taken from ${source.path} (made on the same model and scenario files, by SHA-256)`],
    };
  }
  const table = await checkTable(scenario, before, source.rules, settings, { command: 'diff', source: source.path }, hooks);
  return { rules: source.rules, evidence: evidenceById(table), notes: (table.notes ?? []).map((n) => `before: ${n}`) };
}

function evidenceById(table: RuleTable): Map<string, Evidence> {
  return new Map(table.rules.map((r) => [r.rule.id, r.evidence]));
}

/**
 * Regression between two models of one scenario: (a) the accepted rule table (given, or mined
 * from the old model) checked and proved on both models, each rule classified kept / broken /
 * no longer proven / fixed / still refuted; (b) the share of the domain whose advisory changed,
 * with its exact interval, and the before × after confusion matrix; (c) readable rules for where
 * the advisory changed, mined from both models with the same learner, each checked on dense
 * samples, and how much of the changed region they capture.
 * @param source the accepted table, or undefined to mine one from `before`
 */
export async function diffModels(
  scenario: Scenario,
  before: Model,
  after: Model,
  source: RuleSource | undefined,
  settings: DiffSettings,
  hooks: MineHooks = {},
): Promise<DiffResult> {
  const k = scenario.advisories.length;
  const accepted = await acceptedTable(scenario, before, source, settings, hooks);
  const afterTable = await checkTable(scenario, after, accepted.rules, settings, { command: 'diff', source: source?.path ?? 'mined' }, hooks);
  const afterEvidence = evidenceById(afterTable);
  const rules: RuleRegression[] = [];
  for (const rule of accepted.rules) {
    const b = accepted.evidence.get(rule.id);
    const a = afterEvidence.get(rule.id);
    if (b && a) rules.push({ rule, before: b, after: a, verdict: regressionVerdict(b, a) });
  }
  hooks.onStage?.('measuring change');
  const sample = await measureChange(before.evaluate, after.evaluate, scenario.inputs, {
    seed: settings.seed,
    samples: settings.changeSamples,
    confidence: settings.confidence,
    advisories: k,
  });
  hooks.onStage?.('describing change');
  const changeRules = await mineChangeRules(scenario.inputs, before.evaluate, after.evaluate, {
    seed: settings.seed,
    budget: settings.changeBudget,
    maxRules: settings.maxChangeRules,
    minLeaf: settings.minLeaf,
    roundTolerance: settings.roundTolerance,
    boundaryShare: settings.mine.boundaryShare,
    minShare: settings.changeMinShare,
  }, hooks);
  const checkedChanges = await checkChangeRules(changeRules, scenario.inputs, before.evaluate, after.evaluate, {
    seed: settings.seed,
    samplesPerRule: settings.changeCheckSamples,
    confidence: settings.confidence,
    advisories: k,
  });
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
      counts: { rules: rules.length, changeSamples: sample.n, changeRules: changeRules.length },
    },
    inputs: scenario.inputs,
    advisories: scenario.advisories,
    decision: scenario.decision,
    rulesSource: source?.path ?? 'mined from the before model',
    rules,
    changed: sample.share,
    confusion: sample.confusion,
    changeRules: checkedChanges,
    capture: changeCapture(changeRules, sample, settings.confidence),
    notes,
  };
}
