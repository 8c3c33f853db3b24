import { checkBox, checkCount, type Box } from './check-box.js';
import type { Rng } from './rng.js';

/**
 * Points on the boundary of a box, for checking rules where violations like to hide: at the
 * faces, edges and corners, where the sampled interior rarely reaches.
 *
 * When the 2^d corners fit in half of the budget (2^d ≤ n/2), all corners come first, in binary
 * order (bit j of the corner index set means axis j at its max). The remaining points go round
 * the 2d faces in turn (axis 0 at min, axis 0 at max, axis 1 at min, …), so every face gets
 * the same share to within one point; on its face a point is uniform in the other coordinates.
 * Common practice for boundary testing, no published source.
 *
 * @param box one [min, max] per input, scenario units (not changed)
 * @param n number of points
 * @param rng seeded source of doubles in [0, 1)
 * @returns row-major n × d coordinates, each point on the box's boundary
 * @throws ToolError (`SAMPLING_BOX`, `SAMPLING_COUNT`) for a bad box or count
 */
export function boxSurfacePoints(box: Box, n: number, rng: Rng): Float64Array {
  checkBox(box, 'boxSurfacePoints');
  checkCount(n, 'boxSurfacePoints');
  const d = box.length;
  const out = new Float64Array(n * d);
  // d ≤ 30 keeps 2^d exact in int32 shifts; larger boxes never have all corners in budget
  const corners = d <= 30 && 2 ** d <= n / 2 ? 2 ** d : 0;
  for (let c = 0; c < corners; c++) {
    for (let j = 0; j < d; j++) out[c * d + j] = (c >>> j) & 1 ? box[j]![1] : box[j]![0];
  }
  for (let i = corners; i < n; i++) {
    const face = (i - corners) % (2 * d);
    const axis = face >>> 1;
    const row = i * d;
    for (let j = 0; j < d; j++) {
      const lo = box[j]![0];
      const hi = box[j]![1];
      out[row + j] = j === axis ? (face & 1 ? hi : lo) : lo + rng() * (hi - lo);
    }
  }
  return out;
}
