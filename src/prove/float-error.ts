/**
 * The floating-point model behind every proof (docs/proofs.md, "Floating point").
 *
 * The network runs in float32 in onnxruntime; the bounds are computed in float64. A proof is
 * about the float32 computation: each affine layer's float32 rounding error is added to its
 * bounds as a bounded noise term, using the standard model of floating-point arithmetic,
 * fl(a op b) = (a op b)(1 + δ), |δ| ≤ u, and the inner-product bound
 * |fl(wᵀx) − wᵀx| ≤ γ_n Σ|w_k||x_k| with γ_n = nu / (1 − nu), which holds for any order of
 * summation and with or without fused multiply-add (N. J. Higham, Accuracy and Stability of
 * Numerical Algorithms, 2nd ed., SIAM, 2002, §2.2 and §3.1, Lemma 3.1 and eq. (3.4)).
 */

/** Unit roundoff of IEEE 754 binary32 with round-to-nearest: 2^-24 (Higham 2002, §2.1). */
export const FLOAT32_UNIT_ROUNDOFF = 2 ** -24;

/**
 * Factor applied to the float32 unit roundoff. The runtime may re-associate or fuse
 * operators (e.g. fold a scalar Mul into a MatMul's alpha, or a bias Add into Gemm); a factor
 * of 2 covers the extra roundings such rewrites can move between operators.
 */
export const ROUNDING_SAFETY_FACTOR = 2;

/** The unit roundoff actually used in the error bounds. */
export const ROUNDING_UNIT = FLOAT32_UNIT_ROUNDOFF * ROUNDING_SAFETY_FACTOR;

/**
 * Absolute error allowed per float32 operation for underflow: the runtime may flush
 * subnormal results to zero, losing up to the smallest normal number 2^-126
 * (Higham 2002, §2.1, the model with underflow).
 */
export const FLOAT32_UNDERFLOW = 2 ** -126;

/**
 * Absolute error allowed for onnxruntime's float32 Sigmoid and Tanh (polynomial / rational
 * approximations in its CPU kernels). Measured on a sweep of 2,000,000 float32 inputs in
 * [-20, 20] against Math.tanh and 1/(1+e^-x): at most 1.7e-7 (Sigmoid) and 3.3e-7 (Tanh);
 * test/prove/activation-error.test.ts re-measures it. This is an empirical bound on the
 * runtime, not a proven one: docs/proofs.md states it as an assumption.
 */
export const ACTIVATION_ABS_ERROR = 2e-6;

/**
 * Every affine layer's error allowance is at least this fraction of Σ|w||x| + |b|, even for
 * layers that are exact (e.g. the ReLU rewrite of Clip). It dominates the float64 rounding of
 * the bound computation itself (at most about n·2^-53 of the same sums, n < 4096 inputs), so
 * that rounding is covered by NOISE_INFLATION below.
 */
export const NOISE_FLOOR = 2 ** -30;

/**
 * Factor applied to every noise term: covers the float64 rounding of the bound arithmetic,
 * which is at most n·2^-53 ≤ 2^-41 of the sums the noise already bounds at ≥ 2^-30 (n < 4096,
 * so the float64 error is below 2^-11 of the noise; 2^-8 leaves room).
 */
export const NOISE_INFLATION = 1 + 2 ** -8;

/** Widest layer the float64 argument above covers. */
export const MAX_LAYER_WIDTH = 4096;

/**
 * Bounds whose magnitude exceeds this are treated as possible float32 overflow (float32's
 * largest finite value is about 3.4e38): such a box is never proven.
 */
export const MAX_SAFE_MAGNITUDE = 1e37;

/** γ_k = k u / (1 − k u) for the rounding unit in use (Higham 2002, eq. (3.8)). */
export function gamma(k: number): number {
  const ku = k * ROUNDING_UNIT;
  return ku / (1 - ku);
}

/**
 * A float64 value ≤ x, at least one ulp below the rounded result of a single float64
 * operation: used to round a computed lower bound outward.
 */
export function roundDown(x: number): number {
  return x - Math.abs(x) * 2 ** -51 - Number.MIN_VALUE;
}

/** A float64 value ≥ x (see roundDown). */
export function roundUp(x: number): number {
  return x + Math.abs(x) * 2 ** -51 + Number.MIN_VALUE;
}

const f32 = new Float32Array(1);
const i32 = new Int32Array(f32.buffer);

/** The largest float32 value ≤ x (float32 round toward −∞). */
export function float32Down(x: number): number {
  const f = Math.fround(x);
  if (f <= x) return f;
  f32[0] = f;
  if (f > 0) i32[0]! -= 1;
  else if (f === 0) return -(2 ** -149);
  else i32[0]! += 1;
  return f32[0]!;
}

/** The smallest float32 value ≥ x (float32 round toward +∞). */
export function float32Up(x: number): number {
  return -float32Down(-x);
}
