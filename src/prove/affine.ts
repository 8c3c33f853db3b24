import type { AffineLayer } from './network.js';
import { NOISE_FLOOR } from './float-error.js';

/**
 * Builds and fuses affine layers together with their float32 error bounds.
 *
 * An affine step maps x̂ to ŷ with ŷ = W x̂ + b + δ, |δ| ≤ E|x̂| + c (entrywise, E ≥ 0).
 * Composing (W1, b1, E1, c1) then (W2, b2, E2, c2):
 *   ŷ2 = W2 W1 x̂ + (W2 b1 + b2) + W2 δ1 + δ2, and |ŷ1| ≤ (|W1| + E1)|x̂| + |b1| + c1, so
 *   E = |W2| E1 + E2 (|W1| + E1),   c = |W2| c1 + E2 (|b1| + c1) + c2,
 * plus 2^-40 of |W2||W1| and |W2||b1| for the float64 rounding of the fused product
 * (at most n·2^-53 ≤ 2^-41 of those sums for n < 4096). This is the running error analysis of
 * Higham (Accuracy and Stability of Numerical Algorithms, SIAM, 2002, §3.1) applied per layer.
 */
export interface AffineDraft {
  readonly inSize: number;
  readonly outSize: number;
  readonly weights: Float64Array;
  readonly bias: Float64Array;
  /** outSize × inSize, E above. */
  readonly errorWeights: Float64Array;
  readonly errorConst: Float64Array;
  readonly nodes: readonly string[];
}

const PRODUCT_ROUNDING = 2 ** -40;

/**
 * An affine step from explicit parts; the error bound is `errorWeights·|x| + konst`.
 * @param weights outSize × inSize row-major (copied)
 * @param errorWeights outSize × inSize, non-negative (copied)
 */
export function affineDraft(
  inSize: number,
  outSize: number,
  weights: ArrayLike<number>,
  bias: ArrayLike<number>,
  errorWeights: ArrayLike<number>,
  konst: ArrayLike<number>,
  nodes: readonly string[],
): AffineDraft {
  return {
    inSize,
    outSize,
    weights: Float64Array.from(weights),
    bias: Float64Array.from(bias),
    errorWeights: Float64Array.from(errorWeights),
    errorConst: Float64Array.from(konst),
    nodes,
  };
}

/** A diagonal step y_j = d_j x_j + b_j with error bound scale_j·|x_j| + konst_j. */
export function diagonalDraft(
  d: ArrayLike<number>,
  b: ArrayLike<number>,
  scale: ArrayLike<number>,
  konst: ArrayLike<number>,
  nodes: readonly string[],
): AffineDraft {
  const n = d.length;
  const w = new Float64Array(n * n);
  const e = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    w[j * n + j] = d[j]!;
    e[j * n + j] = scale[j]!;
  }
  return affineDraft(n, n, w, b, e, konst, nodes);
}

/** `second ∘ first`, with the composed error bound derived above. */
export function composeAffine(first: AffineDraft, second: AffineDraft): AffineDraft {
  const n0 = first.inSize;
  const n1 = first.outSize;
  const n2 = second.outSize;
  // |W1| + E1 and |b1| + c1: bounds on |ŷ1| per unit of |x̂| and in total
  const reach = new Float64Array(n1 * n0);
  for (let t = 0; t < n1 * n0; t++) reach[t] = Math.abs(first.weights[t]!) + first.errorWeights[t]!;
  const w = new Float64Array(n2 * n0);
  const b = new Float64Array(n2);
  const e = new Float64Array(n2 * n0);
  const c = new Float64Array(n2);
  for (let j = 0; j < n2; j++) {
    let bj = second.bias[j]!;
    let cj = second.errorConst[j]!;
    for (let k = 0; k < n1; k++) {
      const w2 = second.weights[j * n1 + k]!;
      const e2 = second.errorWeights[j * n1 + k]!;
      const aw = Math.abs(w2);
      if (w2 !== 0) {
        bj += w2 * first.bias[k]!;
        cj += aw * first.errorConst[k]! + PRODUCT_ROUNDING * aw * Math.abs(first.bias[k]!);
      }
      cj += e2 * (Math.abs(first.bias[k]!) + first.errorConst[k]!);
      if (w2 === 0 && e2 === 0) continue;
      for (let i = 0; i < n0; i++) {
        const w1 = first.weights[k * n0 + i]!;
        w[j * n0 + i]! += w2 * w1;
        e[j * n0 + i]! += aw * (first.errorWeights[k * n0 + i]! + PRODUCT_ROUNDING * Math.abs(w1)) + e2 * reach[k * n0 + i]!;
      }
    }
    b[j] = bj;
    c[j] = cj;
  }
  return { inSize: n0, outSize: n2, weights: w, bias: b, errorWeights: e, errorConst: c, nodes: [...first.nodes, ...second.nodes] };
}

/** Freezes a draft into a layer, raising its error bound to the NOISE_FLOOR where lower. */
export function finishAffine(draft: AffineDraft): AffineLayer {
  const { inSize, outSize, weights, bias } = draft;
  const e = Float64Array.from(draft.errorWeights);
  const s = new Float64Array(outSize);
  const c = Float64Array.from(draft.errorConst);
  for (let j = 0; j < outSize; j++) {
    let r = 0;
    for (let i = 0; i < inSize; i++) {
      e[j * inSize + i] = Math.max(e[j * inSize + i]!, NOISE_FLOOR * Math.abs(weights[j * inSize + i]!));
      r += e[j * inSize + i]!;
    }
    s[j] = r;
    c[j] = Math.max(c[j]!, NOISE_FLOOR * Math.abs(bias[j]!));
  }
  return { kind: 'affine', inSize, outSize, weights, bias, errorWeights: e, errorScale: s, errorConst: c, nodes: draft.nodes };
}
