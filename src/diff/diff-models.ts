import type { Model, Scenario } from '../types.js';
import type { MineSettings } from '../pipeline/mine.js';
import type { MineHooks } from '../pipeline/mine-hooks.js';
import type { CheckTableSettings } from './check-table.js';
import { diffChange } from './diff-change.js';
import { diffPart, diffResultOf } from './diff-part.js';
import type { DiffResult } from './diff-result.js';
import type { RuleSource } from './read-rule-source.js';

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
  const part = await diffPart(scenario, before, after, source, settings, { change: false }, hooks);
  return diffResultOf(part, await diffChange(scenario, before, after, settings, hooks));
}
