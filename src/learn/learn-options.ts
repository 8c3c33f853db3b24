import { LearnError } from '../errors.js';

/** How far a tree may grow. Every field is optional; the defaults grow the full tree. */
export interface LearnOptions {
  /** Largest depth of a leaf (the root has depth 0). Default: unlimited. */
  readonly maxDepth?: number;
  /** Fewest training rows in a leaf (a count, not a weight). Default 1. */
  readonly minLeaf?: number;
  /**
   * A split is made only when its impurity decrease weighted by the node's share of the
   * training weight, p(t)·Δi(s, t), is larger than this. Default 0 (any real decrease).
   */
  readonly minSplitGain?: number;
  /** Grow best-first (largest p(t)·Δi(s, t) first) until this many leaves. Default: unlimited, depth-first. */
  readonly maxLeaves?: number;
}

/** LearnOptions with every default filled in. */
export interface ResolvedLearnOptions {
  readonly maxDepth: number;
  readonly minLeaf: number;
  readonly minSplitGain: number;
  /** Infinity when not given. */
  readonly maxLeaves: number;
}

/**
 * Fills in defaults and checks the ranges of learning options.
 * @throws {LearnError} code `LEARN_BAD_OPTION`, naming the option, what was found and what was expected
 */
export function resolveLearnOptions(options: LearnOptions): ResolvedLearnOptions {
  const fail = (message: string): never => {
    throw new LearnError('LEARN_BAD_OPTION', `learn options: ${message}`);
  };
  const maxDepth = options.maxDepth ?? Infinity;
  const minLeaf = options.minLeaf ?? 1;
  const minSplitGain = options.minSplitGain ?? 0;
  const maxLeaves = options.maxLeaves ?? Infinity;
  if (!(maxDepth === Infinity || (Number.isInteger(maxDepth) && maxDepth >= 0))) {
    fail(`maxDepth is ${maxDepth}, expected an integer >= 0`);
  }
  if (!(Number.isInteger(minLeaf) && minLeaf >= 1)) fail(`minLeaf is ${minLeaf}, expected an integer >= 1`);
  if (!(Number.isFinite(minSplitGain) && minSplitGain >= 0)) {
    fail(`minSplitGain is ${minSplitGain}, expected a finite number >= 0`);
  }
  if (!(maxLeaves === Infinity || (Number.isInteger(maxLeaves) && maxLeaves >= 1))) {
    fail(`maxLeaves is ${maxLeaves}, expected an integer >= 1`);
  }
  return { maxDepth, minLeaf, minSplitGain, maxLeaves };
}
