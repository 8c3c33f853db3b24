import type { Box } from '../prove/index.js';
import { type GuidePoints, OBSTACLE_KIND, PointKind } from './guide-points.js';
import { type ReadableCutLimits, type Side, readableCut } from './readable-cut.js';

export interface MainBoxPlan {
  /** The largest part found free of obstacle points; undefined when no cut sequence frees one. */
  readonly main?: Box;
  /** The rest of the region as disjoint boxes (closed, sharing faces with `main`), in cut order. */
  readonly slabs: Box[];
}

interface Move {
  readonly dim: number;
  readonly side: Side;
  value: number;
}

/**
 * Prior added to the allowed points a cut loses before dividing by the obstacles it removes: a
 * cut that loses nothing is then judged by how many obstacles it removes (0.5 is the usual
 * additive smoothing of a count; choice of this project, no source).
 */
export const CUT_LOSS_PRIOR = 0.5;

/**
 * Most candidate positions tried per face and step: obstacles are taken in order of depth with a
 * stride that keeps at most this many (the first and the deepest always). Bounds the cost when a
 * region holds thousands of violating points.
 */
export const CUTS_PER_FACE = 64;

/**
 * Peels a region until no obstacle point (a violation or an unproven point) is left inside.
 * At each step every face offers cuts: past its nearest obstacle, past deeper ones, up to its
 * deepest, each at the readable value just past that obstacle (`readableCut`). The cut with the
 * fewest uniform allowed points lost per obstacle removed is applied (the greedy rule for
 * weighted set cover: Chvátal, "A greedy heuristic for the set-covering problem", Mathematics of
 * Operations Research 4(3), 1979), ties to the least volume, then the lower input and side.
 * The faces' final positions give the main box; the region minus the main box is cut into at
 * most 2d slabs, one per moved face, in the order the faces first moved (a guillotine
 * partition: main box and slabs do not overlap). Greedy: it does not search for the largest
 * empty box, which is costly in five or more inputs; the caller plans the slabs again.
 *
 * @param region closed box, scenario units (not changed)
 * @param points labelled points; only those in `region` are read
 * @param limits readable-cut window per input
 * Cost: O(steps · d · m log m) for m points in the region; steps <= the number of obstacles.
 */
