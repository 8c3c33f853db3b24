import { checkBox, checkCount, type Box } from './check-box.js';
import type { Rng } from './rng.js';

/**
 * Independent uniform points in a box: coordinate j is lo_j + u·(hi_j − lo_j) with u from `rng`
 * in [0, 1), so points lie in [lo_j, hi_j) (exactly lo_j on a zero-width axis).
 * @param box one [min, max] per input, scenario units (not changed)
 * @param n number of points
 * @param rng seeded source of doubles in [0, 1); n·d draws, row by row
 * @returns row-major n × d coordinates
 * @throws ToolError (`SAMPLING_BOX`, `SAMPLING_COUNT`) for a bad box or count
 */
export function uniformInBox(box: Box, n: number, rng: Rng): Float64Array {
  checkBox(box, 'uniformInBox');
  checkCount(n, 'uniformInBox');
  const d = box.length;
  const lo = new Float64Array(d);
  const width = new Float64Array(d);
  for (let j = 0; j < d; j++) {
    lo[j] = box[j]![0];
    width[j] = box[j]![1] - box[j]![0];
  }
  const out = new Float64Array(n * d);
  for (let i = 0; i < n; i++) {
    const row = i * d;
    for (let j = 0; j < d; j++) out[row + j] = lo[j]! + rng() * width[j]!;
  }
  return out;
}
