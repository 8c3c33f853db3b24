import type { Tree } from '../types.js';
import { leafOf } from './leaf-of.js';

/**
 * The tree's class for each row: the majority label of the row's leaf (see leafOf).
 * @param x row-major n × tree.d inputs; not changed
 * @throws {LearnError} `LEARN_BAD_DATA` as leafOf
 */
export function predictTree(tree: Tree, x: Float64Array, n: number): Int32Array {
  const leaves = leafOf(tree, x, n);
  const out = new Int32Array(n);
  for (let r = 0; r < n; r++) out[r] = tree.label[leaves[r]!]!;
  return out;
}
