import type { Box } from '../prove/index.js';
import { coverCells } from '../prove/index.js';

/**
 * The volume of the union of closed boxes inside a region, exactly (up to float64 rounding of
 * the cell products): the sum of the volumes of the covered cells of `coverCells`, so overlaps
 * count once. Volume is taken over the inputs on which the region has non-zero width.
 *
 * @param boxes closed boxes in the region's inputs (not changed)
 * @param region closed box bounding the measure (not changed)
 * @returns volume in the product of the inputs' units (not a share)
 */
export function unionVolume(boxes: readonly Box[], region: Box): number {
  let total = 0;
  coverCells(region, boxes, (lo, hi, covered) => {
    if (!covered) return;
    let v = 1;
    for (let i = 0; i < lo.length; i++) if (region[i]![1] > region[i]![0]) v *= hi[i]! - lo[i]!;
    total += v;
  });
  return total;
}
