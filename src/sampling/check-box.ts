import { ToolError } from '../errors.js';

/** A closed box: one [min, max] interval per input, in scenario units. */
export type Box = ReadonlyArray<readonly [number, number]>;

/**
 * Checks that a box has at least one axis and finite bounds with min ≤ max on every axis.
 * @param box the box to check (not changed)
 * @param where the caller's name, for the message
 * @throws ToolError (`SAMPLING_BOX`) naming the first bad axis, what was found and what was expected
 */
export function checkBox(box: Box, where: string): void {
  if (box.length === 0) throw new ToolError('SAMPLING_BOX', `${where}: expected a box with at least one axis, found none`);
  for (let j = 0; j < box.length; j++) {
    const [lo, hi] = box[j]!;
    if (!Number.isFinite(lo) || !Number.isFinite(hi) || lo > hi) {
      throw new ToolError('SAMPLING_BOX', `${where}: box[${j}]: expected finite min <= max, found [${lo}, ${hi}]`);
    }
  }
}

/**
 * Checks that a sample count is a non-negative safe integer.
 * @throws ToolError (`SAMPLING_COUNT`) otherwise
 */
export function checkCount(n: number, where: string): void {
  if (!Number.isSafeInteger(n) || n < 0) {
    throw new ToolError('SAMPLING_COUNT', `${where}: expected a whole number of points >= 0, found ${n}`);
  }
}

/**
 * Checks that `out` has room for `count` rows of d values from row `row` on.
 * @throws ToolError (`SAMPLING_COUNT`) otherwise
 */
export function checkRoom(out: Float64Array, row: number, count: number, d: number, where: string): void {
  if (!Number.isSafeInteger(row) || row < 0 || (row + count) * d > out.length) {
    throw new ToolError('SAMPLING_COUNT', `${where}: expected room for ${count} rows from row ${row}, found ${Math.floor(out.length / d)} rows`);
  }
}
