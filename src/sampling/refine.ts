/**
 * Adaptive refinement: new samples near the decision boundaries found so far.
 *
 * One round, in a few sequential passes over its active samples (every sample in the first
 * round; afterwards the previous round's candidates and new points, see below): (1) cut the
 * normalised box [0, 1]^d into a grid of about CELL_TARGET_SAMPLES / 2^round (at least
 * MIN_CELL_TARGET_SAMPLES) samples per cell — counting every sample drawn so far, so cells get
 * finer every round — shifted by a seeded random offset so that no boundary sits on a cell face
 * in every round, and note in a bit mask which advisories each cell holds; (2) the candidates
 * are the samples in cells holding more than one advisory (a boundary passes through them) and
 * the near-ties (margin below SMALL_MARGIN_FRACTION of the median margin of all samples); the
 * seeds are the candidates in such cells whose margin is at most the median margin of those
 * samples (the half nearer the boundary in score units), and the near-ties; (3) the new points
 * are spread evenly over the seeds (a seeded phase decides who gets the extra one), each drawn
 * uniformly in a box around its seed of half-width HALF_WIDTH_CELLS cells, shrunk by
 * SHRINK_PER_ROUND every round and clipped to the domain.
 *
 * Later rounds look only at the candidates and new points of the round before
 * (`ActiveSamples`): samples that were neither lay in cells of one advisory, away from every
 * boundary seen, and re-reading all samples every round cost more than the network
 * evaluations it steered. Keeping all candidates, not only the seeds, matters: with the seeds
 * alone the boundary samples thinned out to the descendants of the first round's seeds, and the
 * mined tables lost 0.06 points of fidelity on average (docs/sampling.md).
 *
 * The method is adaptive (boundary-seeking) sampling in the spirit of active learning by
 * disagreement (B. Settles, "Active learning literature survey", Univ. Wisconsin–Madison CS
 * TR 1648, 2009, §3); the constants are our own choices, not published values.
 *
 * Cost per round: O(a·d) for a active samples, a cell table of (g + 1)^d bytes (about n/2 to
 * 2n), and O(count·d).
 */
import { ToolError } from '../errors.js';
import { checkBox, checkCount, checkRoom, type Box } from './check-box.js';
import { gridForRound } from './grid-for-round.js';
import { MEDIAN_SAMPLE, medianEstimate } from './median-estimate.js';
import { activeCount, keepCandidatesInPlace, markCellsInPlace, mixedMarginMedian, scatterWriter, type ActiveSamples, type CellMask } from './refine-passes.js';
import type { Rng } from './rng.js';
import { uniformInBox } from './uniform-in-box.js';

/** Labelled samples so far (row-major n × d in scenario units); only the first n rows are read. */
export interface LabelledSamples {
  readonly x: Float64Array;
  readonly advisory: Int32Array;
  readonly margin: Float32Array;
  readonly n: number;
}

/** Samples per grid cell aimed for in round 0: enough that a cell can hold two advisories. */
export const CELL_TARGET_SAMPLES = 8;
/**
 * Finest grid: about two samples per cell. Finer grids would mostly hold single samples (no
 * boundary to see) while their tables outgrow the caches.
 */
export const MIN_CELL_TARGET_SAMPLES = 2;
/** A margin below this share of the median margin marks a near-tie (score units cancel out). */
export const SMALL_MARGIN_FRACTION = 0.05;
/** Half-width of a refinement box in round 0, in grid cells of that round. */
export const HALF_WIDTH_CELLS = 0.5;
/** Factor by which the half-width shrinks each round, on top of the finer grid. */
export const SHRINK_PER_ROUND = 0.7;
/**
 * Smallest half-width, in normalised units: a few float32 steps (2^-24 ≈ 6e-8) of the
 * network's input at the scale of the domain; finer boxes would resolve only rounding.
 */
export const MIN_HALF_WIDTH = 1e-6;

