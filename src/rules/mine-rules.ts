import type { InputSpec, Rule, SampleSet, Tree } from '../types.js';
import { mergeRules } from './merge-rules.js';
import { DEFAULT_ROUNDING_TOLERANCE, roundThresholds } from './round-thresholds.js';
import { treeToRules } from './tree-to-rules.js';

export interface MineRulesOptions {
  /** Fidelity share the readable thresholds may cost in total; 0 keeps only free roundings. */
  readonly roundingTolerance?: number;
  /** Skip threshold rounding (keep the learned values). */
  readonly round?: boolean;
  /** Skip merging of neighbouring boxes. */
  readonly merge?: boolean;
}

/**
 * The rules stage: tree → readable thresholds (`roundThresholds`, checked on the samples the
 * tree was learned from) → one box per leaf (`treeToRules`) → neighbours merged (`mergeRules`).
 * The result is in canonical order with ids R1, R2, …; the same inputs always give the same table.
 *
 * @param tree the learned tree
 * @param samples the labelled samples the tree was learned on (network advisories as labels)
 * @param inputs the scenario's inputs
 */
export function mineRules(tree: Tree, samples: SampleSet, inputs: readonly InputSpec[], options: MineRulesOptions = {}): Rule[] {
  const tolerance = options.roundingTolerance ?? DEFAULT_ROUNDING_TOLERANCE;
  const rounded =
    options.round === false
      ? tree
      : roundThresholds(tree, { x: samples.x, n: samples.n, d: samples.d, labels: samples.advisory }, inputs, { tolerance });
  const rules = treeToRules(rounded, inputs);
  return options.merge === false ? rules : mergeRules(rules);
}
