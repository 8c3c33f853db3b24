import { describe, expect, it } from 'vitest';
import { linearRegression } from 'simple-statistics';
import { nonnegativeLeastSquares } from '../../src/scale/index.js';

/** float64 normal equations on a handful of well-scaled rows: errors ~1e-14; 1e-9 leaves wide headroom. */
const TOL = 1e-9;

describe('nonnegativeLeastSquares', () => {
  it('equals the ordinary least-squares line when that line has non-negative coefficients (reference: simple-statistics linearRegression)', () => {
    const xs = [1, 2, 3, 5, 8, 13];
    const ys = [2.1, 3.9, 6.2, 9.8, 16.5, 25.7];
    const ref = linearRegression(xs.map((x, i) => [x, ys[i]!]));
    const { x } = nonnegativeLeastSquares([Float64Array.from(xs, () => 1), Float64Array.from(xs)], Float64Array.from(ys));
    expect(Math.abs(x[0]! - ref.b)).toBeLessThan(TOL);
    expect(Math.abs(x[1]! - ref.m)).toBeLessThan(TOL);
  });

  it('sets a slope to zero when the data fall, leaving the mean as intercept (closed form: the best constant is the mean)', () => {
    const xs = [0, 1, 2, 3, 4];
    const ys = [9, 7, 6, 4, 1];
    const cols = [Float64Array.from(xs, () => 1), Float64Array.from(xs)];
    const { x } = nonnegativeLeastSquares(cols, Float64Array.from(ys));
    expect(x[1]).toBe(0);
    expect(Math.abs(x[0]! - 27 / 5)).toBeLessThan(TOL);
  });

  it('recovers exact coefficients of very different magnitudes', () => {
    const a = [Float64Array.from([1, 1, 1, 1]), Float64Array.from([1e6, 3e6, 2e6, 7e6]), Float64Array.from([10, 40, 20, 30])];
    const truth = [1.5, 2e-7, 0.03];
    const b = Float64Array.from([0, 1, 2, 3], (r) => truth.reduce((s, t, j) => s + t * a[j]![r]!, 0));
    const { x, residual } = nonnegativeLeastSquares(a, b);
    truth.forEach((t, j) => expect(Math.abs(x[j]! - t) / t).toBeLessThan(TOL));
    expect(residual).toBeLessThan(TOL);
  });

  it('rejects columns of the wrong length', () => {
    expect(() => nonnegativeLeastSquares([new Float64Array(3)], new Float64Array(4))).toThrowErrorMatchingInlineSnapshot(`[ToolError: nonnegativeLeastSquares: a column has 3 rows, expected 4]`);
  });
});
