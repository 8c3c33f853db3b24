import { medianInPlace } from './median-in-place.js';

/** Values read to estimate the median: its sampling error is ~1/√(4·4096) ≈ 0.8 % in rank. */
export const MEDIAN_SAMPLE = 4096;

/**
 * Median of the first n values, estimated from at most MEDIAN_SAMPLE evenly strided ones (0
 * when n = 0). Refinement only needs the margin's rough scale, so an estimate serves and keeps
 * the cost independent of n.
 * @param values the values (not changed)
 * @param n how many of them to consider
 */
export function medianEstimate(values: Float32Array, n: number): number {
  if (n === 0) return 0;
  const m = Math.min(n, MEDIAN_SAMPLE);
  const picked = new Float32Array(m);
  for (let t = 0; t < m; t++) picked[t] = values[Math.floor((t * n) / m)]!;
  return medianInPlace(picked, m);
}