export function planMainBox(region: Box, points: GuidePoints, limits: readonly ReadableCutLimits[]): MainBoxPlan {
  const d = points.d;
  const lo = Float64Array.from(region, (b) => b[0]);
  const hi = Float64Array.from(region, (b) => b[1]);
  const rows: number[] = [];
  for (let r = 0; r < points.n; r++) if (inside(points.x, r, d, lo, hi)) rows.push(r);
  const m = rows.length;
  const x = new Float64Array(m * d);
  const obstacle = new Uint8Array(m);
  const uniform = new Uint8Array(m);
  rows.forEach((r, p) => {
    x.set(points.x.subarray(r * d, r * d + d), p * d);
    obstacle[p] = points.kind[r]! >= OBSTACLE_KIND ? 1 : 0;
    uniform[p] = points.kind[r] === PointKind.uniform ? 1 : 0;
  });
  const alive = new Uint8Array(m).fill(1);
  const co = new Float64Array(m);
  const cg = new Float64Array(m);
  const moves: Move[] = [];
  for (;;) {
    let best: { dim: number; side: Side; value: number; ratio: number; volume: number } | undefined;
    let obstaclesLeft = 0;
    for (let p = 0; p < m; p++) obstaclesLeft += alive[p]! & obstacle[p]!;
    if (obstaclesLeft === 0) break;
    for (let i = 0; i < d; i++) {
      if (!(hi[i]! > lo[i]!)) continue;
      let k = 0;
      let g = 0;
      for (let p = 0; p < m; p++) {
        if (!alive[p]) continue;
        if (obstacle[p]) co[k++] = x[p * d + i]!;
        else if (uniform[p]) cg[g++] = x[p * d + i]!;
      }
      // typed-array sort without a comparator is numeric and native
      co.subarray(0, k).sort();
      cg.subarray(0, g).sort();
      const stride = Math.max(1, Math.floor(k / CUTS_PER_FACE));
      for (const side of ['lo', 'hi'] as const) {
        for (let j = 0; j < k; j = j === k - 1 ? k : Math.min(k - 1, j + stride)) {
          const value = cutPast(co, k, side === 'lo' ? co[j]! : co[k - 1 - j]!, side, lo[i]!, hi[i]!, limits[i]!);
          if (value === undefined) continue;
          const removed = side === 'lo' ? countBelow(co, k, value) : k - countAtOrBelow(co, k, value);
          const lost = side === 'lo' ? countBelow(cg, g, value) : g - countAtOrBelow(cg, g, value);
          const ratio = (lost + CUT_LOSS_PRIOR) / removed;
          const volume = (side === 'lo' ? value - lo[i]! : hi[i]! - value) / (hi[i]! - lo[i]!);
          if (best === undefined || ratio < best.ratio || (ratio === best.ratio && volume < best.volume)) {
            best = { dim: i, side, value, ratio, volume };
          }
        }
      }
    }
    if (best === undefined) return { slabs: [] };
    const { dim, side, value } = best;
    if (side === 'lo') lo[dim] = value;
    else hi[dim] = value;
    const earlier = moves.find((mv) => mv.dim === dim && mv.side === side);
    if (earlier) earlier.value = value;
    else moves.push({ dim, side, value });
    for (let p = 0; p < m; p++) {
      const v = x[p * d + dim]!;
      if (alive[p] && (v < lo[dim]! || v > hi[dim]!)) alive[p] = 0;
    }
  }
  const main: Box = Array.from(lo, (v, i) => [v, hi[i]!] as const);
  const slabs: Box[] = [];
  const cur = region.map((b) => [b[0], b[1]] as [number, number]);
  for (const { dim, side, value } of moves) {
    const slab = cur.map((b) => [b[0], b[1]] as const);
    slab[dim] = side === 'lo' ? [cur[dim]![0], value] : [value, cur[dim]![1]];
    slabs.push(slab);
    cur[dim]![side === 'lo' ? 0 : 1] = value;
  }
  return { main, slabs };
}

/**
 * The readable cut past obstacle coordinate c that also keeps the clearance from every obstacle
 * it removes: a rounder value may pass c's neighbours by less than the clearance, so the cut is
 * taken again past the nearest obstacle on the far side of it until none is within the clearance.
 * @param co the first k entries: obstacle coordinates, ascending
 */
function cutPast(co: Float64Array, k: number, c: number, side: Side, lo: number, hi: number, limits: ReadableCutLimits): number | undefined {
  let past = c;
  let value = readableCut(past, side, lo, hi, limits);
  while (value !== undefined) {
    // the removed obstacle nearest the cut: last below it (lo side) or first above it (hi side)
    const t = side === 'lo' ? countBelow(co, k, value) - 1 : countAtOrBelow(co, k, value);
    if (t < 0 || t >= k) return value;
    const near = co[t]!;
    // `past` only moves outward, over finitely many obstacles: the loop ends; a gap short of the
    // clearance by rounding alone (near === past) is accepted
    const further = side === 'lo' ? near > past : near < past;
    if (!further || Math.abs(value - near) >= limits.clearance) return value;
    past = near;
    value = readableCut(past, side, lo, hi, limits);
  }
  return undefined;
}

/** Number of the first n entries of an ascending array below v. */
function countBelow(a: Float64Array, n: number, v: number): number {
  let l = 0;
  let h = n;
  while (l < h) {
    const m = (l + h) >> 1;
    if (a[m]! < v) l = m + 1;
    else h = m;
  }
  return l;
}

/** Number of the first n entries of an ascending array at or below v. */
function countAtOrBelow(a: Float64Array, n: number, v: number): number {
  let l = 0;
  let h = n;
  while (l < h) {
    const m = (l + h) >> 1;
    if (a[m]! <= v) l = m + 1;
    else h = m;
  }
  return l;
}

function inside(x: Float64Array, r: number, d: number, lo: Float64Array, hi: Float64Array): boolean {
  for (let i = 0; i < d; i++) {
    const v = x[r * d + i]!;
    if (v < lo[i]! || v > hi[i]!) return false;
  }
  return true;
}
