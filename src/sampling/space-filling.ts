import type { Box } from './check-box.js';
import { gridCellsPerAxis, gridRangeInPlace } from './grid.js';
import type { Rng } from './rng.js';
import { sobolRangeInPlace, sobolShift } from './sobol.js';

/** Share of the space-filling part given to the jittered grid; Sobol points take the rest. */
export const GRID_SHARE = 0.5;

/**
 * The space-filling rows of a sample set, [0, initial): a jittered grid over half of them
 * (when it has at least 2 cells per axis; else none), digitally shifted Sobol points mapped to
 * the box for the rest. Returns a writer that makes the rows a range at a time — ranges must
 * come in order, from row 0 — so that a batch can be labelled while the next one is made. The
 * draws are the same, in the same order, however the rows are cut: the grid's jitter, then the
 * Sobol shift (drawn as soon as the grid is complete), then nothing more.
 * @param box the input domain (not changed)
 * @param initial number of space-filling rows
 * @param rng the sampler's seeded source
 * @param x the sample matrix the rows are written into (row-major, d = box.length)
 * @returns write(from, count): writes rows [from, from + count) of x
 */
export function spaceFillingRows(box: Box, initial: number, rng: Rng, x: Float64Array): (from: number, count: number) => void {
  const d = box.length;
  // a grid of one cell per axis is just one random point: leave it all to Sobol then
  const gridBudget = gridCellsPerAxis(Math.floor(initial * GRID_SHARE), d) >= 2 ? Math.floor(initial * GRID_SHARE) : 0;
  const c = gridCellsPerAxis(gridBudget, d);
  const gridCount = c ** d;
  const lo = Float64Array.from(box, (b) => b[0]);
  const width = Float64Array.from(box, (b) => b[1] - b[0]);
  let shift: Int32Array | undefined;
  let written = 0;
  const shiftOnce = (): Int32Array => (shift ??= sobolShift(d, rng));
  if (gridCount === 0) shiftOnce();
  return (from, count) => {
    if (from !== written || from + count > initial) throw new RangeError(`spaceFillingRows: expected rows from ${written} up to ${initial}, asked for [${from}, ${from + count})`);
    written += count;
    const gridRows = Math.max(0, Math.min(from + count, gridCount) - from);
    if (gridRows > 0) {
      gridRangeInPlace(box, c, from, gridRows, rng, x, from);
      if (from + gridRows === gridCount) shiftOnce();
    }
    const sobolFrom = from + gridRows;
    const sobolRows = from + count - sobolFrom;
    if (sobolRows > 0) {
      // Sobol points arrive in [0, 1)^d: mapped to the box as they are written
      sobolRangeInPlace(sobolFrom - gridCount, sobolRows, shiftOnce(), x, sobolFrom, lo, width);
    }
  };
}

