import type { Tree } from '../types.js';

/** Number of leaves reachable from the root (feature -1). O(nodeCount), explicit stack. */
export function leafCount(tree: Tree): number {
  const stack = new Int32Array(tree.nodeCount);
  let top = 0;
  let leaves = 0;
  stack[top++] = 0;
  while (top > 0) {
    const t = stack[--top]!;
    if (tree.feature[t]! < 0) leaves++;
    else {
      stack[top++] = tree.left[t]!;
      stack[top++] = tree.right[t]!;
    }
  }
  return leaves;
}
