import { ToolError } from '../errors.js';
import type { Rng } from './rng.js';

/** Samples grouped by grid cell, and within a cell by advisory. */
export interface CellOrder {
  /** Grid cells per axis. */
  readonly perAxis: number;
  /** Sample indices sorted by (cell, advisory): positions 0..n−1 → sample index. */
  readonly order: Uint32Array;
  /** Per sample: the positions [cellStart, cellEnd) of its cell in `order`. */
  readonly cellStart: Int32Array;
  readonly cellEnd: Int32Array;
  /** Per sample: the positions [runStart, runEnd) of the samples of its cell with its advisory. */
  readonly runStart: Int32Array;
  readonly runEnd: Int32Array;
  /** Per sample: 1 when its cell holds more than one advisory. */
  readonly mixed: Uint8Array;
}

/** Largest integer a double holds exactly: cell keys must stay below it. */
const EXACT_INTEGER_LIMIT = 2 ** 53;

/**
 * Sorts samples in normalised coordinates u ∈ [0, 1]^d into the cells of a grid of g cells per
 * axis (g ≈ (n / targetPerCell)^(1/d)) shifted by a seeded offset of up to one cell per axis,
 * then by advisory within each cell. A cell's key is its per-axis indices written in base g + 1
 * (one more than g because of the shift), times the number of advisories, plus the advisory: an
 * exact integer in a double, so the whole ordering is one native Float64Array sort.
 * @param u row-major n × d normalised coordinates (not changed)
 * @param labels advisory per sample (not changed)
 * @param rng seeded source for the grid offset (d draws)
 * @throws ToolError (`SAMPLING_DIMENSION`) when even a 1-cell grid's keys would not be exact
 * Cost: O(n·d + n log n).
 */
export function orderByCell(u: Float64Array, labels: Int32Array, n: number, d: number, targetPerCell: number, rng: Rng): CellOrder {
  let minLabel = 0;
  let maxLabel = 0;
  for (let i = 0; i < n; i++) {
    const a = labels[i]!;
    if (i === 0 || a < minLabel) minLabel = a;
    if (i === 0 || a > maxLabel) maxLabel = a;
  }
  const classes = maxLabel - minLabel + 1;
  let g = Math.max(1, Math.floor((n / targetPerCell) ** (1 / d)));
  while (g > 1 && (g + 1) ** d * classes >= EXACT_INTEGER_LIMIT) g--;
  if (2 ** d * classes >= EXACT_INTEGER_LIMIT) {
    throw new ToolError('SAMPLING_DIMENSION', `refine: ${d} inputs with ${classes} advisories are too many for exact cell keys`);
  }
  const radix = g + 1;
  const offset = new Float64Array(d);
  for (let j = 0; j < d; j++) offset[j] = rng();
  const cellKey = new Float64Array(n);
  const composite = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let key = 0;
    for (let j = 0; j < d; j++) key = key * radix + Math.floor(u[i * d + j]! * g + offset[j]!);
    cellKey[i] = key;
    composite[i] = key * classes + (labels[i]! - minLabel);
  }
  const sorted = composite.slice().sort();
  let m = 0;
  for (let p = 0; p < n; p++) if (p === 0 || sorted[p] !== sorted[p - 1]) sorted[m++] = sorted[p]!;
  const unique = sorted.subarray(0, m);
  // rank of each sample's (cell, advisory) group, then a counting sort by rank
  const rank = new Int32Array(n);
  const start = new Int32Array(m + 1);
  for (let i = 0; i < n; i++) {
    const v = composite[i]!;
    let a = 0;
    let b = m - 1;
    while (a < b) {
      const mid = (a + b) >>> 1;
      if (unique[mid]! < v) a = mid + 1;
      else b = mid;
    }
    rank[i] = a;
    start[a + 1]!++;
  }
  for (let r = 0; r < m; r++) start[r + 1]! += start[r]!;
  const fill = start.slice(0, m);
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[fill[rank[i]!]!++] = i;
  // groups of consecutive ranks with the same cell key form a cell
  const rankCellStart = new Int32Array(m);
  const rankCellEnd = new Int32Array(m);
  for (let r = 0; r < m; ) {
    const key = cellKey[order[start[r]!]!]!;
    let s = r + 1;
    while (s < m && cellKey[order[start[s]!]!]! === key) s++;
    for (let q = r; q < s; q++) {
      rankCellStart[q] = start[r]!;
      rankCellEnd[q] = start[s]!;
    }
    r = s;
  }
  const cellStart = new Int32Array(n);
  const cellEnd = new Int32Array(n);
  const runStart = new Int32Array(n);
  const runEnd = new Int32Array(n);
  const mixed = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const r = rank[i]!;
    cellStart[i] = rankCellStart[r]!;
    cellEnd[i] = rankCellEnd[r]!;
    runStart[i] = start[r]!;
    runEnd[i] = start[r + 1]!;
    mixed[i] = runStart[i] !== cellStart[i] || runEnd[i] !== cellEnd[i] ? 1 : 0;
  }
  return { perAxis: g, order, cellStart, cellEnd, runStart, runEnd, mixed };
}
