import { ToolError } from '../errors.js';
import type { InputSpec, Tree } from '../types.js';
import { bracketingMultiples, readableSteps } from './readable-steps.js';

/**
 * Default budget for `roundThresholds`: the share of samples whose agreement with their label
 * may be lost, in total over all nodes, by making thresholds readable. 0.001 = 0.1 percentage
 * point of fidelity: small against the ≥ 99 % fidelity target in DESIGN.md, large enough that
 * most thresholds become 1-2-5 values. Choice of this project, no source.
 */
export const DEFAULT_ROUNDING_TOLERANCE = 0.001;

/**
 * Finest step tried, as a fraction of the input's range (max - min). Past about six significant
 * digits of the range a value is no longer easier to read than the learned one, so the search
 * stops there and keeps the learned threshold.
 */
export const READABLE_STEP_MIN_FRACTION = 1e-6;

/** Labelled points the rounded tree must keep agreeing with (usually the training samples). */
export interface RoundingSamples {
  /** n × d, row-major, float64, scenario units. */
  readonly x: Float64Array;
  readonly n: number;
  readonly d: number;
  /** The network's advisory per sample. */
  readonly labels: Int32Array;
}

export interface RoundThresholdsOptions {
  /** Largest total fidelity loss allowed, as a share of the samples (0.001 = 0.1 point). */
  readonly tolerance: number;
}

/**
 * Replaces learned thresholds by readable ones: for each internal node, in preorder (a node before
 * its children, left subtree first), the coarsest 1-2-5 step (see `readableSteps`) having a
 * multiple next to the threshold that lies strictly inside the range of the node's samples on
 * that feature and keeps the accumulated fidelity loss within the tolerance. Within a step the
 * nearer multiple is tried first. If no step down to `READABLE_STEP_MIN_FRACTION` of the input's
 * range qualifies, the learned value is kept. A node no sample reaches (after its ancestors were
 * rounded) costs nothing to change: it gets the coarsest value strictly inside its region.
 *
 * Fidelity is the share of samples whose leaf label equals their own label; the loss is measured
 * against the unrounded tree, net (a change that fixes samples refunds budget). Because the tree
 * itself is changed, the leaves still partition the domain, and "strictly inside the node's data"
 * keeps every leaf non-empty. Only samples between the old and the new threshold change path, so
 * each candidate is evaluated on the node's samples alone, re-routing just those that move.
 *
 * Returns a new tree with the same shape and leaf labels; `counts` are recounted from `samples`
 * under the new thresholds (so a leaf label can, rarely, differ from its new majority).
 *
 * @throws ToolError `RULES_TREE_SHAPE` on mismatched sizes, `RULES_OPTION` on a bad tolerance
 * Cost: O(n · depth · steps) for n samples; 200,000 samples × 5 inputs on a 127-split tree took
 * 0.4–0.6 s on the 2-core project machine.
 */
