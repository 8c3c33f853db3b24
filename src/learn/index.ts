/**
 * Tree learning: a fast CART classifier (Gini index, presorted split search) and minimal
 * cost-complexity pruning, after Breiman, Friedman, Olshen & Stone, Classification and
 * Regression Trees, Wadsworth, 1984. See docs/learning.md.
 */
export type { LabelledData } from './labelled-data.js';
export type { LearnOptions } from './learn-options.js';
export { learnTree } from './learn-tree.js';
export { pruneSequence, type PruneStep } from './prune-sequence.js';
export { pruneToLeaves } from './prune-to-leaves.js';
export { predictTree } from './predict-tree.js';
export { leafOf } from './leaf-of.js';
export { leafCount } from './leaf-count.js';
