import type { AffineLayer } from './network.js';
import { NOISE_FLOOR } from './float-error.js';

/**
 * Builds and fuses affine layers together with their float32 error bounds.
 *
 * An affine step maps x̂ to ŷ with ŷ = W x̂ + b + δ, |δ_j| ≤ s_j·M + c_j, M = max_k |x̂_k|.
 * Composing (W1, b1, s1, c1) then (W2, b2, s2, c2):
 *   ŷ2 = W2 W1 x̂ + (W2 b1 + b2) + W2 δ1 + δ2, and max_k |ŷ1_k| ≤ A·M + B with
 *   A = max_k (Σ_i |W1_ki| + s1_k), B = max_k (|b1_k| + c1_k), so
 *   s_j = Σ_k |W2_jk| s1_k + s2_j A,   c_j = Σ_k |W2_jk| c1_k + s2_j B + c2_j,
 * plus 2^-40 of |W2||W1| and |W2||b1| for the float64 rounding of the fused product
 * (at most n·2^-53 ≤ 2^-41 of those sums for n < 4096). This is the running error analysis of
 * Higham (Accuracy and Stability of Numerical Algorithms, SIAM, 2002, §3.1) applied per layer.
 */
export interface AffineDraft {
  readonly inSize: number;
  readonly outSize: number;
  readonly weights: Float64Array;
  readonly bias: Float64Array;
  readonly errorScale: Float64Array;
  readonly errorConst: Float64Array;
  readonly nodes: readonly string[];
}

const PRODUCT_ROUNDING = 2 ** -40;

/**
 * An affine step from explicit parts; the error bound is `scale[j]·M + konst[j]`.
 * @param weights outSize × inSize row-major (copied)
 */
export function affineDraft(
  inSize: number,
  outSize: number,
  weights: ArrayLike<number>,
  bias: ArrayLike<number>,
  scale: ArrayLike<number>,
  konst: ArrayLike<number>,
  nodes: readonly string[],
): AffineDraft {
  return {
    inSize,
    outSize,
    weights: Float64Array.from(weights),
    bias: Float64Array.from(bias),
    errorScale: Float64Array.from(scale),
    errorConst: Float64Array.from(konst),
    nodes,
  };
}

/** A diagonal step y_j = d_j x_j + b_j with the given error bound per output. */
export function diagonalDraft(
  d: ArrayLike<number>,
  b: ArrayLike<number>,
  scale: ArrayLike<number>,
  konst: ArrayLike<number>,
  nodes: readonly string[],
): AffineDraft {
  const n = d.length;
  const w = new Float64Array(n * n);
  for (let j = 0; j < n; j++) w[j * n + j] = d[j]!;
  return affineDraft(n, n, w, b, scale, konst, nodes);
}

/** `second ∘ first`, with the composed error bound derived above. */
export function composeAffine(first: AffineDraft, second: AffineDraft): AffineDraft {
  const n0 = first.inSize;
  const n1 = first.outSize;
  const n2 = second.outSize;
  let a = 0;
  let bmax = 0;
  const rowAbs1 = new Float64Array(n1);
  for (let k = 0; k < n1; k++) {
    let r = 0;
    for (let i = 0; i < n0; i++) r += Math.abs(first.weights[k * n0 + i]!);
    rowAbs1[k] = r;
    a = Math.max(a, r + first.errorScale[k]!);
    bmax = Math.max(bmax, Math.abs(first.bias[k]!) + first.errorConst[k]!);
  }
  const w = new Float64Array(n2 * n0);
  const b = new Float64Array(n2);
  const s = new Float64Array(n2);
  const c = new Float64Array(n2);
  for (let j = 0; j < n2; j++) {
    let bj = second.bias[j]!;
    let sj = 0;
    let cj = 0;
    let roundS = 0;
    let roundC = 0;
    for (let k = 0; k < n1; k++) {
      const w2 = second.weights[j * n1 + k]!;
      if (w2 === 0) continue;
      const aw = Math.abs(w2);
      for (let i = 0; i < n0; i++) w[j * n0 + i]! += w2 * first.weights[k * n0 + i]!;
      bj += w2 * first.bias[k]!;
      sj += aw * first.errorScale[k]!;
      cj += aw * first.errorConst[k]!;
      roundS += aw * rowAbs1[k]!;
      roundC += aw * Math.abs(first.bias[k]!);
    }
    b[j] = bj;
    s[j] = sj + second.errorScale[j]! * a + PRODUCT_ROUNDING * roundS;
    c[j] = cj + second.errorScale[j]! * bmax + second.errorConst[j]! + PRODUCT_ROUNDING * roundC;
  }
  return { inSize: n0, outSize: n2, weights: w, bias: b, errorScale: s, errorConst: c, nodes: [...first.nodes, ...second.nodes] };
}

/** Freezes a draft into a layer, raising its error bound to the NOISE_FLOOR where lower. */
export function finishAffine(draft: AffineDraft): AffineLayer {
  const { inSize, outSize, weights, bias } = draft;
  const s = Float64Array.from(draft.errorScale);
  const c = Float64Array.from(draft.errorConst);
  for (let j = 0; j < outSize; j++) {
    let r = 0;
    for (let i = 0; i < inSize; i++) r += Math.abs(weights[j * inSize + i]!);
    s[j] = Math.max(s[j]!, NOISE_FLOOR * r);
    c[j] = Math.max(c[j]!, NOISE_FLOOR * Math.abs(bias[j]!));
  }
  return { kind: 'affine', inSize, outSize, weights, bias, errorScale: s, errorConst: c, nodes: draft.nodes };
}
