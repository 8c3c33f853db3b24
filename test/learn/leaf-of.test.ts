import { describe, expect, it } from 'vitest';
import { leafCount, leafOf, predictTree } from '../../src/learn/index.js';
import type { Tree } from '../../src/types.js';

// Hand-built: root splits input 1 at 0.5; its right child splits input 0 at -2.
// Left of root: leaf 1 (class 2); right child 2 -> leaf 3 (class 0), leaf 4 (class 1).
const tree: Tree = {
  d: 2,
  classes: 3,
  nodeCount: 5,
  feature: Int32Array.of(1, -1, 0, -1, -1),
  threshold: Float64Array.of(0.5, 0, -2, 0, 0),
  left: Int32Array.of(1, -1, 3, -1, -1),
  right: Int32Array.of(2, -1, 4, -1, -1),
  counts: Float64Array.of(4, 3, 5, 0, 0, 5, 4, 3, 0, 4, 0, 0, 0, 3, 0),
  label: Int32Array.of(2, 2, 0, 0, 1),
};

describe('leafOf and predictTree', () => {
  it('go left when x <= threshold, right otherwise, down to a leaf', () => {
    // rows: on the root threshold (left), just above it with x0 on the inner threshold (left), far right
    const x = Float64Array.of(9, 0.5, -2, 0.5000001, -1.9, 7);
    expect(Array.from(leafOf(tree, x, 3))).toEqual([1, 3, 4]);
    expect(Array.from(predictTree(tree, x, 3))).toEqual([2, 0, 1]);
  });

  it('count leaves', () => {
    expect(leafCount(tree)).toBe(3);
  });

  it('handle zero rows', () => {
    expect(Array.from(predictTree(tree, new Float64Array(0), 0))).toEqual([]);
  });

  it('refuse inputs of the wrong size or NaN', () => {
    expect(() => leafOf(tree, new Float64Array(3), 2)).toThrowErrorMatchingInlineSnapshot(`[LearnError: tree inputs: x has 3 values for n = 2 rows, expected n × d = 2 × 2]`);
    expect(() => predictTree(tree, Float64Array.of(NaN, 1), 1)).toThrowErrorMatchingInlineSnapshot(`[LearnError: tree inputs: x[0] (row 0, input 0) is NaN, expected a number]`);
  });
});
