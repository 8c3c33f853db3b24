import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { mergeRules } from '../../src/rules/merge-rules.js';
import { tableLabel } from '../../src/rules/table-label.js';
import { treeToRules } from '../../src/rules/tree-to-rules.js';
import type { Rule } from '../../src/types.js';
import { makeInputs, makeTree, predict, type TreeSpec } from './make-tree.js';

const mined = { kind: 'mined' } as const;
const rule = (id: string, box: [number, number][], allowed: number[]): Rule => ({ id, box, allowed, origin: mined });

describe('mergeRules', () => {
  it('merges two boxes that touch on the one input where they differ', () => {
    const merged = mergeRules([rule('a', [[1, 2], [0, 1]], [0]), rule('b', [[0, 1], [0, 1]], [0])]);
    expect(merged).toEqual([rule('R1', [[0, 2], [0, 1]], [0])]);
  });

  it('leaves boxes with a gap between them apart', () => {
    const rules = [rule('a', [[0, 1], [0, 1]], [0]), rule('b', [[1.5, 2], [0, 1]], [0])];
    expect(mergeRules(rules).map((r) => r.box)).toEqual([
      [[0, 1], [0, 1]],
      [[1.5, 2], [0, 1]],
    ]);
  });

  it('leaves neighbours with different advisories apart', () => {
    const rules = [rule('a', [[0, 1], [0, 1]], [0]), rule('b', [[1, 2], [0, 1]], [1])];
    expect(mergeRules(rules)).toHaveLength(2);
  });

  it('leaves boxes that differ on two inputs apart, even when they touch at a corner', () => {
    const rules = [rule('a', [[0, 1], [0, 1]], [0]), rule('b', [[1, 2], [1, 2]], [0])];
    expect(mergeRules(rules)).toHaveLength(2);
  });

  it('merges an L-shape once, since the union of all three is not a box', () => {
    // A = [0,1]x[0,1], B = [1,2]x[0,1], C = [0,1]x[1,2]. Canonical order A, C, B: A+C first.
    const rules = [rule('B', [[1, 2], [0, 1]], [0]), rule('A', [[0, 1], [0, 1]], [0]), rule('C', [[0, 1], [1, 2]], [0])];
    expect(mergeRules(rules).map((r) => r.box)).toEqual([
      [[0, 1], [0, 2]],
      [[1, 2], [0, 1]],
    ]);
  });

  it('merges a chain of slabs into one box, in any input order', () => {
    const slabs = [3, 0, 2, 1].map((k) => rule(`s${k}`, [[k, k + 1], [0, 5]], [2, 3]));
    expect(mergeRules(slabs)).toEqual([rule('R1', [[0, 4], [0, 5]], [2, 3])]);
  });

  it('merges a 2 x 2 block into one box in two rounds', () => {
    const cells = [
      rule('a', [[0, 1], [0, 1]], [1]),
      rule('b', [[1, 2], [1, 2]], [1]),
      rule('c', [[1, 2], [0, 1]], [1]),
      rule('d', [[0, 1], [1, 2]], [1]),
    ];
    expect(mergeRules(cells).map((r) => r.box)).toEqual([[[0, 2], [0, 2]]]);
  });

  it('does not change its input', () => {
    const rules = Object.freeze([Object.freeze(rule('a', [[1, 2], [0, 1]], [0])), Object.freeze(rule('b', [[0, 1], [0, 1]], [0]))]);
    mergeRules(rules);
    expect(rules.map((r) => r.id)).toEqual(['a', 'b']);
  });

  it('keeps every point of a tree table on the same advisory and leaves nothing mergeable', () => {
    const inputs = makeInputs([
      [0, 10],
      [0, 4],
    ]);
    // integer thresholds so neighbouring leaves share bounds exactly; labels from 3 classes
    const leaf = fc.record({ leaf: fc.integer({ min: 0, max: 2 }) });
    const spec = (depth: number): fc.Arbitrary<TreeSpec> =>
      depth === 0
        ? leaf
        : fc.oneof(
            leaf,
            fc.record({ f: fc.integer({ min: 0, max: 1 }), t: fc.integer({ min: 1, max: 9 }), l: spec(depth - 1), r: spec(depth - 1) }),
          );
    // cell centres: off every integer threshold, so each lies in exactly one leaf's box
    const grid = new Float64Array(10 * 4 * 2);
    for (let i = 0; i < 10; i++) for (let j = 0; j < 4; j++) grid.set([i + 0.5, j + 0.5], (i * 4 + j) * 2);
    fc.assert(
      fc.property(spec(5), (s) => {
        const tree = makeTree(s, 2, 3);
        const rules = treeToRules(tree, inputs);
        const merged = mergeRules(rules);
        expect(merged.length).toBeLessThanOrEqual(rules.length);
        expect(Array.from(tableLabel(merged, grid, 40, 2))).toEqual(Array.from(predict(tree, grid, 40)));
        expect(mergeRules(merged)).toEqual(merged);
      }),
      { seed: 20240611, numRuns: 300 },
    );
  });
});
