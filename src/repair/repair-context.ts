import type { Decision, Normalization } from '../types.js';
import type { Box, ConfirmFn, Network, ProveResult } from '../prove/index.js';
import { proveBox } from '../prove/index.js';
import type { Rng } from '../sampling/index.js';
import { type GuidePoints, PointKind, appendPointsInPlace } from './guide-points.js';
import type { ReadableCutLimits } from './readable-cut.js';

/** What the repair is doing, for progress displays and measurements (see RepairOptions.onEvent). */
export type RepairEvent =
  | { readonly kind: 'plan'; readonly box: Box; readonly share: number; readonly strikes: number; readonly slabs: number; readonly main?: Box }
  | { readonly kind: 'search'; readonly box: Box; readonly violations: number }
  | { readonly kind: 'proof'; readonly box: Box; readonly status: ProveResult['status']; readonly pieces: number; readonly provenVolumeFraction: number }
  | { readonly kind: 'drop'; readonly box: Box; readonly share: number };

/** What one repair shares between its steps: the network, budgets, clock and the points seen. */
export interface RepairContext {
  readonly net: Network;
  readonly ruleBox: Box;
  readonly allowed: readonly number[];
  readonly allowedSet: ReadonlySet<number>;
  readonly decision: Decision;
  readonly normalize?: Normalization;
  readonly confirm: ConfirmFn;
  readonly now: () => number;
  /** Clock reading (ms) after which no new proof starts. */
  readonly deadline: number;
  readonly maxBoxesPerProof: number;
  /** Pieces all proofs together may bound (Infinity: only the clock limits). */
  readonly maxPieces: number;
  /** Regions the repair may take from its work list (Infinity: no limit). */
  readonly maxSteps: number;
  /** Regions taken so far. */
  steps: number;
  /**
   * Pieces proven so far for this rule's allowed set (earlier proofs of this repair, and any the
   * caller passed): each proof accepts the part of its box inside them without bounding it.
   */
  readonly known: Box[];
  readonly limits: readonly ReadableCutLimits[];
  readonly rng: Rng;
  readonly points: GuidePoints;
  readonly onEvent?: (event: RepairEvent) => void;
  /** Pieces bounded by every proof so far. */
  pieces: number;
  /** Proofs run so far (all outcomes). */
  attempts: number;
}

/** Milliseconds left before the deadline (0 when past it). */
export function timeLeft(ctx: RepairContext): number {
  return Math.max(0, ctx.deadline - ctx.now());
}

/** Whether another step or proof may start: time, a whole piece and a step left. */
export function budgetLeft(ctx: RepairContext): boolean {
  return timeLeft(ctx) > 0 && Math.floor(ctx.maxPieces - ctx.pieces) >= 1 && ctx.steps < ctx.maxSteps;
}

/**
 * Labels m points (m × d, scenario units) with the runtime through `confirm` and adds them to the
 * context's points: a violation where the runtime's advisory is not allowed, else `goodKind`.
 * @returns how many violations were found
 */
export async function addLabelledPoints(ctx: RepairContext, x: Float64Array, m: number, goodKind: number): Promise<number> {
  if (m === 0) return 0;
  const advisory = await ctx.confirm(x, m);
  const kind = new Uint8Array(m);
  let violations = 0;
  for (let r = 0; r < m; r++) {
    const bad = !ctx.allowedSet.has(advisory[r]!);
    kind[r] = bad ? PointKind.violation : goodKind;
    if (bad) violations++;
  }
  appendPointsInPlace(ctx.points, x, kind, m);
  return violations;
}

/**
 * Runs proveBox on exactly `box` with the per-proof budget (no more than the pieces left) and the
 * time left, reusing the pieces proven so far (`ctx.known`); counts its pieces and adds the
 * pieces it proved to `ctx.known` (a proven box replaces the known pieces inside it). With
 * `mapBoxes` the proof maps the box instead, with that piece budget: it goes on past
 * counterexamples (proveBox's `keepGoing`).
 */
export async function proveIn(ctx: RepairContext, box: Box, mapBoxes?: number): Promise<ProveResult> {
  const maxBoxes = mapBoxes ?? ctx.maxBoxesPerProof;
  const result = await proveBox(ctx.net, box, ctx.allowed, ctx.decision, {
    keepGoing: mapBoxes !== undefined,
    maxBoxes: Math.max(0, Math.floor(Math.min(maxBoxes, ctx.maxPieces - ctx.pieces))),
    maxSeconds: timeLeft(ctx) / 1000,
    now: ctx.now,
    confirm: ctx.confirm,
    known: ctx.known,
    ...(ctx.normalize !== undefined ? { normalize: ctx.normalize } : {}),
  });
  ctx.pieces += result.pieces;
  ctx.attempts++;
  if (result.status === 'proven') {
    const outside = ctx.known.filter((k) => !boxInside(k, box));
    ctx.known.length = 0;
    ctx.known.push(...outside, box);
  } else {
    for (let k = result.reused ?? 0; k < result.provenBoxes.length; k++) ctx.known.push(result.provenBoxes[k]!);
  }
  return result;
}

/** Whether closed box a lies inside closed box b. */
function boxInside(a: Box, b: Box): boolean {
  return a.every(([lo, hi], i) => lo >= b[i]![0] && hi <= b[i]![1]);
}
