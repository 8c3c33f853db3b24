import type { GrowState } from './grow-state.js';

/**
 * Two candidate splits whose criteria differ by less than this relative amount are treated as
 * equally good, so the tie-break (lowest input, then lowest threshold) decides and not the last
 * bit of rounding. With unit weights the criterion is a sum of two correctly rounded quotients
 * of exact integers, so equal splits differ by at most a few ulps (~1e-16 relative); 1e-12 is far
 * above that and far below any real difference between splits of up to 2^26 rows.
 */
export const SPLIT_TIE_REL = 1e-12;

/**
 * A split must lower the node's total Gini impurity by more than this share of it to count as
 * a decrease at all. Guards against splits whose exact decrease is 0 (children with the
 * parent's class mix) showing a rounding-sized positive decrease.
 */
export const SPLIT_GAIN_REL = 1e-12;

/**
 * Finds the best Gini split of node t over all inputs and stores it in the candidate arrays
 * (candFeature = -1 when the node must stay a leaf).
 *
 * Gini index of diversity i(t) = 1 - Σ_k p(k|t)² and split goodness
 * Δi(s, t) = i(t) - p_L i(t_L) - p_R i(t_R): Breiman, Friedman, Olshen & Stone, Classification
 * and Regression Trees, Wadsworth, 1984, ch. 4. With class weights n_k in a node of weight w,
 * w·(1 - i) = Σ_k n_k² / w, so the best split maximises q = S_L / w_L + S_R / w_R with
 * S = Σ_k n_k², and p(t)·Δi = (q - S/w) / rootWeight. S_L and S_R are updated in O(1) as rows move
 * from right to left, so each input costs one linear scan of the node's sorted segment.
 *
 * Candidates lie between consecutive distinct values and leave at least minLeaf rows on each
 * side; the threshold is their midpoint. Ties: the lowest input, then the lowest threshold.
 * Cost: O(d · (end - start)). No allocation.
 */
export function findBestSplitInPlace(s: GrowState, t: number): void {
  const { n, d, classes, vals, labs, weights, order, leftCounts, counts } = s;
  const { minLeaf, maxDepth, minSplitGain } = s.options;
  const start = s.start[t]!;
  const end = s.end[t]!;
  s.candFeature[t] = -1;
  if (s.depth[t]! >= maxDepth || end - start < 2 * minLeaf) return;
  const cBase = t * classes;
  let w = 0;
  let sq = 0;
  let present = 0;
  for (let k = 0; k < classes; k++) {
    const c = counts[cBase + k]!;
    w += c;
    sq += c * c;
    if (c > 0) present++;
  }
  if (present < 2) return;
  const lo = start + minLeaf;
  const hi = end - minLeaf;
  let bestQ = -Infinity;
  let bestF = -1;
  let bestP = -1;
  for (let f = 0; f < d; f++) {
    const oBase = f * n;
    leftCounts.fill(0);
    let wL = 0;
    let sqL = 0;
    let sqR = sq;
    let prev = 0;
    for (let p = start; p <= hi; p++) {
      const v = vals[oBase + p]!;
      if (p >= lo && v > prev) {
        const q = sqL / wL + sqR / (w - wL);
        if (q > bestQ + SPLIT_TIE_REL * bestQ) {
          bestQ = q;
          bestF = f;
          bestP = p;
        }
      }
      if (p === hi) break;
      // move row i from the right child to the left one
      const k = labs[oBase + p]!;
      const wi = weights === null ? 1 : weights[order[oBase + p]!]!;
      const cL = leftCounts[k]!;
      sqL += wi * (2 * cL + wi);
      sqR += wi * (wi - 2 * (counts[cBase + k]! - cL));
      leftCounts[k] = cL + wi;
      wL += wi;
      prev = v;
    }
  }
  if (bestF < 0) return;
  const parentQ = sq / w;
  const gain = (bestQ - parentQ) / s.rootWeight;
  if (!(bestQ - parentQ > SPLIT_GAIN_REL * parentQ) || !(gain > minSplitGain)) return;
  const a = vals[bestF * n + bestP - 1]!;
  const b = vals[bestF * n + bestP]!;
  s.candFeature[t] = bestF;
  s.candPos[t] = bestP;
  s.candThreshold[t] = midpoint(a, b);
  s.candGain[t] = gain;
}

/** A threshold t with a <= t < b for a < b: the midpoint, guarded against overflow and rounding up to b. */
function midpoint(a: number, b: number): number {
  let m = (a + b) / 2;
  if (!Number.isFinite(m)) m = a / 2 + b / 2;
  return m < b ? m : a;
}
