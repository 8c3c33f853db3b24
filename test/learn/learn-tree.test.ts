import { describe, expect, it } from 'vitest';
import { learnTree, leafCount, leafOf } from '../../src/learn/index.js';
import { LearnError } from '../../src/errors.js';
import { countsOf, giniOf, irisData, leavesOf, mulberry32, treeArrays } from './helpers.js';

// Gini values below are ratios of small integers computed in float64: errors are a few ulps
// (~1e-16); 1e-12 leaves ample headroom while still telling 245/1458 from any other split.
const GINI_TOL = 1e-12;
// Thresholds are float64 midpoints of two data values; CHECK-VALUES.md §2 gives them as decimals
// (2.45, 1.75, ...) which differ from the float64 result by < 1 ulp; 1e-12 guards only that.
const THRESHOLD_TOL = 1e-12;

// Column order of the Iris rows: SL, SW, PL, PW.
const PETAL_LENGTH = 2;
const PETAL_WIDTH = 3;

describe('learnTree on Iris', () => {
  // Expected values: /work/shared/CHECK-VALUES.md §2, exact split search [C], matching rpart's
  // printed iris tree (root Petal.Length < 2.45, then Petal.Width < 1.75) and a public
  // scikit-learn graphviz export (gini 0.666666666667 / 0.168038408779 / 0.0425330812854).
  // CART and Gini: Breiman, Friedman, Olshen & Stone, Classification and Regression Trees, 1984.
  const tree = learnTree(irisData(), {});

  it('splits the root [50,50,50] (Gini 2/3) at petal length <= 2.45, the tie with petal width 0.8 going to the lower input', () => {
    expect(countsOf(tree, 0)).toEqual([50, 50, 50]);
    expect(Math.abs(giniOf(countsOf(tree, 0)) - 2 / 3)).toBeLessThan(GINI_TOL);
    expect(tree.feature[0]).toBe(PETAL_LENGTH);
    expect(Math.abs(tree.threshold[0]! - 2.45)).toBeLessThan(THRESHOLD_TOL);
    expect(countsOf(tree, tree.left[0]!)).toEqual([50, 0, 0]);
    expect(tree.feature[tree.left[0]!]).toBe(-1);
    expect(countsOf(tree, tree.right[0]!)).toEqual([0, 50, 50]);
  });

  it('splits [0,50,50] at petal width <= 1.75 into [0,49,5] (Gini 245/1458) and [0,1,45] (Gini 45/1058)', () => {
    const r = tree.right[0]!;
    expect(Math.abs(giniOf(countsOf(tree, r)) - 1 / 2)).toBeLessThan(GINI_TOL);
    expect(tree.feature[r]).toBe(PETAL_WIDTH);
    expect(Math.abs(tree.threshold[r]! - 1.75)).toBeLessThan(THRESHOLD_TOL);
    const [a, b] = [tree.left[r]!, tree.right[r]!];
    expect(countsOf(tree, a)).toEqual([0, 49, 5]);
    expect(Math.abs(giniOf(countsOf(tree, a)) - 245 / 1458)).toBeLessThan(GINI_TOL);
    expect(countsOf(tree, b)).toEqual([0, 1, 45]);
    expect(Math.abs(giniOf(countsOf(tree, b)) - 45 / 1058)).toBeLessThan(GINI_TOL);
  });

  it('splits the third level at petal length <= 4.95 and <= 4.85 with the published children', () => {
    const r = tree.right[0]!;
    const [a, b] = [tree.left[r]!, tree.right[r]!];
    expect([tree.feature[a], tree.feature[b]]).toEqual([PETAL_LENGTH, PETAL_LENGTH]);
    expect(Math.abs(tree.threshold[a]! - 4.95)).toBeLessThan(THRESHOLD_TOL);
    expect(Math.abs(tree.threshold[b]! - 4.85)).toBeLessThan(THRESHOLD_TOL);
    expect([countsOf(tree, tree.left[a]!), countsOf(tree, tree.right[a]!)]).toEqual([[0, 47, 1], [0, 2, 4]]);
    expect([countsOf(tree, tree.left[b]!), countsOf(tree, tree.right[b]!)]).toEqual([[0, 1, 2], [0, 0, 43]]);
    // scikit-learn export (CHECK-VALUES.md §2): [0,47,1] splits next at petal width <= 1.65
    expect(tree.feature[tree.left[a]!]).toBe(PETAL_WIDTH);
    expect(Math.abs(tree.threshold[tree.left[a]!]! - 1.65)).toBeLessThan(THRESHOLD_TOL);
  });

  it('grows a full tree: an impure leaf only holds rows with identical inputs; labels are majorities, ties to the lower class', () => {
    const data = irisData();
    const leaf = leafOf(tree, data.x, data.n);
    const firstRow = new Map<number, number>();
    for (let i = 0; i < data.n; i++) {
      const c = countsOf(tree, leaf[i]!);
      if (c.filter((v) => v > 0).length < 2) continue;
      const j = firstRow.get(leaf[i]!) ?? i;
      firstRow.set(leaf[i]!, j);
      expect(Array.from(data.x.subarray(i * 4, i * 4 + 4))).toEqual(Array.from(data.x.subarray(j * 4, j * 4 + 4)));
    }
    for (const t of leavesOf(tree)) {
      const c = countsOf(tree, t);
      expect(tree.label[t]).toBe(c.indexOf(Math.max(...c)));
    }
    expect(leafCount(tree)).toBe(leavesOf(tree).length);
  });
});

