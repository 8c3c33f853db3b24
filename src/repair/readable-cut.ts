import { type ReadableStep, readableSteps, stepMultiple } from '../rules/index.js';

/** Which face of a box a cut moves: `lo` raises the lower face, `hi` lowers the upper one. */
export type Side = 'lo' | 'hi';

export interface ReadableCutLimits {
  /** Least distance between the point cut off and the new face (scenario units, >= 0). */
  readonly clearance: number;
  /** Greatest distance between the point cut off and the new face (scenario units, > clearance). */
  readonly allowance: number;
  /** Finest step tried (scenario units, > 0); below it the exact value c ± clearance is used. */
  readonly finest: number;
  /** The 1-2-5 steps to try, coarsest first (`readableSteps(largest width, finest)`, computed once). */
  readonly steps: readonly ReadableStep[];
}

/**
 * The readable value to which a face of the interval [lo, hi] moves so that the point at
 * coordinate c is cut off: on side `lo` the new lower face v satisfies
 * c + clearance <= v <= c + allowance and v < hi; on side `hi`, c − allowance <= v <= c − clearance
 * and v > lo. Among the values in that window it takes a multiple of the coarsest 1-2-5 step
 * (the nice-number series of Heckbert, "Nice numbers for graph labels", Graphics Gems, 1990),
 * nearest to c within that step, so the face reads as a round number and stays close to the point.
 * The value is always strictly past c, so the point cut off is never on the new, closed face.
 *
 * @param c coordinate of the point to cut off (scenario units)
 * @param side the face that moves
 * @param lo current lower face
 * @param hi current upper face
 * @returns the new face, or undefined when no value leaves a part of non-zero width
 */
export function readableCut(c: number, side: Side, lo: number, hi: number, limits: ReadableCutLimits): number | undefined {
  const { clearance, allowance } = limits;
  const sign = side === 'lo' ? 1 : -1;
  const near = c + sign * clearance;
  const far = c + sign * allowance;
  const inside = (v: number): boolean =>
    side === 'lo'
      ? v > c && v >= near && v <= far && v > lo && v < hi
      : v < c && v <= near && v >= far && v > lo && v < hi;
  const largest = Math.max(hi - lo, allowance);
  for (const step of limits.steps) {
    if (step.size > largest) continue;
    // the multiple of the step next to `near` on the far side; k ± 1 covers a quotient off by one ulp
    const k = side === 'lo' ? Math.ceil(near / step.size) : Math.floor(near / step.size);
    for (const kk of [k - sign, k, k + sign]) {
      const v = stepMultiple(step, kk);
      if (!Number.isNaN(v) && inside(v)) return v;
    }
  }
  return inside(near) ? near : undefined;
}

/**
 * A readable value splitting [lo, hi] near its middle: a multiple of the coarsest 1-2-5 step
 * that has one in the middle half [lo + w/4, hi − w/4], the one nearest the middle. Steps finer
 * than `minStep` are not used: a split of a thin region is then refused rather than written with
 * more digits than the rule's cuts.
 * @returns the value, or undefined when no step of at least `minStep` fits
 */
export function readableMiddle(lo: number, hi: number, minStep: number): number | undefined {
  const w = hi - lo;
  const mid = lo + w / 2;
  const a = lo + w / 4;
  const z = hi - w / 4;
  for (const step of readableSteps(w, minStep)) {
    const k = Math.round(mid / step.size);
    let best: number | undefined;
    for (const kk of [k - 1, k, k + 1]) {
      const v = stepMultiple(step, kk);
      if (Number.isNaN(v) || v < a || v > z || !(v > lo && v < hi)) continue;
      if (best === undefined || Math.abs(v - mid) < Math.abs(best - mid)) best = v;
    }
    if (best !== undefined) return best;
  }
  return undefined;
}