export function roundThresholds(
  tree: Tree,
  samples: RoundingSamples,
  inputs: readonly InputSpec[],
  options: RoundThresholdsOptions = { tolerance: DEFAULT_ROUNDING_TOLERANCE },
): Tree {
  const { x, n, d, labels } = samples;
  if (tree.d !== d || inputs.length !== d || x.length < n * d || labels.length < n) {
    throw new ToolError('RULES_TREE_SHAPE', `tree has ${tree.d} inputs, samples ${d}, scenario ${inputs.length}`);
  }
  if (!(options.tolerance >= 0 && options.tolerance <= 1)) {
    throw new ToolError('RULES_OPTION', `rounding tolerance ${options.tolerance} is not a share in [0, 1]`);
  }
  const { feature, left, right, label } = tree;
  const thr = Float64Array.from(tree.threshold);
  const leafOf = (i: number, start: number): number => {
    let node = start;
    while (feature[node]! >= 0) node = x[i * d + feature[node]!]! <= thr[node]! ? left[node]! : right[node]!;
    return node;
  };
  const correct = new Uint8Array(n);
  for (let i = 0; i < n; i++) correct[i] = label[leafOf(i, 0)] === labels[i] ? 1 : 0;
  const budget = options.tolerance * n;
  let lost = 0;

  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  // values of the current node's feature, laid out like `order`, so candidate scans read memory in sequence
  const values = new Float64Array(n);
  // net gain in agreeing samples if node's threshold became c; applies the change when `apply`
  const change = (node: number, a: number, b: number, c: number, apply: boolean): number => {
    const t = thr[node]!;
    const lo = Math.min(t, c);
    const hi = Math.max(t, c);
    const target = c > t ? left[node]! : right[node]!;
    let gain = 0;
    for (let p = a; p < b; p++) {
      const v = values[p]!;
      if (!(v > lo && v <= hi)) continue;
      const i = order[p]!;
      const now = label[leafOf(i, target)] === labels[i] ? 1 : 0;
      gain += now - correct[i]!;
      if (apply) correct[i] = now;
    }
    if (apply) thr[node] = c;
    return gain;
  };

  // each node's region (domain cut by its ancestors' tests), used when no sample reaches it
  const regionLo = new Float64Array(tree.nodeCount * d);
  const regionHi = new Float64Array(tree.nodeCount * d);
  for (let f = 0; f < d && tree.nodeCount > 0; f++) [regionLo[f], regionHi[f]] = [inputs[f]!.min, inputs[f]!.max];
  const stack: number[] = tree.nodeCount > 0 ? [0, 0, n] : [];
  while (stack.length > 0) {
    const b = stack.pop()!;
    const a = stack.pop()!;
    const node = stack.pop()!;
    const f = feature[node]!;
    if (f < 0) continue;
    let lo = Infinity;
    let hi = -Infinity;
    for (let p = a; p < b; p++) {
      const v = x[order[p]! * d + f]!;
      values[p] = v;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    if (a === b) [lo, hi] = [regionLo[node * d + f]!, regionHi[node * d + f]!];
    const finest = (inputs[f]!.max - inputs[f]!.min) * READABLE_STEP_MIN_FRACTION;
    search: for (const step of readableSteps(hi - lo, finest)) {
      for (const c of bracketingMultiples(thr[node]!, step)) {
        if (c === thr[node]) break search;
        if (!(c > lo && c < hi)) continue;
        const gain = change(node, a, b, c, false);
        if (lost - gain <= budget) {
          change(node, a, b, c, true);
          lost -= gain;
          break search;
        }
      }
    }
    // partition the node's samples by the final threshold, then visit left before right
    let m = a;
    for (let p = a; p < b; p++) {
      if (values[p]! <= thr[node]!) {
        const i = order[p]!;
        order[p] = order[m]!;
        order[m++] = i;
      }
    }
    for (const [child, side] of [[left[node]!, 1], [right[node]!, 0]] as const) {
      regionLo.copyWithin(child * d, node * d, node * d + d);
      regionHi.copyWithin(child * d, node * d, node * d + d);
      if (side === 1) regionHi[child * d + f] = Math.min(regionHi[node * d + f]!, thr[node]!);
      else regionLo[child * d + f] = Math.max(regionLo[node * d + f]!, thr[node]!);
    }
    stack.push(right[node]!, m, b, left[node]!, a, m);
  }
  return { ...tree, threshold: thr, counts: recount(tree, thr, samples) };
}

/** Samples of each class reaching each node under thresholds `thr` (labels outside 0..classes-1 skipped). */
function recount(tree: Tree, thr: Float64Array, samples: RoundingSamples): Float64Array {
  const { x, n, d, labels } = samples;
  const k = tree.classes;
  const counts = new Float64Array(tree.nodeCount * k);
  if (tree.nodeCount === 0) return counts;
  for (let i = 0; i < n; i++) {
    const c = labels[i]!;
    if (c < 0 || c >= k) continue;
    let node = 0;
    for (;;) {
      counts[node * k + c] += 1;
      const f = tree.feature[node]!;
      if (f < 0) break;
      node = x[i * d + f]! <= thr[node]! ? tree.left[node]! : tree.right[node]!;
    }
  }
  return counts;
}
