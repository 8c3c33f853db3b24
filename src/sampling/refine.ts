/**
 * Adaptive refinement: new samples near the decision boundaries found so far.
 *
 * One round: (1) cut the normalised box [0, 1]^d into a grid of about CELL_TARGET_SAMPLES
 * samples per cell, shifted by a seeded random offset so that no boundary sits on a cell face
 * in every round; (2) a sample is a seed when its cell holds another advisory (a label change
 * nearby) or when its margin is below SMALL_MARGIN_FRACTION of the median margin (close to a
 * tie in score units); (3) seeds are taken in seeded random order, cycling when there are fewer
 * seeds than points wanted; (4) a seed in a mixed cell is paired with the nearest of up to
 * PARTNER_CANDIDATES samples of other advisories in its cell, and the new point is drawn
 * uniformly in a small box around the pair's midpoint (one bisection step towards the
 * boundary); a seed found by its margin alone gets a box around itself. Boxes shrink by
 * SHRINK_PER_ROUND every round and are clipped to the domain.
 *
 * The approach is adaptive sampling in the sense of importance-by-disagreement (e.g.
 * B. Settles, "Active learning literature survey", Univ. Wisconsin TR 1648, 2009, §3);
 * the constants are our own choices, tuned on the demo scenarios, not published values.
 *
 * Cost: O(n log n) for the cell ordering (native typed-array sort), O(n) for the seeds,
 * O(count · PARTNER_CANDIDATES · d) for the new points.
 */
import { ToolError } from '../errors.js';
import { checkBox, checkCount, type Box } from './check-box.js';
import { orderByCell } from './order-by-cell.js';
import type { Rng } from './rng.js';
import { uniformInBox } from './uniform-in-box.js';

/** Labelled samples so far (row-major n × d in scenario units); only the first n rows are read. */
export interface LabelledSamples {
  readonly x: Float64Array;
  readonly advisory: Int32Array;
  readonly margin: Float32Array;
  readonly n: number;
}

/** Samples per grid cell aimed for: enough that a cell can hold two advisories, few enough to stay local. */
export const CELL_TARGET_SAMPLES = 8;
/** Other-advisory samples tried as the partner of a seed; bounds the cost per new point. */
export const PARTNER_CANDIDATES = 8;
/** A margin below this share of the median margin marks a near-tie (score units cancel out). */
export const SMALL_MARGIN_FRACTION = 0.05;
/** Largest half-width of a refinement box in round 0, in grid cells. */
export const HALF_WIDTH_CELLS = 0.5;
/** Factor by which the largest half-width shrinks each round. */
export const SHRINK_PER_ROUND = 0.6;
/**
 * Smallest half-width, in normalised units: a few float32 steps (2^-24 ≈ 6e-8) of the
 * network's input at the scale of the domain; finer boxes would resolve only rounding.
 */
export const MIN_HALF_WIDTH = 1e-6;

/**
 * Draws `count` new points near the boundaries between advisories seen in `samples`.
 * @param box the input domain, one [min, max] per input, scenario units (not changed)
 * @param samples labelled samples so far (not changed)
 * @param count number of new points
 * @param round refinement round, 0-based (boxes shrink as it grows)
 * @param rng seeded source of doubles in [0, 1)
 * @returns row-major count × d new points inside the box, scenario units
 * @throws ToolError (`SAMPLING_BOX`, `SAMPLING_COUNT`) for a bad box, count or sample matrix
 */
