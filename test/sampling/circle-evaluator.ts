import type { Evaluation, Evaluator } from '../../src/types.js';

/** Circle boundary used by the sampling tests: advisory 1 inside, 0 outside. */
export const CIRCLE = { cx: 0.5, cy: 0, r: 0.3, yScale: 4 } as const;

/**
 * Distance of (x, y) to the circle's boundary in the normalised box [0,1] × [−2, 2] → unit square.
 * y is scaled by 1/yScale so the circle is round in normalised coordinates.
 */
export function boundaryDistance(x: number, y: number): number {
  const dx = x - CIRCLE.cx;
  const dy = (y - CIRCLE.cy) / CIRCLE.yScale;
  return Math.abs(Math.sqrt(dx * dx + dy * dy) - CIRCLE.r);
}

/**
 * A two-advisory controller in plain TypeScript: scores (d − r, r − d) with d the normalised
 * distance to the centre; argmax; margin = |score difference|. Records the batch sizes it saw.
 */
export function circleEvaluator(calls: number[] = []): Evaluator {
  return async (x: Float64Array, n: number): Promise<Evaluation> => {
    calls.push(n);
    const scores = new Float32Array(2 * n);
    const advisory = new Int32Array(n);
    const margin = new Float32Array(n);
    for (let i = 0; i < n; i++) {
      const dx = x[2 * i]! - CIRCLE.cx;
      const dy = (x[2 * i + 1]! - CIRCLE.cy) / CIRCLE.yScale;
      const s = Math.sqrt(dx * dx + dy * dy) - CIRCLE.r;
      scores[2 * i] = s;
      scores[2 * i + 1] = -s;
      advisory[i] = s < 0 ? 1 : 0;
      margin[i] = Math.abs(2 * s);
    }
    return { scores, advisory, margin };
  };
}
