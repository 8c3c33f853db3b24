import type { Decision, Evidence, InputSpec, Manifest, Proportion, Rule } from '../types.js';

/**
 * What became of one rule of the accepted table on the new model:
 * - `kept`: holds on both (not refuted), and not weaker on the new model (proven stays proven;
 *   sampled or unknown may become proven);
 * - `broken`: held on the old model, refuted on the new one (with a counterexample);
 * - `degraded`: refuted on both, and the violation rate on the new model is clearly at least
 *   double the old one (see `clearlyHigherRate`);
 * - `no-longer-proven`: proven on the old model, only sampled or unknown on the new one;
 * - `fixed`: refuted on the old model, holds on the new one;
 * - `still-refuted`: refuted on both, not clearly more often on the new model.
 */
export type RegressionVerdict = 'kept' | 'broken' | 'degraded' | 'no-longer-proven' | 'fixed' | 'still-refuted';

export const REGRESSION_VERDICTS: readonly RegressionVerdict[] = ['kept', 'broken', 'degraded', 'no-longer-proven', 'fixed', 'still-refuted'];

/** One rule of the accepted table with its evidence on both models. */
export interface RuleRegression {
  readonly rule: Rule;
  readonly before: Evidence;
  readonly after: Evidence;
  readonly verdict: RegressionVerdict;
}

/** How often one before → after advisory pair occurs. */
export interface Transition {
  readonly before: number;
  readonly after: number;
  readonly count: number;
}

/**
 * A readable rule saying where the advisory changed (`when … expect changed`), checked on dense
 * samples of both models inside its box.
 */
export interface ChangeRule {
  /** Box of the rule; `allowed` is [CHANGED] over the labels ['same', 'changed']. */
  readonly rule: Rule;
  /** Share of the whole domain's volume inside the box. */
  readonly volumeFraction: number;
  /** Share of the box's dense samples where the two models give different advisories. */
  readonly changed: Proportion;
  /** Before → after pairs seen among the changed samples, most frequent first. */
  readonly transitions: readonly Transition[];
}

/** How well the change rules describe the changed region, on the fresh uniform sample. */
export interface ChangeCapture {
  /** Share of the changed samples lying inside some change rule (recall). */
  readonly recall: Proportion;
  /** Share of the samples inside the change rules that changed (precision). */
  readonly precision: Proportion;
}

/** Provenance of a diff: like a run's manifest, with both model files. */
export interface DiffManifest extends Omit<Manifest, 'model'> {
  readonly before: { readonly path: string; readonly sha256: string };
  readonly after: { readonly path: string; readonly sha256: string };
}

/** The canonical result of `specula diff` (written as diff.json). */
export interface DiffResult {
  readonly manifest: DiffManifest;
  readonly inputs: readonly InputSpec[];
  readonly advisories: readonly string[];
  readonly decision: Decision;
  /** Where the accepted table came from: a file path, or `mined from the before model`. */
  readonly rulesSource: string;
  readonly rules: readonly RuleRegression[];
  /** Share of the domain's volume where the advisory changed, from a fresh uniform sample. */
  readonly changed: Proportion;
  /** confusion[a][b]: uniform samples with advisory a before and b after. */
  readonly confusion: readonly (readonly number[])[];
  readonly changeRules: readonly ChangeRule[];
  readonly capture: ChangeCapture;
  readonly notes: readonly string[];
}

/** Label of the change predicate: the advisory is the same, or changed. */
export const CHANGE_LABELS: readonly string[] = ['same', 'changed'];
export const SAME = 0;
export const CHANGED = 1;
