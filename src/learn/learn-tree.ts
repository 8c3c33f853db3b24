import type { Tree } from '../types.js';
import type { LabelledData } from './labelled-data.js';
import { checkLabelledData } from './check-labelled-data.js';
import { resolveLearnOptions, type LearnOptions } from './learn-options.js';
import { createGrowState, type GrowState } from './grow-state.js';
import { addNodeInPlace } from './add-node-in-place.js';
import { findBestSplitInPlace } from './find-best-split-in-place.js';
import { splitNodeInPlace } from './split-node-in-place.js';
import { NodeHeap } from './node-heap.js';

/**
 * Grows a CART classification tree with the Gini index (Breiman, Friedman, Olshen & Stone,
 * Classification and Regression Trees, Wadsworth, 1984, ch. 2 and 4).
 *
 * Every input is sorted once; each node then finds its best split with one linear scan per input
 * over its own sorted segment and hands its children stable partitions of it (the presorted
 * scheme of SLIQ: Mehta, Agrawal & Rissanen, EDBT 1996). Rows go left when x[f] <= threshold;
 * thresholds are midpoints between consecutive distinct values; among equally good splits the
 * lowest input, then the lowest threshold wins. A node stays a leaf when it is pure, at maxDepth,
 * has fewer than 2·minLeaf rows, or its best p(t)·Δi is not above minSplitGain.
 *
 * Without maxLeaves the tree is grown depth-first with an explicit stack (no recursion); with it,
 * best-first: the leaf whose split lowers the tree's impurity most is split next (ties: lowest
 * node index) until there are maxLeaves leaves. Nodes are numbered in creation order (root 0,
 * children after their parent, left before right).
 *
 * Cost: O(d · n log n) to presort plus O(d · n) per tree level; memory O(d · n).
 * @param data labelled rows; not changed
 * @throws {LearnError} on inconsistent data (`LEARN_BAD_DATA`) or options (`LEARN_BAD_OPTION`)
 */
export function learnTree(data: LabelledData, options: LearnOptions = {}): Tree {
  const opts = resolveLearnOptions(options);
  checkLabelledData(data);
  const s = createGrowState(data, opts);
  const root = addNodeInPlace(s, 0, data.n, 0);
  findBestSplitInPlace(s, root);
  if (opts.maxLeaves === Infinity) growDepthFirstInPlace(s);
  else growBestFirstInPlace(s, opts.maxLeaves);
  return finish(s);
}

function growDepthFirstInPlace(s: GrowState): void {
  const stack = new Int32Array(s.start.length);
  let top = 0;
  stack[top++] = 0;
  while (top > 0) {
    const t = stack[--top]!;
    if (s.candFeature[t]! < 0) continue;
    const l = splitNodeInPlace(s, t);
    findBestSplitInPlace(s, l);
    findBestSplitInPlace(s, l + 1);
    stack[top++] = l + 1;
    stack[top++] = l;
  }
}

function growBestFirstInPlace(s: GrowState, maxLeaves: number): void {
  const heap = new NodeHeap(s.start.length, s.candGain);
  if (s.candFeature[0]! >= 0) heap.push(0);
  let leaves = 1;
  while (leaves < maxLeaves && heap.length > 0) {
    const l = splitNodeInPlace(s, heap.pop());
    leaves++;
    findBestSplitInPlace(s, l);
    findBestSplitInPlace(s, l + 1);
    if (s.candFeature[l]! >= 0) heap.push(l);
    if (s.candFeature[l + 1]! >= 0) heap.push(l + 1);
  }
}

function finish(s: GrowState): Tree {
  const m = s.nodeCount;
  return {
    d: s.d,
    classes: s.classes,
    nodeCount: m,
    feature: s.feature.slice(0, m),
    threshold: s.threshold.slice(0, m),
    left: s.left.slice(0, m),
    right: s.right.slice(0, m),
    counts: s.counts.slice(0, m * s.classes),
    label: s.label.slice(0, m),
  };
}