describe('learnTree options', () => {
  it('stops at maxDepth', () => {
    const t = learnTree(irisData(), { maxDepth: 1 });
    expect(t.nodeCount).toBe(3);
    expect(leafCount(t)).toBe(2);
  });

  it('keeps at least minLeaf rows in every leaf', () => {
    const t = learnTree(irisData(), { minLeaf: 7 });
    for (const leaf of leavesOf(t)) expect(countsOf(t, leaf).reduce((s, v) => s + v, 0)).toBeGreaterThanOrEqual(7);
  });

  it('grows best-first with maxLeaves: the split of [0,49,5] (p·Δi 0.0297) comes before that of [0,1,45] (0.0042)', () => {
    // decreases from CHECK-VALUES.md §2: 0.082390 × 54/150 and 0.013548 × 46/150
    const t3 = learnTree(irisData(), { maxLeaves: 3 });
    expect(leavesOf(t3).map((l) => countsOf(t3, l))).toEqual([[50, 0, 0], [0, 49, 5], [0, 1, 45]]);
    const t4 = learnTree(irisData(), { maxLeaves: 4 });
    expect(leavesOf(t4).map((l) => countsOf(t4, l)).sort()).toEqual([[0, 1, 45], [0, 2, 4], [0, 47, 1], [50, 0, 0]]);
  });

  it('splits [0,1,45] only when minSplitGain is below its weighted decrease 46/150 × 0.013548 = 0.004155', () => {
    const node = (t: ReturnType<typeof learnTree>): number => t.right[t.right[0]!]!;
    const below = learnTree(irisData(), { minSplitGain: 0.0041 });
    const above = learnTree(irisData(), { minSplitGain: 0.0042 });
    expect(countsOf(below, node(below))).toEqual([0, 1, 45]);
    expect(below.feature[node(below)]).toBe(PETAL_LENGTH);
    expect(countsOf(above, node(above))).toEqual([0, 1, 45]);
    expect(above.feature[node(above)]).toBe(-1);
  });

  it('treats a row of weight 2 as two equal rows', () => {
    const rnd = mulberry32(11);
    const n = 60;
    const x = Float64Array.from({ length: n * 2 }, () => rnd());
    const labels = Int32Array.from({ length: n }, (_, i) => (x[2 * i]! + x[2 * i + 1]! > 1 ? 1 : 0) ^ (rnd() < 0.1 ? 1 : 0));
    const weights = Float64Array.from({ length: n }, (_, i) => (i % 3 === 0 ? 2 : 1));
    const dupRows: number[] = [];
    const dupLabels: number[] = [];
    for (let i = 0; i < n; i++) {
      for (let r = 0; r < weights[i]!; r++) {
        dupRows.push(x[2 * i]!, x[2 * i + 1]!);
        dupLabels.push(labels[i]!);
      }
    }
    const weighted = learnTree({ x, n, d: 2, labels, classes: 2, weights }, {});
    const duplicated = learnTree({ x: Float64Array.from(dupRows), n: dupLabels.length, d: 2, labels: Int32Array.from(dupLabels), classes: 2 }, {});
    expect(treeArrays(weighted)).toEqual(treeArrays(duplicated));
  });
});

