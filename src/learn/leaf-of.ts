import type { Tree } from '../types.js';
import { LearnError } from '../errors.js';

/**
 * The leaf each row falls into: from the root, go to `left` when x[feature] <= threshold, else
 * to `right`, until a node with feature -1. O(n · depth), no allocation besides the result.
 * @param x row-major n × tree.d inputs, in the units the tree was learned in; not changed
 * @returns node index of each row's leaf
 * @throws {LearnError} `LEARN_BAD_DATA` when x's size is not n × tree.d or a value is NaN
 */
export function leafOf(tree: Tree, x: Float64Array, n: number): Int32Array {
  const { d, feature, threshold, left, right } = tree;
  if (!(Number.isInteger(n) && n >= 0) || x.length !== n * d) {
    throw new LearnError('LEARN_BAD_DATA', `tree inputs: x has ${x.length} values for n = ${n} rows, expected n × d = ${n} × ${d}`);
  }
  const out = new Int32Array(n);
  for (let r = 0; r < n; r++) {
    const base = r * d;
    let t = 0;
    let f = feature[0]!;
    while (f >= 0) {
      const v = x[base + f]!;
      // NaN would silently take the right branch: refuse it instead
      if (v !== v) throw new LearnError('LEARN_BAD_DATA', `tree inputs: x[${base + f}] (row ${r}, input ${f}) is NaN, expected a number`);
      t = v <= threshold[t]! ? left[t]! : right[t]!;
      f = feature[t]!;
    }
    out[r] = t;
  }
  return out;
}
