import { checkBox, checkCount, checkRoom, type Box } from './check-box.js';
import { fillFromRng, type Rng } from './rng.js';

/**
 * The number of cells per axis of a full grid with at most `budget` cells in d dimensions:
 * the largest integer c with c^d ≤ budget (0 when budget is 0).
 */
export function gridCellsPerAxis(budget: number, d: number): number {
  if (budget < 1) return 0;
  let c = Math.max(1, Math.floor(budget ** (1 / d)));
  // the root is a float: step to the exact integer answer
  while ((c + 1) ** d <= budget) c++;
  while (c > 1 && c ** d > budget) c--;
  return c;
}

/**
 * A jittered (stratified) grid: the box is cut into c equal cells per axis, with c from
 * `gridCellsPerAxis(budget, d)`, and one uniform point is drawn in every cell. Each input's
 * range is then covered evenly with no large holes, and the jitter avoids the aliasing of a
 * regular lattice. Stratified sampling: W. G. Cochran, *Sampling Techniques*, Wiley, 1977
 * (ch. 5); the jittered grid in graphics: R. L. Cook, "Stochastic sampling in computer
 * graphics", ACM Transactions on Graphics 5(1):51–72, 1986.
 *
 * Cells are visited in row-major order with axis 0 slowest.
 * @param box one [min, max] per input, scenario units (not changed)
 * @param budget the most points wanted; the grid uses c^d ≤ budget of them
 * @param rng seeded source of doubles in [0, 1)
 * @returns row-major (c^d) × d coordinates
 * @throws ToolError (`SAMPLING_BOX`, `SAMPLING_COUNT`) for a bad box or budget
 */
export function grid(box: Box, budget: number, rng: Rng): Float64Array {
  checkBox(box, 'grid');
  checkCount(budget, 'grid');
  const out = new Float64Array(gridCellsPerAxis(budget, box.length) ** box.length * box.length);
  gridInPlace(box, budget, rng, out, 0);
  return out;
}

/**
 * As `grid`, but writes the points into `out` from row `row` on (d values a row).
 * @returns the number of points written, c^d
 * @throws ToolError (`SAMPLING_BOX`, `SAMPLING_COUNT`) for a bad box or budget, or too small an `out`
 */
export function gridInPlace(box: Box, budget: number, rng: Rng, out: Float64Array, row: number): number {
  checkBox(box, 'grid');
  checkCount(budget, 'grid');
  const d = box.length;
  const c = gridCellsPerAxis(budget, d);
  const n = c ** d;
  checkRoom(out, row, n, d, 'grid');
  gridRangeInPlace(box, c, 0, n, rng, out, row);
  return n;
}

/**
 * Cells [first, first + count) of the jittered grid of c cells per axis, written from row `row`
 * on: the same points, from the same draws, as `gridInPlace` writes for those cells when the
 * ranges are generated in order (so a grid can be made a batch at a time). Arguments are not
 * checked: callers check the box and the room.
 */
export function gridRangeInPlace(box: Box, c: number, first: number, count: number, rng: Rng, out: Float64Array, row: number): void {
  const d = box.length;
  const cell = new Int32Array(d);
  const lo = new Float64Array(d);
  const step = new Float64Array(d);
  for (let j = d - 1, rest = first; j >= 0; j--) {
    cell[j] = rest % c;
    rest = Math.floor(rest / c);
  }
  for (let j = 0; j < d; j++) {
    lo[j] = box[j]![0];
    step[j] = (box[j]![1] - box[j]![0]) / c;
  }
  // the jitter first (row by row, as single draws would come), then each value moved into its cell
  fillFromRng(rng, out, row * d, count * d);
  for (let i = 0, at = row * d; i < count; i++) {
    for (let j = 0; j < d; j++, at++) out[at] = lo[j]! + (cell[j]! + out[at]!) * step[j]!;
    for (let j = d - 1; j >= 0; j--) {
      if (++cell[j]! < c) break;
      cell[j] = 0;
    }
  }
}
