import { describe, expect, it } from 'vitest';
import { learnTree, predictTree } from '../../src/learn/index.js';
import type { Tree } from '../../src/types.js';
import { mulberry32 } from './helpers.js';
import { rowsOf, trainMlCart, type MlCartNode } from './ml-cart-reference.js';

// Reference: npm ml-cart 2.1.1 (src/TreeNode.js, read in node_modules). Its conventions, and
// how ours meet them on tie-free continuous data:
// - candidate thresholds are means of consecutive sorted values where the label changes;
//   ours are midpoints of all consecutive distinct values. The Gini optimum lies at such a
//   label change, so the best split is the same unless another candidate ties with it exactly.
// - rows go left when x < value (ours: x <= threshold); no training or grid value equals a
//   threshold, so the two rules agree.
// - among equal gains ml-cart keeps the first strictly greater one in its own float arithmetic
//   (probabilities summed as 1/n steps); ours treats equal splits as ties broken by the lowest
//   input, then the lowest threshold. When two different splits have the exact same Gini gain
//   (common in small nodes of noisy data), rounding decides for ml-cart and the tie-break for us,
//   so exact agreement is impossible there. Those seeds check instead that every place where the
//   trees part is such an exact tie, verified in integer arithmetic, resolved by our rule.

/** Seeded data: n ≤ 300 rows, d 2–4 continuous inputs in [0,1), 2–4 classes, no repeated value. */
function dataset(seed: number, noisy: boolean): { x: Float64Array; n: number; d: number; labels: Int32Array; classes: number } {
  const rnd = mulberry32(seed);
  const n = 100 + Math.floor(rnd() * 201);
  const d = 2 + Math.floor(rnd() * 3);
  const classes = 2 + Math.floor(rnd() * 3);
  // labels: nearest of `classes` random centres (oblique Voronoi boundaries), or uniform noise
  const centres = Array.from({ length: classes * d }, () => rnd());
  const x = Float64Array.from({ length: n * d }, () => rnd());
  const labels = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    let best = Infinity;
    for (let c = 0; c < classes; c++) {
      let s = 0;
      for (let f = 0; f < d; f++) s += (x[i * d + f]! - centres[c * d + f]!) ** 2;
      if (s < best) [best, labels[i]] = [s, c];
    }
    if (noisy) labels[i] = Math.floor(rnd() * classes);
  }
  expect(new Set(x).size).toBe(x.length);
  return { x, n, d, labels, classes };
}

/** A regular grid of held-out points: G^d cell centres of the unit cube. */
function grid(d: number): { x: Float64Array; m: number } {
  const g = d === 2 ? 50 : d === 3 ? 16 : 8;
  const m = g ** d;
  const x = new Float64Array(m * d);
  for (let j = 0; j < m; j++) {
    for (let f = 0, r = j; f < d; f++, r = Math.floor(r / g)) x[j * d + f] = ((r % g) + 0.5) / g;
  }
  return { x, m };
}

/** Σ_k n_k² over w: numerator and denominator of one child's share of q = S_L/w_L + S_R/w_R. */
function qFraction(rows: number[], labels: Int32Array, classes: number): [bigint, bigint] {
  const c = new Array<number>(classes).fill(0);
  for (const i of rows) c[labels[i]!]!++;
  return [BigInt(c.reduce((s, v) => s + v * v, 0)), BigInt(rows.length)];
}

/** q of a split as an exact fraction [num, den]. */
function splitQ(rows: number[], x: Float64Array, d: number, labels: Int32Array, classes: number, f: number, t: number): [bigint, bigint] {
  const [sl, wl] = qFraction(rows.filter((i) => x[i * d + f]! <= t), labels, classes);
  const [sr, wr] = qFraction(rows.filter((i) => x[i * d + f]! > t), labels, classes);
  return [sl * wr + sr * wl, wl * wr];
}

/** Walks both trees together; at each node where they part, checks it is an exact tie won by the lower (input, threshold). */
function partingPoints(ours: Tree, ref: MlCartNode, data: ReturnType<typeof dataset>): number {
  const { x, d, labels, classes } = data;
  let parted = 0;
  const todo: Array<[number, MlCartNode, number[]]> = [[0, ref, Array.from({ length: data.n }, (_, i) => i)]];
  while (todo.length > 0) {
    const [t, r, rows] = todo.pop()!;
    const refSplits = r.left !== undefined && r.right !== undefined;
    const f = ours.feature[t]!;
    const th = ours.threshold[t]!;
    expect(f >= 0).toBe(refSplits);
    if (f < 0) continue;
    if (r.splitColumn !== f || r.splitValue !== th) {
      parted++;
      const [a, b] = splitQ(rows, x, d, labels, classes, f, th);
      const [c, e] = splitQ(rows, x, d, labels, classes, r.splitColumn!, r.splitValue!);
      expect(a * e).toBe(c * b);
      expect(f < r.splitColumn! || (f === r.splitColumn && th < r.splitValue!)).toBe(true);
      continue;
    }
    todo.push([ours.left[t]!, r.left!, rows.filter((i) => x[i * d + f]! <= th)]);
    todo.push([ours.right[t]!, r.right!, rows.filter((i) => x[i * d + f]! > th)]);
  }
  return parted;
}

function compare(seed: number, noisy: boolean): { agreement: number; parted: number } {
  const data = dataset(seed, noisy);
  const ours = learnTree(data, {});
  const ref = trainMlCart(data.x, data.n, data.d, data.labels);
  const g = grid(data.d);
  const thresholds = new Set(ours.threshold);
  expect(Array.from(g.x).some((v) => thresholds.has(v))).toBe(false);
  const a = predictTree(ours, g.x, g.m);
  const b = ref.predict(rowsOf(g.x, g.m, data.d));
  let same = 0;
  for (let j = 0; j < g.m; j++) if (a[j] === b[j]) same++;
  return { agreement: same / g.m, parted: partingPoints(ours, ref.root, data) };
}

describe('learnTree against ml-cart (full trees, Gini)', () => {
  for (const seed of [1, 2, 3, 4, 5, 6, 7, 8]) {
    it(`builds the same tree and predicts the same classes on a held-out grid (seed ${seed}, Voronoi labels)`, () => {
      expect(compare(seed, false)).toEqual({ agreement: 1, parted: 0 });
    });
  }

  it('parts from ml-cart only at exact Gini ties, which go to the lower input and threshold (noisy labels)', () => {
    const results = Array.from({ length: 16 }, (_, i) => 101 + i).map((seed) => compare(seed, true));
    const parted = results.reduce((s, r) => s + r.parted, 0);
    const agreement = results.reduce((s, r) => s + r.agreement, 0) / results.length;
    // where the trees never part, predictions must match exactly
    for (const r of results) if (r.parted === 0) expect(r.agreement).toBe(1);
    // Measured on these 16 seeds: 4 partings in 3 seeds, all exact ties (checked above); mean
    // grid agreement 0.991, lowest seed 0.928. A parting relabels at most one node's box, so the
    // mean stays high; 0.95 leaves room while a real difference in split search, which would
    // part the trees at many nodes and fail the tie checks, cannot pass.
    expect(parted).toBeGreaterThan(0); // the tie branch above was exercised
    expect(agreement).toBeGreaterThan(0.95);
  });
});
