import type { Decision } from '../types.js';

/**
 * Turns rows of scores into decisions: the winning advisory per row (largest score for argmax,
 * smallest for argmin; ties go to the lowest index) and the margin, how far the winner is ahead
 * of the runner-up in score units (0 on a tie). One pass per row, no allocation.
 *
 * Writes `advisory[outRow + r]` and `margin[outRow + r]` for r in [0, rows), in place.
 * @param scores rows × k scores, row-major (read only)
 * @param rows number of rows to decide
 * @param k scores per row (≥ 2)
 * @param decision argmax or argmin
 * @param advisory receives the winner of each row
 * @param margin receives the margin of each row
 * @param outRow first row of `advisory`/`margin` to write
 * @returns -1 when every score is finite, else the first row (0-based within `scores`) that
 *   holds a NaN or infinite score; rows from it on are left unwritten
 */
export function decideInPlace(
  scores: Float32Array,
  rows: number,
  k: number,
  decision: Decision,
  advisory: Int32Array,
  margin: Float32Array,
  outRow: number,
): number {
  // argmin is argmax of the negated scores; `sign` keeps one loop for both.
  const sign = decision === 'argmax' ? 1 : -1;
  for (let r = 0; r < rows; r++) {
    const base = r * k;
    let best = 0;
    let bestValue = sign * scores[base]!;
    let second = -Infinity;
    if (bestValue - bestValue !== 0) return r; // NaN or ±Infinity
    for (let j = 1; j < k; j++) {
      const v = sign * scores[base + j]!;
      if (v - v !== 0) return r;
      if (v > bestValue) {
        second = bestValue;
        bestValue = v;
        best = j;
      } else if (v > second) {
        second = v;
      }
    }
    advisory[outRow + r] = best;
    margin[outRow + r] = bestValue - second;
  }
  return -1;
}
