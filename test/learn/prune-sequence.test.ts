import { describe, expect, it } from 'vitest';
import { learnTree, leafCount, pruneSequence, pruneToLeaves } from '../../src/learn/index.js';
import type { Tree } from '../../src/types.js';
import { countsOf, irisData, leavesOf, treeArrays } from './helpers.js';

// Alphas are quotients of integer misclassification counts by the row count, each correctly
// rounded; comparing against hand-computed fractions needs only a few ulps: 1e-15.
const ALPHA_TOL = 1e-15;

/** A tree given by hand: parallel arrays, leaves marked by feature -1 (thresholds on input 0). */
function handTree(nodes: Array<{ split?: [number, number]; counts: [number, number] }>): Tree {
  return {
    d: 1,
    classes: 2,
    nodeCount: nodes.length,
    feature: Int32Array.from(nodes, (n) => (n.split ? 0 : -1)),
    threshold: Float64Array.from(nodes, (_, i) => (nodes[i]!.split ? i : 0)),
    left: Int32Array.from(nodes, (n) => (n.split ? n.split[0] : -1)),
    right: Int32Array.from(nodes, (n) => (n.split ? n.split[1] : -1)),
    counts: Float64Array.from(nodes.flatMap((n) => n.counts)),
    label: Int32Array.from(nodes, (n) => (n.counts[1] > n.counts[0] ? 1 : 0)),
  };
}

