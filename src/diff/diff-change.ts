import type { Model, Proportion, Scenario } from '../types.js';
import type { MineHooks } from '../pipeline/mine-hooks.js';
import { changeCapture } from './change-capture.js';
import { checkChangeRules } from './check-change-rules.js';
import type { DiffSettings } from './diff-models.js';
import type { ChangeCapture, ChangeRule } from './diff-result.js';
import { measureChange } from './measure-change.js';
import { mineChangeRules } from './mine-change-rules.js';

/** Where two models' advisories differ: the parts of a diff that do not depend on the accepted rules. */
export interface DiffChange {
  /** Fresh uniform samples behind `changed` and `confusion`. */
  readonly samples: number;
  readonly changed: Proportion;
  readonly confusion: readonly (readonly number[])[];
  readonly changeRules: readonly ChangeRule[];
  readonly capture: ChangeCapture;
}

/**
 * The changed share of the domain with its exact interval and the before × after confusion
 * matrix (`measureChange`), readable rules for where the advisory changed (`mineChangeRules`),
 * each checked on dense samples (`checkChangeRules`), and how much of the changed region they
 * capture (`changeCapture`). Every random draw is seeded from `settings.seed` and a fixed label.
 */
export async function diffChange(scenario: Scenario, before: Model, after: Model, settings: DiffSettings, hooks: MineHooks = {}): Promise<DiffChange> {
  const k = scenario.advisories.length;
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
  const checked = await checkChangeRules(changeRules, scenario.inputs, before.evaluate, after.evaluate, {
    seed: settings.seed,
    samplesPerRule: settings.changeCheckSamples,
    confidence: settings.confidence,
    advisories: k,
  });
  return { samples: sample.n, changed: sample.share, confusion: sample.confusion, changeRules: checked, capture: changeCapture(changeRules, sample, settings.confidence) };
}
