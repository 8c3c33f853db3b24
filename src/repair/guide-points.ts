import type { Box } from '../prove/index.js';
import type { Rng } from '../sampling/index.js';

/** What a guide point says about the rule at its position. */
export const PointKind = {
  /** Allowed advisory, drawn uniformly: counts in the cost of a cut. */
  uniform: 0,
  /** Allowed advisory, drawn elsewhere (faces, corners, neighbourhoods, given samples). */
  other: 1,
  /** The runtime gives an advisory the rule does not allow. */
  violation: 2,
  /** Inside a failed proof's unproven part: a cut should leave it out too. */
  unproven: 3,
} as const;

/** Kinds at or above this one must be cut off. */
export const OBSTACLE_KIND = PointKind.violation;

/**
 * A growing set of labelled points in scenario units (row-major n × d, float64), each with a
 * `PointKind`. Capacity doubles as points are appended.
 */
export interface GuidePoints {
  readonly d: number;
  n: number;
  x: Float64Array;
  kind: Uint8Array;
}

export function emptyGuidePoints(d: number): GuidePoints {
  return { d, n: 0, x: new Float64Array(1024 * d), kind: new Uint8Array(1024) };
}

/** Appends m points (m × d) with their kinds to the set, growing its arrays as needed. */
export function appendPointsInPlace(points: GuidePoints, x: ArrayLike<number>, kind: ArrayLike<number>, m: number): void {
  const d = points.d;
  if (points.n + m > points.kind.length) {
    let capacity = points.kind.length;
    while (capacity < points.n + m) capacity *= 2;
    const nx = new Float64Array(capacity * d);
    nx.set(points.x.subarray(0, points.n * d));
    const nk = new Uint8Array(capacity);
    nk.set(points.kind.subarray(0, points.n));
    points.x = nx;
    points.kind = nk;
  }
  for (let j = 0; j < m * d; j++) points.x[points.n * d + j] = x[j]!;
  for (let r = 0; r < m; r++) points.kind[points.n + r] = kind[r]!;
  points.n += m;
}

/** Whether point r of a row-major matrix lies in the closed box. */
export function pointInBox(x: ArrayLike<number>, r: number, d: number, box: Box): boolean {
  for (let i = 0; i < d; i++) {
    const v = x[r * d + i]!;
    if (v < box[i]![0] || v > box[i]![1]) return false;
  }
  return true;
}

/**
 * Points to screen a box before a proof is spent on it: `uniform` independent uniform points,
 * then `surface` points, half on a random face (one input set to its min or max) and half with
 * each input set to its min or max with probability 1/2 (edges and corners). Proof candidates
 * are piece centres and corners, and the violations a mined box misses sit mostly against its
 * faces, so the surface is sampled as densely as the interior.
 * @returns (uniform + surface) × d points, the uniform ones first
 */
export function screeningPoints(box: Box, uniform: number, surface: number, rng: Rng): Float64Array {
  const d = box.length;
  const n = uniform + surface;
  const x = new Float64Array(n * d);
  for (let r = 0; r < n; r++) {
    for (let i = 0; i < d; i++) x[r * d + i] = box[i]![0] + rng() * (box[i]![1] - box[i]![0]);
    if (r < uniform) continue;
    if (r < uniform + (surface >> 1)) {
      const i = Math.min(d - 1, Math.floor(rng() * d));
      x[r * d + i] = box[i]![rng() < 0.5 ? 0 : 1];
    } else {
      for (let i = 0; i < d; i++) if (rng() < 0.5) x[r * d + i] = box[i]![rng() < 0.5 ? 0 : 1];
    }
  }
  return x;
}
