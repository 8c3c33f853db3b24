import type { Tree } from '../types.js';
import { LearnError } from '../errors.js';
import { pruneSequence } from './prune-sequence.js';

/**
 * The largest tree of the minimal cost-complexity sequence (see pruneSequence) with at most
 * `maxLeaves` leaves: the weakest-link pruning of Breiman, Friedman, Olshen & Stone,
 * Classification and Regression Trees, Wadsworth, 1984, §3.3, stopped at a size limit.
 * @param tree not changed
 * @throws {LearnError} `LEARN_BAD_OPTION` when maxLeaves is not an integer >= 1; `LEARN_BAD_TREE` as pruneSequence
 */
export function pruneToLeaves(tree: Tree, maxLeaves: number): Tree {
  if (!(Number.isInteger(maxLeaves) && maxLeaves >= 1)) {
    throw new LearnError('LEARN_BAD_OPTION', `pruneToLeaves: maxLeaves is ${maxLeaves}, expected an integer >= 1`);
  }
  const steps = pruneSequence(tree);
  // leaf counts strictly decrease and the last entry is the root alone, so one always fits
  return steps.find((s) => s.leaves <= maxLeaves)!.tree;
}