export function refine(box: Box, samples: LabelledSamples, count: number, round: number, rng: Rng): Float64Array {
  checkBox(box, 'refine');
  checkCount(count, 'refine');
  const d = box.length;
  const n = samples.n;
  if (samples.x.length < n * d || samples.advisory.length < n || samples.margin.length < n) {
    throw new ToolError('SAMPLING_COUNT', `refine: expected arrays for ${n} samples of ${d} inputs, found x ${samples.x.length}, advisory ${samples.advisory.length}, margin ${samples.margin.length}`);
  }
  if (count === 0) return new Float64Array(0);
  if (n === 0) return uniformInBox(box, count, rng);
  const lo = new Float64Array(d);
  const width = new Float64Array(d);
  for (let j = 0; j < d; j++) {
    lo[j] = box[j]![0];
    width[j] = box[j]![1] - box[j]![0];
  }
  const u = new Float64Array(n * d);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < d; j++) {
      const w = width[j]!;
      u[i * d + j] = w > 0 ? Math.min(1, Math.max(0, (samples.x[i * d + j]! - lo[j]!) / w)) : 0;
    }
  }
  const cells = orderByCell(u, samples.advisory, n, d, CELL_TARGET_SAMPLES, rng);
  const threshold = SMALL_MARGIN_FRACTION * medianOf(samples.margin, n);
  const seeds = new Uint32Array(n);
  let seedCount = 0;
  for (let i = 0; i < n; i++) if (cells.mixed[i] === 1 || samples.margin[i]! < threshold) seeds[seedCount++] = i;
  if (seedCount === 0) return uniformInBox(box, count, rng);
  // seeded order: a partial Fisher–Yates shuffle of as many seeds as will be used
  const used = Math.min(seedCount, count);
  for (let t = 0; t < used; t++) {
    const r = t + Math.floor(rng() * (seedCount - t));
    const tmp = seeds[t]!;
    seeds[t] = seeds[r]!;
    seeds[r] = tmp;
  }
  const maxHalf = Math.max(MIN_HALF_WIDTH, (HALF_WIDTH_CELLS / cells.perAxis) * SHRINK_PER_ROUND ** round);
  const out = new Float64Array(count * d);
  const center = new Float64Array(d);
  for (let t = 0; t < count; t++) {
    const i = seeds[t % used]!;
    let half = maxHalf;
    const partner = cells.mixed[i] === 1 ? nearestOther(i, cells, u, d, rng) : -1;
    if (partner >= 0) {
      let dist2 = 0;
      for (let j = 0; j < d; j++) {
        const a = u[i * d + j]!;
        const b = u[partner * d + j]!;
        center[j] = 0.5 * (a + b);
        dist2 += (a - b) * (a - b);
      }
      half = Math.max(MIN_HALF_WIDTH, Math.min(maxHalf, 0.5 * Math.sqrt(dist2)));
    } else {
      for (let j = 0; j < d; j++) center[j] = u[i * d + j]!;
    }
    for (let j = 0; j < d; j++) {
      const a = Math.max(0, center[j]! - half);
      const b = Math.min(1, center[j]! + half);
      out[t * d + j] = lo[j]! + (a + rng() * (b - a)) * width[j]!;
    }
  }
  return out;
}

/** Of up to PARTNER_CANDIDATES samples with another advisory in i's cell, the nearest to i. */
function nearestOther(i: number, cells: ReturnType<typeof orderByCell>, u: Float64Array, d: number, rng: Rng): number {
  const cellStart = cells.cellStart[i]!;
  const runStart = cells.runStart[i]!;
  const runSize = cells.runEnd[i]! - runStart;
  const others = cells.cellEnd[i]! - cellStart - runSize;
  const tries = Math.min(others, PARTNER_CANDIDATES);
  let best = -1;
  let bestDist = Infinity;
  for (let t = 0; t < tries; t++) {
    // all of them in order when few, else random picks among the other advisories' positions
    let p = cellStart + (others <= PARTNER_CANDIDATES ? t : Math.floor(rng() * others));
    if (p >= runStart) p += runSize;
    const k = cells.order[p]!;
    let dist = 0;
    for (let j = 0; j < d; j++) {
      const diff = u[i * d + j]! - u[k * d + j]!;
      dist += diff * diff;
    }
    if (dist < bestDist) {
      bestDist = dist;
      best = k;
    }
  }
  return best;
}

/** Median of the first n values (0 when n = 0), from a sorted copy. */
function medianOf(values: Float32Array, n: number): number {
  if (n === 0) return 0;
  const sorted = values.slice(0, n).sort();
  return n % 2 === 1 ? sorted[(n - 1) >> 1]! : 0.5 * (sorted[n / 2 - 1]! + sorted[n / 2]!);
}
