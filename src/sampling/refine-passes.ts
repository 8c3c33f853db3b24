/**
 * The sequential passes of one refinement round (see refine.ts), each a small function with one
 * tight loop. Kept apart on purpose: a round runs each pass once, so each loop must reach
 * optimised code on its own (on-stack replacement) without sharing type feedback with the other
 * passes; one large function with four loops was measured to deoptimise and recompile several
 * times per round (V8 11, Node 20).
 *
 * A round looks only at its active samples: `candidates` (sample indices, ascending) followed by
 * the rows [from, to). Position k of the active list is sample candidates[k] for
 * k < candidates.length, else row from + k − candidates.length.
 */
import type { RoundGrid } from './grid-for-round.js';
import { medianInPlace } from './median-in-place.js';
import { fillFromRng, type Rng } from './rng.js';

/** One bit per advisory per cell: a byte a cell for at most 8 advisories, else a word. */
export type CellMask = Uint8Array | Int32Array;

/**
 * The samples a round looks at: the previous round's candidates (ascending sample indices:
 * samples in mixed cells and near-ties), then the rows [from, to) drawn since.
 */
export interface ActiveSamples {
  readonly candidates: Int32Array;
  readonly from: number;
  readonly to: number;
}

/** Number of samples in an active list. */
export function activeCount(active: ActiveSamples): number {
  return active.candidates.length + active.to - active.from;
}

/**
 * `cellIndex` (grid-for-round.ts) written out, with the grid's fields passed in (g1 = g + 1).
 * The index stays below (g + 1)^d ≤ 2^24, so it is kept as a small integer throughout (`| 0`).
 */
function cellOfRow(x: Float64Array, i: number, d: number, g: number, g1: number, cellScale: Float64Array, cellShift: Float64Array): number {
  let cell = 0;
  for (let j = 0, at = i * d; j < d; j++, at++) {
    // the position in cells, clamped to [0, g] before the truncation (so |0 cannot wrap)
    const v = x[at]! * cellScale[j]! + cellShift[j]!;
    cell = (cell * g1 + (v > 0 ? (v < g ? v | 0 : g) : 0)) | 0;
  }
  return cell;
}

/**
 * Pass 1: the cell of every active sample into `cellOf` (by active position), and bit
 * (advisory mod 32) of each into its cell of `held`, in place.
 * @param held the cell table, grid.cells entries, all zero on entry
 * @param cellOf receives one cell index per active position
 */
export function markCellsInPlace(held: CellMask, cellOf: Int32Array, x: Float64Array, advisory: Int32Array, d: number, grid: RoundGrid, active: ActiveSamples): void {
  const { perAxis: g, cellScale, cellShift } = grid;
  const g1 = g + 1;
  const { candidates, from, to } = active;
  const s = candidates.length;
  for (let k = 0; k < s; k++) {
    const i = candidates[k]!;
    const cell = cellOfRow(x, i, d, g, g1, cellScale, cellShift);
    cellOf[k] = cell;
    held[cell]! |= 1 << (advisory[i]! & 31);
  }
  for (let i = from, k = s; i < to; i++, k++) {
    const cell = cellOfRow(x, i, d, g, g1, cellScale, cellShift);
    cellOf[k] = cell;
    held[cell]! |= 1 << (advisory[i]! & 31);
  }
}

/**
 * Median estimate of the margins of the active samples in mixed cells (cells holding two or
 * more advisories), from the mixed ones among at most `probes` evenly strided active positions.
 * @returns the estimate; +Infinity when no probe lands in a mixed cell (mixed samples are then
 *   too rare to halve: all of them count as near)
 */
export function mixedMarginMedian(held: CellMask, cellOf: Int32Array, margin: Float32Array, active: ActiveSamples, probes: number): number {
  const a = activeCount(active);
  const p = Math.min(a, probes);
  const picked = new Float32Array(p);
  const { candidates, from } = active;
  const s = candidates.length;
  let m = 0;
  for (let t = 0; t < p; t++) {
    const k = Math.floor((t * a) / p);
    const h = held[cellOf[k]!]!;
    if ((h & (h - 1)) !== 0) picked[m++] = margin[k < s ? candidates[k]! : from + k - s]!;
  }
  return m === 0 ? Infinity : medianInPlace(picked, m);
}

/** The candidates kept by a round and the number of seeds among them. */
export interface Candidates {
  /** Ascending sample indices. */
  readonly candidates: Int32Array;
  readonly seeds: number;
}

/**
 * Pass 2: the candidates — active samples in mixed cells, and any active sample with margin
 * below `tie` — written as ascending sample indices over `cellOf` itself (candidate number c
 * replaces position c, already read), and the seeds among them counted (`isSeed`). The
 * candidates are the next round's active samples besides the new rows.
 * @returns the candidates (the front of `cellOf`) and the number of seeds
 */
