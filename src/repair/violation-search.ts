import type { Box } from '../prove/index.js';
import { forward, toNetworkInput } from '../prove/index.js';
import { PointKind } from './guide-points.js';
import { type RepairContext, addLabelledPoints } from './repair-context.js';

/** Starting points of the local search: the allowed points of least margin. */
export const SEARCH_STARTS = 16;
/** Pattern-search rounds per start; the step halves on every round without progress. */
export const SEARCH_ROUNDS = 24;
/** First step of the pattern search, as a share of the region's width per input. */
export const SEARCH_FIRST_STEP = 0.25;

/**
 * How far ahead of every rival the best allowed advisory is at each row, in score units
 * (positive: allowed; negative: a rival wins). Signs are flipped for argmin.
 */
export function allowedMargin(ctx: RepairContext, x: Float64Array, n: number): Float64Array {
  const d = ctx.ruleBox.length;
  const k = ctx.net.outputSize;
  const scores = forward(ctx.net, toNetworkInput(x, n, d, ctx.normalize), n);
  const sign = ctx.decision === 'argmax' ? 1 : -1;
  const margin = new Float64Array(n);
  for (let r = 0; r < n; r++) {
    let bestIn = -Infinity;
    let bestOut = -Infinity;
    for (let j = 0; j < k; j++) {
      const v = sign * scores[r * k + j]!;
      if (ctx.allowedSet.has(j)) bestIn = Math.max(bestIn, v);
      else bestOut = Math.max(bestOut, v);
    }
    margin[r] = bestIn - bestOut;
  }
  return margin;
}

/**
 * Looks for violations the screening points missed, before a proof is spent on the region: a
 * compass (pattern) search (R. Hooke & T. A. Jeeves, "Direct search solution of numerical and
 * statistical problems", Journal of the ACM 8(2), 1961; V. Torczon, "On the convergence of
 * pattern search algorithms", SIAM Journal on Optimization 7(1), 1997) on the allowed margin of
 * the float64 forward pass, from the `starts` of least margin, moving one input at a time and
 * staying inside the region (faces included, where violations of a cut box usually sit). Points
 * the forward pass finds outside the allowed set are labelled by the runtime and added; only
 * those the runtime confirms become violations.
 *
 * @param starts m × d points in the region (not changed)
 * @returns the violations the runtime confirmed (row-major, d per point; empty when none)
 */
export async function searchViolations(ctx: RepairContext, region: Box, starts: Float64Array, m: number): Promise<Float64Array> {
  const d = region.length;
  if (m === 0) return new Float64Array(0);
  const cur = Float64Array.from(starts.subarray(0, m * d));
  const curMargin = allowedMargin(ctx, cur, m);
  const step = new Float64Array(m * d);
  for (let s = 0; s < m; s++) for (let i = 0; i < d; i++) step[s * d + i] = SEARCH_FIRST_STEP * (region[i]![1] - region[i]![0]);
  const trial = new Float64Array(m * 2 * d * d);
  const suspects: number[] = [];
  for (let round = 0; round < SEARCH_ROUNDS; round++) {
    for (let s = 0; s < m; s++) {
      for (let t = 0; t < 2 * d; t++) {
        const row = (s * 2 * d + t) * d;
        trial.set(cur.subarray(s * d, s * d + d), row);
        const i = t >> 1;
        const v = cur[s * d + i]! + (t & 1 ? -1 : 1) * step[s * d + i]!;
        trial[row + i] = Math.min(region[i]![1], Math.max(region[i]![0], v));
      }
    }
    const margin = allowedMargin(ctx, trial, m * 2 * d);
    for (let s = 0; s < m; s++) {
      if (curMargin[s]! < 0) continue;
      let best = -1;
      for (let t = 0; t < 2 * d; t++) {
        const q = s * 2 * d + t;
        if (margin[q]! < curMargin[s]! && (best < 0 || margin[q]! < margin[best]!)) best = q;
      }
      if (best < 0) {
        for (let i = 0; i < d; i++) step[s * d + i]! *= 0.5;
        continue;
      }
      cur.set(trial.subarray(best * d, best * d + d), s * d);
      curMargin[s] = margin[best]!;
      if (margin[best]! < 0) suspects.push(s);
    }
  }
  if (suspects.length === 0) return new Float64Array(0);
  const x = new Float64Array(suspects.length * d);
  suspects.forEach((s, k) => x.set(cur.subarray(s * d, s * d + d), k * d));
  const first = ctx.points.n;
  await addLabelledPoints(ctx, x, suspects.length, PointKind.other);
  const found: number[] = [];
  for (let r = first; r < ctx.points.n; r++) {
    if (ctx.points.kind[r] === PointKind.violation) for (let i = 0; i < d; i++) found.push(ctx.points.x[r * d + i]!);
  }
  return Float64Array.from(found);
}

/** Rows of the m points of least margin among the allowed ones (margin >= 0), at most `count`. */
export function leastMarginRows(margin: Float64Array, count: number): number[] {
  const rows: number[] = [];
  for (let r = 0; r < margin.length; r++) if (margin[r]! >= 0) rows.push(r);
  rows.sort((a, b) => margin[a]! - margin[b]! || a - b);
  return rows.slice(0, count);
}