/**
 * Draws `count` new points near the boundaries between advisories seen in `samples` (one round,
 * looking at every sample).
 * @param box the input domain, one [min, max] per input, scenario units (not changed)
 * @param samples labelled samples so far (not changed); advisories must be ≥ 0
 * @param count number of new points
 * @param round refinement round, 0-based (grids get finer and boxes shrink as it grows)
 * @param rng seeded source of doubles in [0, 1)
 * @returns row-major count × d new points inside the box, scenario units
 * @throws ToolError (`SAMPLING_BOX`, `SAMPLING_COUNT`) for a bad box, count or sample matrix
 */
export function refine(box: Box, samples: LabelledSamples, count: number, round: number, rng: Rng): Float64Array {
  checkCount(count, 'refine');
  const out = new Float64Array(count * box.length);
  refineInPlace(box, samples, count, round, rng, out, 0);
  return out;
}

/** Which samples a round looks at, and where it keeps its per-sample work. */
export interface RefineRoundOptions {
  /** The samples to look at; default all n (the grid is sized for all n either way). */
  readonly active?: ActiveSamples;
  /**
   * Work space of at least as many entries as active samples, not the array holding
   * `active.candidates`; it receives the candidates kept. Default: a new array.
   */
  readonly scratch?: Int32Array;
  /**
   * The largest advisory among the samples, when the caller knows it (saves a pass); it decides
   * the width of the cell table. Default: read from the active samples.
   */
  readonly maxAdvisory?: number;
}

/**
 * As `refine`, but writes the new points into `out` from row `row` on, and may look at only
 * some of the samples. `out` may be the samples' own matrix when `row` ≥ samples.n (the rows
 * read and the rows written do not overlap).
 * @returns the candidates kept (ascending sample indices of the samples in mixed cells and the
 *   near-ties, at the front of the work space; the seeds are among them): with the new rows, the
 *   next round's active samples
 * @throws ToolError (`SAMPLING_BOX`, `SAMPLING_COUNT`) for a bad box, count, sample matrix,
 *   active list, work space or output range
 */
export function refineInPlace(box: Box, samples: LabelledSamples, count: number, round: number, rng: Rng, out: Float64Array, row: number, options: RefineRoundOptions = {}): Int32Array {
  const made = refineRoundInPlace(box, samples, count, round, rng, out, row, options);
  made.write(count);
  return made.candidates;
}

/** A round's candidates, and the writer of its new points (see refineRoundInPlace). */
export interface RefineRound {
  readonly candidates: Int32Array;
  /** Writes the next `rows` new points (in order, from the round's first row on). */
  readonly write: (rows: number) => void;
}

/**
 * As `refineInPlace`, but returns before writing the points: passes 1 and 2 run at once, the
 * points come from `write`, a range of rows at a time, from the same draws as refineInPlace's
 * (nothing else may draw from `rng` until the last row is written) — so a sampler can label the
 * first points while it makes the next. Until then the samples read, the work space holding the
 * candidates and `out`'s new rows are in use.
 * @throws ToolError as refineInPlace
 */
