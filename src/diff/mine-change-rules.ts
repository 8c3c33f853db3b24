import type { Evaluator, InputSpec, Rule, Tree } from '../types.js';
import { deriveSeed } from '../check/index.js';
import { sampleDomain } from '../sampling/index.js';
import { learnTree, pruneSequence } from '../learn/index.js';
import { mergeRules, roundThresholds, treeToRules } from '../rules/index.js';
import type { MineHooks } from '../pipeline/mine-hooks.js';
import { recountTree } from '../pipeline/recount-tree.js';
import { changeEvaluator } from './change-evaluator.js';
import { CHANGED } from './diff-result.js';

export interface MineChangeOptions {
  readonly seed: number;
  /** Samples of both models for learning the tree. */
  readonly budget: number;
  /** Largest number of change rules. */
  readonly maxRules: number;
  /** Smallest leaf of the full tree, in samples. */
  readonly minLeaf: number;
  /** Agreement with the samples that readable thresholds may cost (0..1). */
  readonly roundTolerance: number;
  /** Share of the budget spent near boundaries (sampleDomain's refinement), in [0, 1). */
  readonly boundaryShare: number;
  /**
   * Smallest cost-complexity α kept: every split of the pruned tree must remove at least this
   * share of the domain's volume from the misclassified part, per leaf it adds (default
   * CHANGE_MIN_SHARE_DEFAULT).
   */
  readonly minShare?: number;
}

/**
 * Default smallest share of the domain a split of the change tree must explain per added leaf:
 * 0.01 %. Retraining moves every decision boundary a little, so the changed region is a few
 * systematic pieces plus thin bands along all boundaries; this α keeps the pieces and drops the
 * bands. Measured on the survey-boat demo (v1 → v2, 5.2 % of the domain changed; recall and
 * precision on 100,000 uniform samples): 0.1 % gives 1 rule (recall 79.7 %, precision 98.7 %),
 * 0.01 % 4 rules (83.0 %, 97.0 %), 0.001 % 12 rules (84.1 %, 95.4 %). Choice of this project,
 * no source.
 */
export const CHANGE_MIN_SHARE_DEFAULT = 0.0001;

/** The merged rules of a tree that say CHANGED. */
function changeRulesOf(tree: Tree, inputs: readonly InputSpec[]): Rule[] {
  return mergeRules(treeToRules(tree, inputs)).filter((r) => r.allowed[0] === CHANGED);
}

/**
 * Readable rules for the region where two models give different advisories, mined with the same
 * steps as the rule table: the change predicate (`changeEvaluator`) sampled over the domain with
 * boundary refinement (`sampleDomain`), a CART tree (`learnTree`, Breiman et al., Classification
 * and Regression Trees, 1984) recounted on the space-filling samples so that pruning weighs regions
 * by volume (`recountTree`), the largest tree of its minimal cost-complexity pruning sequence
 * that is optimal at α = `minShare` or a larger α, with at most `maxRules` change rules (found by binary
 * search, as the mining pipeline does), readable thresholds (`roundThresholds`, judged on the
 * space-filling samples, so that rounding costs are counted by volume), leaves to boxes,
 * neighbours merged. Only the rules
 * saying CHANGED are kept, renumbered C1, C2, … in table order.
 */
export async function mineChangeRules(
  inputs: readonly InputSpec[],
  before: Evaluator,
  after: Evaluator,
  options: MineChangeOptions,
  hooks: MineHooks = {},
): Promise<Rule[]> {
  const samples = await sampleDomain(inputs, changeEvaluator(before, after), {
    seed: deriveSeed(options.seed, 'diff:rules'),
    budget: options.budget,
    boundaryShare: options.boundaryShare,
    onProgress: (done, total) => hooks.onProgress?.('sampling changes', done, total),
  });
  let changedCount = 0;
  for (let i = 0; i < samples.n; i++) changedCount += samples.advisory[i]!;
  if (changedCount === 0) return [];
  const data = { x: samples.x, n: samples.n, d: inputs.length, labels: samples.advisory, classes: 2 };
  // the space-filling rows come first (sampleDomain); they recount the tree by volume
  const spaceFilling = options.budget - Math.floor(options.budget * options.boundaryShare);
  const full = learnTree(data, { minLeaf: options.minLeaf });
  const seq = pruneSequence(recountTree(full, samples.x, spaceFilling, samples.advisory));
  const count = (i: number): number => changeRulesOf(seq[i]!.tree, inputs).length;
  // Step i is the optimal subtree for α from seq[i].alpha up to seq[i + 1].alpha (alphas never
  // decrease; seq[0].alpha = 0): the subtree for α = minShare is the last step not above it.
  const minShare = options.minShare ?? CHANGE_MIN_SHARE_DEFAULT;
  let lo = 0;
  while (lo + 1 < seq.length && seq[lo + 1]!.alpha <= minShare) lo++;
  let hi = seq.length - 1;
  if (count(lo) > options.maxRules) {
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (count(mid) <= options.maxRules) hi = mid;
      else lo = mid;
    }
  } else hi = lo;
  const d = inputs.length;
  const volumeSamples = { x: samples.x.subarray(0, spaceFilling * d), n: spaceFilling, d, labels: samples.advisory.subarray(0, spaceFilling) };
  const readable = roundThresholds(seq[hi]!.tree, volumeSamples, inputs, { tolerance: options.roundTolerance });
  return changeRulesOf(readable, inputs).map((r, i) => ({ ...r, id: `C${i + 1}` }));
}