export function keepCandidatesInPlace(cellOf: Int32Array, held: CellMask, margin: Float32Array, active: ActiveSamples, near: number, tie: number): Candidates {
  const { candidates, from, to } = active;
  const s = candidates.length;
  let c = 0;
  let seeds = 0;
  for (let k = 0; k < s; k++) {
    const i = candidates[k]!;
    const h = held[cellOf[k]!]!;
    const m = margin[i]!;
    if ((h & (h - 1)) !== 0 || m < tie) {
      cellOf[c++] = i;
      if (isSeed(m, near, tie)) seeds++;
    }
  }
  for (let i = from, k = s; i < to; i++, k++) {
    const h = held[cellOf[k]!]!;
    const m = margin[i]!;
    if ((h & (h - 1)) !== 0 || m < tie) {
      cellOf[c++] = i;
      if (isSeed(m, near, tie)) seeds++;
    }
  }
  return { candidates: cellOf.subarray(0, c), seeds };
}

/**
 * Whether a candidate of margin m is a seed: in a mixed cell with m ≤ near, or a near-tie
 * (m < tie). Among candidates — each in a mixed cell or a near-tie — that is m ≤ near or m < tie.
 */
export function isSeed(m: number, near: number, tie: number): boolean {
  return m <= near || m < tie;
}

/** How the new points of a round are spread. */
export interface Scatter {
  /** Total new points. */
  readonly count: number;
  /** Number of seeds among the candidates (≥ 1). */
  readonly seeds: number;
  /** The seed thresholds (see `isSeed`). */
  readonly near: number;
  readonly tie: number;
  /** Seeded phase in [0, seeds) deciding which seeds get one point more. */
  readonly phase: number;
  /** Half-width of the box around a seed, normalised units. */
  readonly half: number;
}

/**
 * Pass 3: seed number s of S (the seeds among the candidates, in order) gets
 * ⌊((s + 1)·count + phase)/S⌋ − ⌊(s·count + phase)/S⌋ points (they sum to exactly `count`), each
 * uniform in the box of half-width `half` around the seed in normalised units, clipped to [0, 1]
 * per axis, written in scenario units to `out` from `row` on. The count·d uniform draws come
 * first, in bulk, into the output rows; each is then moved into its box.
 */
export function scatterAroundSeedsInPlace(
  candidates: Int32Array,
  margin: Float32Array,
  x: Float64Array,
  d: number,
  grid: RoundGrid,
  scatter: Scatter,
  rng: Rng,
  out: Float64Array,
  row: number,
): void {
  scatterWriter(candidates, margin, x, d, grid, scatter, rng, out, row)(scatter.count);
}

/**
 * Pass 3 a range of rows at a time: returns write(rows), which writes the next `rows` of the
 * scatter (in order, from `row` on) — the same points, from the same draws, as
 * scatterAroundSeedsInPlace writes at once, so a round's points can be labelled while the next
 * are made. The candidates, margins and seed rows must not change meanwhile.
 */
export function scatterWriter(
  candidates: Int32Array,
  margin: Float32Array,
  x: Float64Array,
  d: number,
  grid: RoundGrid,
  scatter: Scatter,
  rng: Rng,
  out: Float64Array,
  row: number,
): (rows: number) => void {
  const { count, seeds: total, near, tie, phase, half } = scatter;
  const { lo, width, scale } = grid;
  // the difference of the two floors is step or step + 1: the latter when the remainder r of
  // (s·count + phase)/total, carried from seed to seed without dividing, wraps around
  const step = Math.floor(count / total);
  const extra = count - step * total;
  let r = phase;
  // where the walk stands: candidate c (its seed's points not yet written: left), next output value t
  let c = -1;
  let left = 0;
  let t = row * d;
  return (rows) => {
    fillFromRng(rng, out, t, rows * d);
    for (let k = rows; k > 0; k--) {
      while (left === 0) {
        c++;
        if (!isSeed(margin[candidates[c]!]!, near, tie)) continue;
        left = step;
        r += extra;
        if (r >= total) {
          r -= total;
          left++;
        }
      }
      left--;
      // the box is recomputed for each point: measured faster than keeping it in small arrays
      const at = candidates[c]! * d;
      for (let j = 0; j < d; j++, t++) {
        let u = (x[at + j]! - lo[j]!) * scale[j]!;
        u = u > 0 ? (u < 1 ? u : 1) : 0;
        const a = u - half > 0 ? u - half : 0;
        const b = u + half < 1 ? u + half : 1;
        out[t] = lo[j]! + (a + out[t]! * (b - a)) * width[j]!;
      }
    }
  };
}
