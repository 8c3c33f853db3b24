import { ToolError } from '../errors.js';

/** Largest number of columns: the solver tries every subset of them (2^k − 1 small solves). */
export const NNLS_MAX_COLUMNS = 10;
/** A pivot below this (columns scaled to unit norm) marks columns as dependent in a subset; that subset is skipped. */
const PIVOT_MIN = 1e-12;

/** Solves the small normal equations (A_Sᵀ A_S) x = A_Sᵀ b of one subset by Gaussian elimination with partial pivoting. */
function solveSubset(cols: readonly Float64Array[], b: Float64Array, subset: readonly number[]): Float64Array | undefined {
  const k = subset.length;
  const m = new Float64Array(k * (k + 1));
  for (let i = 0; i < k; i++) {
    const ci = cols[subset[i]!]!;
    for (let j = 0; j < k; j++) {
      const cj = cols[subset[j]!]!;
      let s = 0;
      for (let r = 0; r < b.length; r++) s += ci[r]! * cj[r]!;
      m[i * (k + 1) + j] = s;
    }
    let s = 0;
    for (let r = 0; r < b.length; r++) s += ci[r]! * b[r]!;
    m[i * (k + 1) + k] = s;
  }
  for (let p = 0; p < k; p++) {
    let best = p;
    for (let i = p + 1; i < k; i++) if (Math.abs(m[i * (k + 1) + p]!) > Math.abs(m[best * (k + 1) + p]!)) best = i;
    if (Math.abs(m[best * (k + 1) + p]!) < PIVOT_MIN) return undefined;
    for (let j = 0; j <= k; j++) {
      const t = m[p * (k + 1) + j]!;
      m[p * (k + 1) + j] = m[best * (k + 1) + j]!;
      m[best * (k + 1) + j] = t;
    }
    for (let i = p + 1; i < k; i++) {
      const f = m[i * (k + 1) + p]! / m[p * (k + 1) + p]!;
      for (let j = p; j <= k; j++) m[i * (k + 1) + j] = m[i * (k + 1) + j]! - f * m[p * (k + 1) + j]!;
    }
  }
  const x = new Float64Array(k);
  for (let i = k - 1; i >= 0; i--) {
    let s = m[i * (k + 1) + k]!;
    for (let j = i + 1; j < k; j++) s -= m[i * (k + 1) + j]! * x[j]!;
    x[i] = s / m[i * (k + 1) + i]!;
  }
  return x;
}

/**
 * Non-negative least squares: minimises ‖A x − b‖² subject to x ≥ 0 (C. L. Lawson & R. J.
 * Hanson, "Solving Least Squares Problems", Prentice-Hall 1974, ch. 23). For the few columns of
 * a cost model it tries every subset S of columns, solves the unconstrained problem on S, and
 * keeps the best solution that is ≥ 0; the constrained optimum is the unconstrained solution on
 * its own support (the Karush–Kuhn–Tucker conditions, ibid.), so this search finds it exactly,
 * where Lawson–Hanson's active-set loop would reach it in fewer solves. Columns are scaled to
 * unit norm first, so the very different magnitudes of cost features do not spoil the pivots.
 *
 * @param columns the k columns of A, each of length n (not changed)
 * @param b the n targets (not changed)
 * @returns x (length k, each ≥ 0) and the residual sum of squares
 * @throws ToolError (NNLS_INVALID) on mismatched lengths or more than NNLS_MAX_COLUMNS columns
 * @cost O(2^k · (k² n + k³))
 */
export function nonnegativeLeastSquares(columns: readonly Float64Array[], b: Float64Array): { x: Float64Array; residual: number } {
  const k = columns.length;
  if (k < 1 || k > NNLS_MAX_COLUMNS) throw new ToolError('NNLS_INVALID', `nonnegativeLeastSquares: ${k} columns, expected 1..${NNLS_MAX_COLUMNS}`);
  for (const c of columns) {
    if (c.length !== b.length) throw new ToolError('NNLS_INVALID', `nonnegativeLeastSquares: a column has ${c.length} rows, expected ${b.length}`);
  }
  const norms = columns.map((c) => Math.sqrt(c.reduce((s, v) => s + v * v, 0)) || 1);
  const scaled = columns.map((c, j) => c.map((v) => v / norms[j]!));
  let best = new Float64Array(k);
  let bestResidual = b.reduce((s, v) => s + v * v, 0);
  for (let mask = 1; mask < 1 << k; mask++) {
    const subset: number[] = [];
    for (let j = 0; j < k; j++) if (mask & (1 << j)) subset.push(j);
    const xs = solveSubset(scaled, b, subset);
    if (!xs || xs.some((v) => v < 0)) continue;
    let residual = 0;
    for (let r = 0; r < b.length; r++) {
      let fit = 0;
      for (let i = 0; i < subset.length; i++) fit += scaled[subset[i]!]![r]! * xs[i]!;
      residual += (fit - b[r]!) ** 2;
    }
    if (residual < bestResidual) {
      bestResidual = residual;
      best = new Float64Array(k);
      subset.forEach((j, i) => (best[j] = xs[i]! / norms[j]!));
    }
  }
  return { x: best, residual: bestResidual };
}
