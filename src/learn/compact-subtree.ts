import type { Tree } from '../types.js';

/**
 * The pruned subtree of `tree` in which every node t with `collapsed[t] === 1` becomes a leaf,
 * with unreachable nodes dropped. Kept nodes stay in ascending order of their old index (so the
 * root stays 0 and a tree with nothing collapsed and nothing unreachable comes back unchanged);
 * counts and labels of kept nodes are copied. O(nodeCount). `tree` is not changed.
 */
export function compactSubtree(tree: Tree, collapsed: Uint8Array): Tree {
  const { nodeCount, classes, feature, left, right } = tree;
  const newIndex = new Int32Array(nodeCount).fill(-1);
  const stack = new Int32Array(nodeCount);
  let top = 0;
  stack[top++] = 0;
  newIndex[0] = 0;
  while (top > 0) {
    const t = stack[--top]!;
    if (feature[t]! < 0 || collapsed[t] === 1) continue;
    newIndex[left[t]!] = 0;
    newIndex[right[t]!] = 0;
    stack[top++] = left[t]!;
    stack[top++] = right[t]!;
  }
  let m = 0;
  for (let t = 0; t < nodeCount; t++) if (newIndex[t]! >= 0) newIndex[t] = m++;
  const out = {
    feature: new Int32Array(m),
    threshold: new Float64Array(m),
    left: new Int32Array(m),
    right: new Int32Array(m),
    counts: new Float64Array(m * classes),
    label: new Int32Array(m),
  };
  for (let t = 0; t < nodeCount; t++) {
    const u = newIndex[t]!;
    if (u < 0) continue;
    const leaf = feature[t]! < 0 || collapsed[t] === 1;
    out.feature[u] = leaf ? -1 : feature[t]!;
    out.threshold[u] = leaf ? 0 : tree.threshold[t]!;
    out.left[u] = leaf ? -1 : newIndex[left[t]!]!;
    out.right[u] = leaf ? -1 : newIndex[right[t]!]!;
    out.counts.set(tree.counts.subarray(t * classes, (t + 1) * classes), u * classes);
    out.label[u] = tree.label[t]!;
  }
  return { d: tree.d, classes, nodeCount: m, ...out };
}
