/**
 * Adaptive refinement: new samples near the decision boundaries found so far.
 *
 * One round, in a few sequential passes over the samples (no sorting, no per-sample tables):
 * (1) cut the normalised box [0, 1]^d into a grid of about CELL_TARGET_SAMPLES / 2^round (at
 * least MIN_CELL_TARGET_SAMPLES) samples per cell, finer every round as samples crowd near the
 * boundaries, shifted by a seeded random offset so that no boundary sits on a cell face in every
 * round, and note in a bit mask which advisories each cell holds; (2) a sample is a seed when its
 * cell holds more than one advisory (a boundary passes through it) and its margin is at most the
 * median margin of such samples (the half nearer the boundary in score units), or when its margin
 * is below SMALL_MARGIN_FRACTION of the median margin of all samples (a near-tie anywhere);
 * (3) the new points are spread evenly over the seeds (a seeded phase decides who gets the extra
 * one), each drawn uniformly in a box around its seed of half-width HALF_WIDTH_CELLS cells,
 * shrunk by SHRINK_PER_ROUND every round and clipped to the domain.
 *
 * The method is adaptive (boundary-seeking) sampling in the spirit of active learning by
 * disagreement (B. Settles, "Active learning literature survey", Univ. Wisconsin–Madison CS
 * TR 1648, 2009, §3); the constants are our own choices, not published values. Sequential
 * passes matter on this kind of machine: random access into arrays of tens of MB measured
 * 5–10× slower than streaming (docs/sampling.md).
 *
 * Cost: O(n·d) per round, a cell table of (g + 1)^d bytes (about n/2 to 2n), and O(count·d).
 */
import { ToolError } from '../errors.js';
import { checkBox, checkCount, checkRoom, type Box } from './check-box.js';
import { cellIndex, gridForRound, normalisedAt } from './grid-for-round.js';
import { MEDIAN_SAMPLE, medianEstimate } from './median-estimate.js';
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
 * Draws `count` new points near the boundaries between advisories seen in `samples`.
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

/**
 * As `refine`, but writes the new points into `out` from row `row` on. `out` may be the
 * samples' own matrix when `row` ≥ samples.n (the rows read and the rows written do not overlap).
 * @throws ToolError (`SAMPLING_BOX`, `SAMPLING_COUNT`) for a bad box, count, sample matrix or output range
 */
export function refineInPlace(box: Box, samples: LabelledSamples, count: number, round: number, rng: Rng, out: Float64Array, row: number): void {
  checkBox(box, 'refine');
  checkCount(count, 'refine');
  const d = box.length;
  const { x, advisory, margin, n } = samples;
  if (x.length < n * d || advisory.length < n || margin.length < n) {
    throw new ToolError('SAMPLING_COUNT', `refine: expected arrays for ${n} samples of ${d} inputs, found x ${x.length}, advisory ${advisory.length}, margin ${margin.length}`);
  }
  checkRoom(out, row, count, d, 'refine');
  if (out.buffer === x.buffer && row * d + out.byteOffset / 8 < n * d + x.byteOffset / 8) {
    throw new ToolError('SAMPLING_COUNT', `refine: output rows from ${row} overlap the ${n} samples read`);
  }
  if (count === 0) return;
  if (n === 0) {
    out.set(uniformInBox(box, count, rng), row * d);
    return;
  }
  const grid = gridForRound(box, n, Math.max(MIN_CELL_TARGET_SAMPLES, CELL_TARGET_SAMPLES / 2 ** round), rng);
  // pass 1: which advisories each cell holds, one bit each; a byte per cell when there are at
  // most 8 advisories (a small table stays in cache), else a word (advisory mod 32: two
  // advisories 32 apart would share a bit and hide a boundary, beyond any scenario in sight)
  let maxAdvisory = 0;
  for (let i = 0; i < n; i++) if (advisory[i]! > maxAdvisory) maxAdvisory = advisory[i]!;
  const held = maxAdvisory < 8 ? new Uint8Array(grid.cells) : new Int32Array(grid.cells);
  for (let i = 0; i < n; i++) held[cellIndex(x, i, d, grid)]! |= 1 << (advisory[i]! & 31);
  // pass 2: samples in mixed cells; then the median of their margins from an even subsample
  const flag = new Uint8Array(n);
  let mixedCount = 0;
  for (let i = 0; i < n; i++) {
    const h = held[cellIndex(x, i, d, grid)]!;
    if ((h & (h - 1)) !== 0) {
      flag[i] = 1;
      mixedCount++;
    }
  }
  const nearThreshold = medianOfFlagged(margin, flag, n, mixedCount);
  const tieThreshold = SMALL_MARGIN_FRACTION * medianEstimate(margin, n);
  // pass 3: seeds
  let seeds = 0;
  for (let i = 0; i < n; i++) {
    const m = margin[i]!;
    const seed = (flag[i] === 1 && m <= nearThreshold) || m < tieThreshold;
    flag[i] = seed ? 1 : 0;
    if (seed) seeds++;
  }
  if (seeds === 0) {
    out.set(uniformInBox(box, count, rng), row * d);
    return;
  }
  // pass 4: seed number s gets floor(((s + 1)·count + q)/seeds) − floor((s·count + q)/seeds)
  // points, which sum to exactly `count`; q is a seeded phase in [0, seeds)
  const q = Math.floor(rng() * seeds);
  const half = Math.max(MIN_HALF_WIDTH, (HALF_WIDTH_CELLS / grid.perAxis) * SHRINK_PER_ROUND ** round);
  let t = row;
  for (let i = 0, s = 0; i < n; i++) {
    if (flag[i] !== 1) continue;
    const k = Math.floor(((s + 1) * count + q) / seeds) - Math.floor((s * count + q) / seeds);
    s++;
    for (let e = 0; e < k; e++, t++) {
      for (let j = 0; j < d; j++) {
        const c = normalisedAt(x, i, j, d, grid);
        const a = Math.max(0, c - half);
        const b = Math.min(1, c + half);
        out[t * d + j] = grid.lo[j]! + (a + rng() * (b - a)) * grid.width[j]!;
      }
    }
  }
}

/** Median estimate of the margins of the `count` flagged samples, from an even subsample. */
function medianOfFlagged(margin: Float32Array, flag: Uint8Array, n: number, count: number): number {
  const m = Math.min(count, MEDIAN_SAMPLE);
  const picked = new Float32Array(m);
  for (let i = 0, k = 0, t = 0; i < n && t < m; i++) {
    if (flag[i] !== 1) continue;
    if (k === Math.floor((t * count) / m)) picked[t++] = margin[i]!;
    k++;
  }
  return medianEstimate(picked, m);
}
