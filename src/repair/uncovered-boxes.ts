import type { Box } from '../prove/index.js';
import { coverCells } from '../prove/index.js';

/**
 * The part of a region outside every given box, as disjoint closed boxes (the uncovered cells of
 * `coverCells`). Used to find where a proof that ran out of budget left its box unproven.
 * @param region closed box (not changed)
 * @param boxes closed boxes (not changed)
 */
export function uncoveredBoxes(region: Box, boxes: readonly Box[]): Box[] {
  const out: Box[] = [];
  coverCells(region, boxes, (lo, hi, covered) => {
    if (!covered) out.push(Array.from(lo, (v, i) => [v, hi[i]!] as const));
  });
  return out;
}
