import type { Box } from '../prove/index.js';
import { boxUnion } from './box-union.js';
import type { ReadableCutLimits } from './readable-cut.js';

/** A region waiting to be screened, planned and proven. */
export interface WorkItem {
  readonly box: Box;
  /** A slab peeled off a larger region: may be joined with a neighbouring slab. */
  readonly slab: boolean;
  /** Times a clean-looking plan of this region was contradicted by a violation. */
  readonly strikes: number;
}

/** Most doublings of the clearance: 2^5 = 32 times the base clearance. */
export const MAX_STRIKE_DOUBLINGS = 5;

/**
 * Adds an item to the work list; a slab is first joined with any slab on the list or in the
 * reserve (slabs too small to repair alone) whose union with it is a box; regions on both lists
 * do not overlap, so the union is exactly the two. A face that creeps after a slanted boundary
 * leaves one thin slab per step; joined, they form one region worth repairing instead of many
 * below the volume threshold. Changes both lists in place.
 */
export function pushWork(work: WorkItem[], reserve: WorkItem[], item: WorkItem): void {
  let box = item.box;
  if (item.slab) {
    for (let joined = true; joined; ) {
      joined = false;
      for (const list of [work, reserve]) {
        for (let k = 0; k < list.length && !joined; k++) {
          if (!list[k]!.slab) continue;
          const union = boxUnion(box, list[k]!.box);
          if (union === undefined) continue;
          box = union;
          list.splice(k, 1);
          joined = true;
        }
      }
    }
  }
  work.push({ ...item, box });
}

/**
 * Readable-cut limits for a region with `strikes` failed plans: the clearance doubles per strike
 * (up to MAX_STRIKE_DOUBLINGS) and the allowance stays at least twice the clearance, so each
 * new cut lands further past the violations than the last.
 */
export function strikeLimits(limits: readonly ReadableCutLimits[], strikes: number): readonly ReadableCutLimits[] {
  if (strikes === 0) return limits;
  const factor = 2 ** Math.min(strikes, MAX_STRIKE_DOUBLINGS);
  return limits.map((l) => ({ ...l, clearance: l.clearance * factor, allowance: Math.max(l.allowance, 2 * l.clearance * factor) }));
}