describe('learnTree determinism and inputs', () => {
  it('gives identical arrays for the same data, and does not change its inputs', () => {
    const data = irisData();
    const before = { x: data.x.slice(), labels: data.labels.slice() };
    const frozen = Object.freeze({ ...data });
    const a = learnTree(frozen, {});
    const b = learnTree(frozen, {});
    expect(treeArrays(a)).toEqual(treeArrays(b));
    expect(data.x).toEqual(before.x);
    expect(data.labels).toEqual(before.labels);
  });

  it('does not depend on row order when no input value repeats', () => {
    const rnd = mulberry32(5);
    const n = 400;
    const d = 3;
    const x = Float64Array.from({ length: n * d }, () => rnd());
    const labels = Int32Array.from({ length: n }, (_, i) => Math.floor(3 * ((x[i * d]! + x[i * d + 2]!) / 2)) % 3);
    const perm = Array.from({ length: n }, (_, i) => i).reverse();
    const px = new Float64Array(n * d);
    perm.forEach((src, dst) => px.set(x.subarray(src * d, src * d + d), dst * d));
    const a = learnTree({ x, n, d, labels, classes: 3 }, { minLeaf: 3 });
    const b = learnTree({ x: px, n, d, labels: Int32Array.from(perm, (i) => labels[i]!), classes: 3 }, { minLeaf: 3 });
    expect(treeArrays(a)).toEqual(treeArrays(b));
  });

  it('gives a single leaf when all labels agree', () => {
    const t = learnTree({ x: new Float64Array([1, 2, 3]), n: 3, d: 1, labels: new Int32Array([2, 2, 2]), classes: 3 }, {});
    expect(treeArrays(t)).toEqual({ d: 1, classes: 3, nodeCount: 1, feature: [-1], threshold: [0], left: [-1], right: [-1], counts: [0, 0, 3], label: [2] });
  });

  it('reports bad data and options with typed errors', () => {
    const ok = { x: new Float64Array([0, 1]), n: 2, d: 1, labels: new Int32Array([0, 1]), classes: 2 };
    expect(() => learnTree({ ...ok, labels: new Int32Array([0, 2]) }, {})).toThrow(LearnError);
    expect(() => learnTree({ ...ok, labels: new Int32Array([0, 2]) }, {})).toThrowErrorMatchingInlineSnapshot(`[LearnError: labelled data: labels[1] is 2, expected 0..1]`);
    expect(() => learnTree({ ...ok, x: new Float64Array([0, 1, 2]) }, {})).toThrowErrorMatchingInlineSnapshot(`[LearnError: labelled data: x has 3 values, expected n × d = 2]`);
    expect(() => learnTree({ ...ok, x: new Float64Array([0, NaN]) }, {})).toThrowErrorMatchingInlineSnapshot(`[LearnError: labelled data: x[1] (row 1, input 0) is NaN, expected a finite number]`);
    expect(() => learnTree({ ...ok, weights: new Float64Array([1, 0]) }, {})).toThrowErrorMatchingInlineSnapshot(`[LearnError: labelled data: weights[1] is 0, expected a finite number > 0]`);
    expect(() => learnTree(ok, { minLeaf: 0 })).toThrowErrorMatchingInlineSnapshot(`[LearnError: learn options: minLeaf is 0, expected an integer >= 1]`);
    expect(() => learnTree(ok, { maxLeaves: 2.5 })).toThrowErrorMatchingInlineSnapshot(`[LearnError: learn options: maxLeaves is 2.5, expected an integer >= 1]`);
  });
});
