import { ToolError } from '../errors.js';
import type { Box } from './check-box.js';
import { gridCellsPerAxis } from './grid.js';
import type { Rng } from './rng.js';

/** Largest cell table allowed: 2^24 words (64 MB) would already be far more cells than samples. */
const MAX_CELLS = 2 ** 24;

/** A shifted grid over the normalised box (plain data, so hot loops can inline `cellIndex`). */
export interface RoundGrid {
  /** Cells per axis, g. */
  readonly perAxis: number;
  /** Size of the cell index range, (g + 1)^d (the shift adds one partial cell per axis). */
  readonly cells: number;
  readonly lo: Float64Array;
  readonly width: Float64Array;
  /** 1 / width, or 0 on a zero-width axis. */
  readonly scale: Float64Array;
  /** Seeded shift per axis, in cells, in [0, 1). */
  readonly offset: Float64Array;
  /** scale·g per axis: x·cellScale + cellShift is the position in cells, shift included. */
  readonly cellScale: Float64Array;
  /** offset − lo·scale·g per axis. */
  readonly cellShift: Float64Array;
}

/**
 * A grid of g cells per axis over the normalised box, with g = ⌊(n / perCell)^(1/d)⌋ (at least 1,
 * and (g + 1)^d ≤ MAX_CELLS), shifted by a seeded offset of up to one cell on every axis so that
 * successive rounds do not share cell faces. Cell indices are the per-axis indices (0..g) in
 * base g + 1.
 * @param box the domain (not changed)
 * @param n samples the grid is for
 * @param perCell samples per cell aimed for (may be below 1)
 * @param rng seeded source of the offset (d draws)
 * @throws ToolError (`SAMPLING_DIMENSION`) when even a 1-cell grid is too large a table
 */
export function gridForRound(box: Box, n: number, perCell: number, rng: Rng): RoundGrid {
  const d = box.length;
  if (2 ** d > MAX_CELLS) throw new ToolError('SAMPLING_DIMENSION', `refine: ${d} inputs are too many for a cell table`);
  // the largest g with g^d ≤ n / perCell (exact at perfect powers, unlike a float root)
  let g = Math.max(1, gridCellsPerAxis(Math.floor(n / perCell), d));
  while (g > 1 && (g + 1) ** d > MAX_CELLS) g--;
  const lo = new Float64Array(d);
  const width = new Float64Array(d);
  const scale = new Float64Array(d);
  const offset = new Float64Array(d);
  const cellScale = new Float64Array(d);
  const cellShift = new Float64Array(d);
  for (let j = 0; j < d; j++) {
    lo[j] = box[j]![0];
    width[j] = box[j]![1] - box[j]![0];
    scale[j] = width[j]! > 0 ? 1 / width[j]! : 0;
    offset[j] = rng();
    cellScale[j] = scale[j]! * g;
    cellShift[j] = offset[j]! - lo[j]! * cellScale[j]!;
  }
  return { perAxis: g, cells: (g + 1) ** d, lo, width, scale, offset, cellScale, cellShift };
}

/** Coordinate j of row i of x (d values a row), normalised to [0, 1] (0 on a zero-width axis). */
export function normalisedAt(x: Float64Array, i: number, j: number, d: number, grid: RoundGrid): number {
  return Math.min(1, Math.max(0, (x[i * d + j]! - grid.lo[j]!) * grid.scale[j]!));
}

/**
 * The cell of row i of x, in [0, grid.cells): per axis ⌊x·cellScale + cellShift⌋ (the position
 * in cells, shift included) clamped to [0, g], combined in base g + 1. Points outside the box
 * fall into its border cells.
 */
export function cellIndex(x: Float64Array, i: number, d: number, grid: RoundGrid): number {
  const g = grid.perAxis;
  const { cellScale, cellShift } = grid;
  let cell = 0;
  for (let j = 0, at = i * d; j < d; j++, at++) {
    // clamped to [0, g] before the truncation, which is then the floor (and cannot wrap)
    const v = x[at]! * cellScale[j]! + cellShift[j]!;
    cell = cell * (g + 1) + (v > 0 ? (v < g ? v | 0 : g) : 0);
  }
  return cell;
}