export function refineRoundInPlace(box: Box, samples: LabelledSamples, count: number, round: number, rng: Rng, out: Float64Array, row: number, options: RefineRoundOptions = {}): RefineRound {
  checkBox(box, 'refine');
  checkCount(count, 'refine');
  const d = box.length;
  const { x, advisory, margin, n } = samples;
  if (x.length < n * d || advisory.length < n || margin.length < n) {
    throw new ToolError('SAMPLING_COUNT', `refine: expected arrays for ${n} samples of ${d} inputs, found x ${x.length}, advisory ${advisory.length}, margin ${margin.length}`);
  }
  const active = options.active ?? { candidates: new Int32Array(0), from: 0, to: n };
  checkActive(active, n);
  const a = activeCount(active);
  const scratch = options.scratch ?? new Int32Array(a);
  if (scratch.length < a || (scratch.buffer === active.candidates.buffer && active.candidates.length > 0)) {
    throw new ToolError('SAMPLING_COUNT', `refine: expected a work space of ${a} entries apart from the candidates, found ${scratch.length}`);
  }
  checkRoom(out, row, count, d, 'refine');
  if (out.buffer === x.buffer && row * d + out.byteOffset / 8 < n * d + x.byteOffset / 8) {
    throw new ToolError('SAMPLING_COUNT', `refine: output rows from ${row} overlap the ${n} samples read`);
  }
  if (count === 0) return { candidates: scratch.subarray(0, 0), write: () => undefined };
  if (a === 0) return { candidates: scratch.subarray(0, 0), write: uniformWriter(box, rng, out, row) };
  const grid = gridForRound(box, n, Math.max(MIN_CELL_TARGET_SAMPLES, CELL_TARGET_SAMPLES / 2 ** round), rng);
  // pass 1: which advisories each cell holds, one bit each; a byte per cell when there are at
  // most 8 advisories (a small table stays in cache), else a word (advisory mod 32: two
  // advisories 32 apart would share a bit and hide a boundary, beyond any scenario in sight)
  const held: CellMask = (options.maxAdvisory ?? maxAdvisory(advisory, active)) < 8 ? new Uint8Array(grid.cells) : new Int32Array(grid.cells);
  markCellsInPlace(held, scratch, x, advisory, d, grid, active);
  // thresholds: the median margin of samples in mixed cells (the half nearer the boundary),
  // and a small share of the median margin of all samples (near-ties)
  const nearThreshold = mixedMarginMedian(held, scratch, margin, active, MEDIAN_SAMPLE);
  const tieThreshold = SMALL_MARGIN_FRACTION * medianEstimate(margin, n);
  // pass 2: candidates (samples in mixed cells, near-ties), and the seeds among them
  const { candidates, seeds } = keepCandidatesInPlace(scratch, held, margin, active, nearThreshold, tieThreshold);
  if (seeds === 0) return { candidates, write: uniformWriter(box, rng, out, row) };
  // pass 3: the points, spread evenly over the seeds from a seeded phase
  const phase = Math.floor(rng() * seeds);
  const half = Math.max(MIN_HALF_WIDTH, (HALF_WIDTH_CELLS / grid.perAxis) * SHRINK_PER_ROUND ** round);
  const write = scatterWriter(candidates, margin, x, d, grid, { count, seeds, near: nearThreshold, tie: tieThreshold, phase, half }, rng, out, row);
  return { candidates, write };
}

/** Writes uniform points of the box a range of rows at a time, from `row` on (uniformInBox's draws, in order). */
function uniformWriter(box: Box, rng: Rng, out: Float64Array, row: number): (rows: number) => void {
  let at = row;
  return (rows) => {
    out.set(uniformInBox(box, rows, rng), at * box.length);
    at += rows;
  };
}

/** The largest advisory among the active samples (0 when there are none). */
function maxAdvisory(advisory: Int32Array, active: ActiveSamples): number {
  let max = 0;
  for (let k = 0; k < active.candidates.length; k++) max = Math.max(max, advisory[active.candidates[k]!]!);
  for (let i = active.from; i < active.to; i++) if (advisory[i]! > max) max = advisory[i]!;
  return max;
}

/** @throws ToolError (`SAMPLING_COUNT`) unless the candidates ascend and everything is below n */
function checkActive(active: ActiveSamples, n: number): void {
  const { candidates: c, from, to } = active;
  let ok = Number.isSafeInteger(from) && Number.isSafeInteger(to) && from >= 0 && from <= to && to <= n;
  for (let k = 0; k < c.length && ok; k++) ok = c[k]! >= 0 && c[k]! < n && (k === 0 || c[k]! > c[k - 1]!);
  if (!ok) throw new ToolError('SAMPLING_COUNT', `refine: expected ascending candidates and rows [${from}, ${to}) among ${n} samples`);
}
