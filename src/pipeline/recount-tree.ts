import type { Tree } from '../types.js';

/**
 * Weight of the learning samples' counts added to the recounted ones: enough to break ties and
 * to label nodes that no recount sample reaches, too small to outweigh one recount sample in a
 * node of up to 1,000 learning samples. Common practice (a tie-breaking prior), no source.
 */
export const RECOUNT_PRIOR = 1e-3;

/**
 * A copy of `tree` whose node counts (and majority labels) come from another sample set, plus
 * RECOUNT_PRIOR times the original counts.
 *
 * Why: the tree's structure is learned from samples concentrated near decision boundaries
 * (adaptive refinement), which overstate how much a split near a boundary matters. Recounting
 * with the space-filling part of the samples (an even cover of the box) makes pruning and the
 * majority labels weigh regions by their volume, which is what fidelity measures.
 * @param x row-major n × d samples in the tree's units
 * @param labels class of each sample
 */
export function recountTree(tree: Tree, x: Float64Array, n: number, labels: Int32Array): Tree {
  const { nodeCount: m, classes: k, d } = tree;
  const counts = new Float64Array(m * k);
  for (let i = 0; i < m * k; i++) counts[i] = RECOUNT_PRIOR * tree.counts[i]!;
  for (let i = 0; i < n; i++) {
    const c = labels[i]!;
    let t = 0;
    for (;;) {
      counts[t * k + c]! += 1;
      const f = tree.feature[t]!;
      if (f < 0) break;
      t = x[i * d + f]! <= tree.threshold[t]! ? tree.left[t]! : tree.right[t]!;
    }
  }
  const label = new Int32Array(m);
  for (let t = 0; t < m; t++) {
    let best = 0;
    for (let c = 1; c < k; c++) if (counts[t * k + c]! > counts[t * k + best]!) best = c;
    label[t] = best;
  }
  return { ...tree, counts, label };
}
