import type { Tree } from '../types.js';
import { LearnError } from '../errors.js';

/**
 * Checks a tree's shape before it is walked: array sizes agree with nodeCount, children of
 * internal nodes are in range, and no node is reached twice from the root (no cycles, no
 * shared children). O(nodeCount).
 * @returns the reachable nodes in preorder (parent before children, left subtree first)
 * @throws {LearnError} `LEARN_BAD_TREE` naming the array or node, what was found and what was expected
 */
export function checkTree(tree: Tree): Int32Array {
  const { nodeCount: m, classes } = tree;
  const fail = (message: string): never => {
    throw new LearnError('LEARN_BAD_TREE', `tree: ${message}`);
  };
  if (!(Number.isInteger(m) && m >= 1)) fail(`nodeCount is ${m}, expected an integer >= 1`);
  for (const [name, arr] of [['feature', tree.feature], ['threshold', tree.threshold], ['left', tree.left], ['right', tree.right], ['label', tree.label]] as const) {
    if (arr.length !== m) fail(`${name} has ${arr.length} values, expected nodeCount = ${m}`);
  }
  if (tree.counts.length !== m * classes) fail(`counts has ${tree.counts.length} values, expected nodeCount × classes = ${m * classes}`);
  const seen = new Uint8Array(m);
  const order = new Int32Array(m);
  const stack = new Int32Array(m + 1);
  let top = 0;
  let k = 0;
  stack[top++] = 0;
  while (top > 0) {
    const t = stack[--top]!;
    if (seen[t] === 1) fail(`node ${t} is reached twice from the root, expected each node once`);
    seen[t] = 1;
    order[k++] = t;
    if (tree.feature[t]! < 0) continue;
    if (tree.feature[t]! >= tree.d) fail(`node ${t} splits input ${tree.feature[t]}, expected 0..${tree.d - 1}`);
    for (const c of [tree.right[t]!, tree.left[t]!]) {
      if (!(c >= 0 && c < m)) fail(`node ${t} has child ${c}, expected 0..${m - 1}`);
      if (top >= m) fail(`node ${t}: more nodes reachable than nodeCount = ${m}`);
      stack[top++] = c;
    }
  }
  return order.slice(0, k);
}
