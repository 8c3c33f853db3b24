import { stepMultiple } from '../rules/index.js';
import type { ReadableCutLimits } from './readable-cut.js';

/**
 * The readable value v with floor < v ≤ t and v ≥ t − window, from the coarsest 1-2-5 step that
 * has a multiple there (the nice-number series of Heckbert, "Nice numbers for graph labels",
 * Graphics Gems, 1990), the multiple nearest t: where a face grows up to, short of t.
 * @param t the farthest the face may go
 * @param floor where the face is now (v must pass it)
 * @param window how far short of t the value may fall (scenario units, > 0)
 * @param limits the input's readable steps (coarsest first); steps finer than its clearance are
 *   not used, as for the peeling's cuts (a face is never written finer than that)
 * @returns the value, or undefined when no step has a multiple in the window
 */
export function readableBelow(t: number, floor: number, window: number, limits: ReadableCutLimits): number | undefined {
  for (const step of limits.steps) {
    if (step.size < limits.clearance) break;
    if (step.size > t - floor) continue;
    const k = Math.floor(t / step.size);
    // k + 1 and k − 1 cover a quotient off by one ulp
    for (const kk of [k + 1, k, k - 1]) {
      const v = stepMultiple(step, kk);
      if (!Number.isNaN(v) && v <= t && v > floor && v >= t - window) return v;
    }
  }
  return undefined;
}

/** As `readableBelow`, mirrored: the readable value v with t ≤ v < ceiling and v ≤ t + window, nearest t. */
export function readableAbove(t: number, ceiling: number, window: number, limits: ReadableCutLimits): number | undefined {
  const v = readableBelow(-t, -ceiling, window, limits);
  // 0 rather than −0 when the value is zero
  return v === undefined ? undefined : 0 - v;
}
