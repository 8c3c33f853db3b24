import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { leafOf, learnTree, pruneSequence } from '../../src/learn/index.js';
import type { Tree } from '../../src/types.js';
import { countsOf } from './helpers.js';

// Small data with many repeated values (inputs drawn from 0..4) so ties are the common case.
const smallData = fc
  .record({ n: fc.integer({ min: 1, max: 40 }), d: fc.integer({ min: 1, max: 3 }), classes: fc.integer({ min: 1, max: 4 }), seed: fc.integer() })
  .chain(({ n, d, classes }) =>
    fc.record({
      n: fc.constant(n),
      d: fc.constant(d),
      classes: fc.constant(classes),
      x: fc.array(fc.integer({ min: 0, max: 4 }), { minLength: n * d, maxLength: n * d }),
      labels: fc.array(fc.integer({ min: 0, max: classes - 1 }), { minLength: n, maxLength: n }),
      minLeaf: fc.integer({ min: 1, max: 4 }),
    }),
  )
  .map((r) => ({ ...r, x: Float64Array.from(r.x), labels: Int32Array.from(r.labels) }));

function internalNodes(tree: Tree): number[] {
  return Array.from(tree.feature.keys()).filter((t) => tree.feature[t]! >= 0);
}

describe('learnTree invariants (fast-check)', () => {
  it('children partition their parent: counts add up, thresholds lie strictly between the two sides, minLeaf holds', () => {
    fc.assert(
      fc.property(smallData, ({ x, n, d, labels, classes, minLeaf }) => {
        const tree = learnTree({ x, n, d, labels, classes }, { minLeaf });
        const leaf = leafOf(tree, x, n);
        // every row's leaf counts its class: recount rows per leaf and compare with stored counts
        const recount = new Map<number, number[]>();
        for (let i = 0; i < n; i++) {
          const c = recount.get(leaf[i]!) ?? new Array<number>(classes).fill(0);
          c[labels[i]!]!++;
          recount.set(leaf[i]!, c);
        }
        for (const [t, c] of recount) {
          expect(countsOf(tree, t)).toEqual(c);
          expect(c.reduce((s, v) => s + v, 0)).toBeGreaterThanOrEqual(Math.min(minLeaf, n));
        }
        // walk every row down, noting the largest value sent left and the smallest sent right
        const maxLeft = new Float64Array(tree.nodeCount).fill(-Infinity);
        const minRight = new Float64Array(tree.nodeCount).fill(Infinity);
        for (let i = 0; i < n; i++) {
          for (let t = 0; tree.feature[t]! >= 0; ) {
            const v = x[i * d + tree.feature[t]!]!;
            if (v <= tree.threshold[t]!) {
              maxLeft[t] = Math.max(maxLeft[t]!, v);
              t = tree.left[t]!;
            } else {
              minRight[t] = Math.min(minRight[t]!, v);
              t = tree.right[t]!;
            }
          }
        }
        for (const t of internalNodes(tree)) {
          // both sides non-empty and the threshold is the midpoint of the values either side
          expect(maxLeft[t]!).toBeLessThan(minRight[t]!);
          expect(tree.threshold[t]).toBe((maxLeft[t]! + minRight[t]!) / 2);
          const sum = countsOf(tree, tree.left[t]!).map((v, k) => v + countsOf(tree, tree.right[t]!)[k]!);
          expect(sum).toEqual(countsOf(tree, t));
        }
      }),
      { numRuns: 200, seed: 20240601 },
    );
  });

  it('a full tree leaves a node impure only when no split changes its class mix (no Gini decrease)', () => {
    // The Gini index is strictly concave in the class proportions (Breiman et al. 1984, ch. 4),
    // so a split lowers it unless both children keep the parent's proportions exactly.
    fc.assert(
      fc.property(smallData, ({ x, n, d, labels, classes }) => {
        const tree = learnTree({ x, n, d, labels, classes }, {});
        const leaf = leafOf(tree, x, n);
        const rowsAt = new Map<number, number[]>();
        for (let i = 0; i < n; i++) rowsAt.set(leaf[i]!, [...(rowsAt.get(leaf[i]!) ?? []), i]);
        for (const [t, rows] of rowsAt) {
          const parent = countsOf(tree, t);
          if (parent.filter((v) => v > 0).length < 2) continue;
          for (let f = 0; f < d; f++) {
            for (const cut of new Set(rows.map((i) => x[i * d + f]!))) {
              const left = new Array<number>(classes).fill(0);
              for (const i of rows) if (x[i * d + f]! <= cut) left[labels[i]!]!++;
              const wl = left.reduce((a, b) => a + b, 0);
              // integer counts: left_k · W = parent_k · w_L exactly when proportions agree
              for (let k = 0; k < classes; k++) expect(left[k]! * rows.length).toBe(parent[k]! * wl);
            }
          }
        }
      }),
      { numRuns: 200, seed: 20240602 },
    );
  });

  it('pruning sequences have non-decreasing α, strictly fewer leaves each step, and end at the root', () => {
    fc.assert(
      fc.property(smallData, ({ x, n, d, labels, classes, minLeaf }) => {
        const steps = pruneSequence(learnTree({ x, n, d, labels, classes }, { minLeaf }));
        for (let i = 1; i < steps.length; i++) {
          expect(steps[i]!.alpha).toBeGreaterThanOrEqual(steps[i - 1]!.alpha);
          expect(steps[i]!.leaves).toBeLessThan(steps[i - 1]!.leaves);
        }
        expect(steps[steps.length - 1]!.tree.nodeCount).toBe(1);
      }),
      { numRuns: 200, seed: 20240603 },
    );
  });
});