describe('pruneSequence', () => {
  it('prunes both weakest links of a hand-checked tree together', () => {
    // R counts misclassified rows (Breiman et al. 1984, §3.3). Leaves [5,0] [0,1] [1,0] [0,3]: R(T) = 0.
    // g(1) = (1 - 0)/(2 - 1) = 1, g(2) = 1, g(0) = (4 - 0)/(4 - 1) = 4/3: nodes 1 and 2 go first at
    // α = 1/10; then g(0) = (4 - 2)/(2 - 1) = 2, α = 2/10.
    const tree = handTree([
      { split: [1, 2], counts: [6, 4] },
      { split: [3, 4], counts: [5, 1] },
      { split: [5, 6], counts: [1, 3] },
      { counts: [5, 0] },
      { counts: [0, 1] },
      { counts: [1, 0] },
      { counts: [0, 3] },
    ]);
    const steps = pruneSequence(tree);
    expect(steps.map((s) => s.leaves)).toEqual([4, 2, 1]);
    expect(steps[0]!.alpha).toBe(0);
    expect(Math.abs(steps[1]!.alpha - 1 / 10)).toBeLessThan(ALPHA_TOL);
    expect(Math.abs(steps[2]!.alpha - 2 / 10)).toBeLessThan(ALPHA_TOL);
    expect(treeArrays(steps[0]!.tree)).toEqual(treeArrays(tree));
    const t1 = steps[1]!.tree;
    expect(treeArrays(t1)).toEqual({
      d: 1, classes: 2, nodeCount: 3, feature: [0, -1, -1], threshold: [0, 0, 0],
      left: [1, -1, -1], right: [2, -1, -1], counts: [6, 4, 5, 1, 1, 3], label: [0, 0, 1],
    });
    expect(treeArrays(steps[2]!.tree)).toMatchObject({ nodeCount: 1, feature: [-1], counts: [6, 4], label: [0] });
  });

  it("first removes splits that remove no misclassification (Breiman's T1, α = 0), then the weakest link", () => {
    // Node 3 [2,1] -> [1,1] + [1,0]: R stays 1, so T1 drops it. In T1 (leaves 1, 3, 4; R = 1):
    // g(2) = (2 - 1)/(2 - 1) = 1 < g(0) = (4 - 1)/(3 - 1) = 1.5, so node 2 goes at α = 1/12,
    // then the root at (4 - 2)/1 / 12 = 2/12.
    const tree = handTree([
      { split: [1, 2], counts: [8, 4] },
      { counts: [6, 0] },
      { split: [3, 4], counts: [2, 4] },
      { split: [5, 6], counts: [2, 1] },
      { counts: [0, 3] },
      { counts: [1, 1] },
      { counts: [1, 0] },
    ]);
    const steps = pruneSequence(tree);
    expect(steps.map((s) => s.leaves)).toEqual([4, 3, 2, 1]);
    expect(steps.map((s) => s.alpha).slice(0, 2)).toEqual([0, 0]);
    expect(Math.abs(steps[2]!.alpha - 1 / 12)).toBeLessThan(ALPHA_TOL);
    expect(Math.abs(steps[3]!.alpha - 2 / 12)).toBeLessThan(ALPHA_TOL);
    expect(Array.from(steps[1]!.tree.feature)).toEqual([0, -1, 0, -1, -1]);
    expect(leavesOf(steps[2]!.tree).map((l) => countsOf(steps[2]!.tree, l))).toEqual([[6, 0], [2, 4]]);
  });

  it('on Iris: α never decreases, leaves strictly decrease, the last tree is the root alone', () => {
    const tree = learnTree(irisData(), {});
    const steps = pruneSequence(tree);
    expect(steps[0]!.leaves).toBe(leafCount(tree));
    expect(treeArrays(steps[0]!.tree)).toEqual(treeArrays(tree));
    for (let i = 1; i < steps.length; i++) {
      expect(steps[i]!.alpha).toBeGreaterThanOrEqual(steps[i - 1]!.alpha);
      expect(steps[i]!.leaves).toBeLessThan(steps[i - 1]!.leaves);
      expect(leafCount(steps[i]!.tree)).toBe(steps[i]!.leaves);
    }
    const last = steps[steps.length - 1]!;
    expect(last.leaves).toBe(1);
    expect(treeArrays(last.tree)).toMatchObject({ nodeCount: 1, feature: [-1], counts: [50, 50, 50] });
  });

  it('on Iris: the last two weakest links are the published splits, at α = 44/150 and 50/150', () => {
    // By hand from the node counts in CHECK-VALUES.md §2: leaves [50,0,0] [0,49,5] [0,1,45] misclassify
    // 6 rows, [50,0,0] [0,50,50] 50, the root 100: α = (50 - 6)/150 and (100 - 50)/150. As relative
    // complexity α/R(root) these are 0.44 and 0.50, the CP column of rpart's printcp for iris
    // (rel error 1.00, 0.50, 0.06) — from memory.
    const steps = pruneSequence(learnTree(irisData(), {}));
    const [three, two, one] = steps.slice(-3);
    expect([three!.leaves, two!.leaves, one!.leaves]).toEqual([3, 2, 1]);
    expect(Math.abs(two!.alpha - 44 / 150)).toBeLessThan(ALPHA_TOL);
    expect(Math.abs(one!.alpha - 50 / 150)).toBeLessThan(ALPHA_TOL);
    expect(leavesOf(three!.tree).map((l) => countsOf(three!.tree, l))).toEqual([[50, 0, 0], [0, 49, 5], [0, 1, 45]]);
  });

  it('does not change the tree it prunes', () => {
    const tree = learnTree(irisData(), {});
    const before = treeArrays(tree);
    const steps = pruneSequence(Object.freeze(tree));
    for (const s of steps) void s.tree;
    expect(treeArrays(tree)).toEqual(before);
  });
});

describe('pruneToLeaves', () => {
  const tree = learnTree(irisData(), {});
  const steps = pruneSequence(tree);

  it('returns the largest tree of the sequence within the leaf limit', () => {
    for (let limit = 1; limit <= steps[0]!.leaves + 1; limit++) {
      const pruned = pruneToLeaves(tree, limit);
      const expected = steps.find((s) => s.leaves <= limit)!;
      expect(leafCount(pruned)).toBeLessThanOrEqual(limit);
      expect(treeArrays(pruned)).toEqual(treeArrays(expected.tree));
    }
  });

  it('keeps only reachable nodes', () => {
    const pruned = pruneToLeaves(tree, 3);
    expect(pruned.nodeCount).toBe(2 * leafCount(pruned) - 1);
  });

  it('refuses a limit below 1', () => {
    expect(() => pruneToLeaves(tree, 0)).toThrowErrorMatchingInlineSnapshot(`[LearnError: pruneToLeaves: maxLeaves is 0, expected an integer >= 1]`);
  });
});
