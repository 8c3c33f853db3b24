import type { Tree } from '../types.js';
import { checkTree } from './check-tree.js';
import { compactSubtree } from './compact-subtree.js';

/** One tree of the pruning sequence: optimal for cost-complexity parameters from `alpha` up to the next step's. */
export interface PruneStep {
  /** Complexity parameter α (misclassified share of the training weight per leaf removed). */
  readonly alpha: number;
  readonly leaves: number;
  /** The pruned tree, compacted; built on first access and then kept. */
  readonly tree: Tree;
}

/**
 * Two weakest links whose g(t) differ by less than this relative amount are pruned together,
 * as Breiman et al. prune every node attaining the minimum. With unit weights g(t) is a
 * correctly rounded quotient of integers, so equal values are bit-equal; with real weights the
 * sums R(T_t) carry rounding of ~1e-16 relative per node added, and 1e-9 covers trees of
 * millions of nodes while staying far below real gaps between distinct g values.
 */
export const PRUNE_TIE_REL = 1e-9;

/**
 * A split whose misclassified weight R(t) - R(T_t) is at most this share of the training
 * weight removes no misclassification and is pruned at α = 0 (the step T_max → T_1). Guards
 * rounding in sums of real weights; unit weights are exact.
 */
export const PRUNE_ZERO_REL = 1e-12;

/**
 * Minimal cost-complexity pruning by weakest links (Breiman, Friedman, Olshen & Stone,
 * Classification and Regression Trees, Wadsworth, 1984, §3.3). R(t) is the resubstitution
 * misclassification cost (weight not in the node's majority class, as a share of the total);
 * R_α(T) = R(T) + α·|leaves(T)|. Each step prunes every internal node t of the current tree that
 * minimises g(t) = (R(t) - R(T_t)) / (|leaves(T_t)| - 1), and that minimum is the next α.
 *
 * Entry 0 is the tree as given (α = 0). When some splits remove no misclassification, Breiman's
 * T_1 (the smallest subtree with the same R) follows, also with α = 0. The last entry is the root
 * alone. Alphas never decrease and leaf counts strictly decrease. Trees are built lazily, so the
 * whole sequence costs O(nodeCount · steps) time and O(nodeCount) memory until trees are read.
 * @param tree a tree from learnTree (or any valid Tree); not changed
 * @throws {LearnError} `LEARN_BAD_TREE` if the tree's arrays are inconsistent
 */
export function pruneSequence(tree: Tree): PruneStep[] {
  const pre = checkTree(tree);
  const { nodeCount: m, classes, counts, feature, left, right } = tree;
  const rLeaf = new Float64Array(m);
  for (let t = 0; t < m; t++) {
    let w = 0;
    let best = 0;
    for (let k = 0; k < classes; k++) {
      const c = counts[t * classes + k]!;
      w += c;
      if (c > best) best = c;
    }
    rLeaf[t] = w - best;
  }
  let rootWeight = 0;
  for (let k = 0; k < classes; k++) rootWeight += counts[k]!;
  const collapsed = new Uint8Array(m);
  const collapseStep = new Int32Array(m).fill(0x7fffffff);
  const rSub = new Float64Array(m);
  const nLeaves = new Int32Array(m);
  const stack = new Int32Array(m + 1);
  const isLeaf = (t: number): boolean => feature[t]! < 0 || collapsed[t] === 1;
  const recompute = (): void => {
    for (let j = pre.length - 1; j >= 0; j--) {
      const t = pre[j]!;
      if (isLeaf(t)) {
        rSub[t] = rLeaf[t]!;
        nLeaves[t] = 1;
      } else {
        rSub[t] = rSub[left[t]!]! + rSub[right[t]!]!;
        nLeaves[t] = nLeaves[left[t]!]! + nLeaves[right[t]!]!;
      }
    }
  };
  // Walks the current tree's internal nodes top-down; `visit` returns true to collapse a node.
  const walk = (step: number, visit: (t: number) => boolean): void => {
    let top = 0;
    stack[top++] = 0;
    while (top > 0) {
      const t = stack[--top]!;
      if (isLeaf(t)) continue;
      if (visit(t)) {
        collapsed[t] = 1;
        collapseStep[t] = step;
        continue;
      }
      stack[top++] = right[t]!;
      stack[top++] = left[t]!;
    }
  };
  const steps: PruneStep[] = [];
  const record = (alpha: number): void => {
    steps.push(lazyStep(tree, collapseStep, steps.length, alpha, nLeaves[0]!));
  };
  recompute();
  record(0);
  const zeroTol = PRUNE_ZERO_REL * rootWeight;
  walk(steps.length, (t) => rLeaf[t]! - rSub[t]! <= zeroTol);
  recompute();
  if (nLeaves[0]! < steps[0]!.leaves) record(0);
  while (!isLeaf(0)) {
    let gMin = Infinity;
    walk(steps.length, (t) => {
      const g = (rLeaf[t]! - rSub[t]!) / (nLeaves[t]! - 1);
      if (g < gMin) gMin = g;
      return false;
    });
    const cut = gMin + PRUNE_TIE_REL * gMin;
    walk(steps.length, (t) => (rLeaf[t]! - rSub[t]!) / (nLeaves[t]! - 1) <= cut);
    recompute();
    record(gMin / rootWeight);
  }
  return steps;
}

function lazyStep(tree: Tree, collapseStep: Int32Array, step: number, alpha: number, leaves: number): PruneStep {
  let built: Tree | null = null;
  return {
    alpha,
    leaves,
    get tree(): Tree {
      if (built === null) {
        const collapsed = new Uint8Array(tree.nodeCount);
        for (let t = 0; t < tree.nodeCount; t++) if (collapseStep[t]! <= step) collapsed[t] = 1;
        built = compactSubtree(tree, collapsed);
      }
      return built;
    },
  };
}
