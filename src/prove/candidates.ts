import type { Decision, Normalization } from '../types.js';
import type { Network } from './network.js';
import { decide, forward } from './forward.js';
import { toNetworkInput } from './input-box.js';

/** A point where the rule fails, confirmed by the runtime. */
export interface ProofCounterexample {
  /** Inputs in scenario units. */
  readonly x: readonly number[];
  /** Advisory the runtime (the confirm callback) gave there. */
  readonly advisory: number;
  /** Scores of the float64 forward pass over the layer list (the runtime's differ by rounding). */
  readonly scores: readonly number[];
}

/** Runs the model on n points in scenario units (n × d) and returns the advisory per point. */
export type ConfirmFn = (points: Float64Array, n: number) => Promise<Int32Array>;

/**
 * Screens candidate points with the TypeScript forward pass, sends to `confirm` (the runtime)
 * those it finds outside the allowed set or within `screen[r]` of it (the float32 allowance:
 * there the runtime's rounding may decide), and returns the first point the runtime confirms.
 *
 * @param points n × d candidate points in scenario units (not changed)
 * @param screen per point, the forward-pass margin at or below which the runtime is asked
 */
export async function confirmCandidates(
  net: Network,
  points: Float64Array,
  n: number,
  allowed: ReadonlySet<number>,
  decision: Decision,
  normalize: Normalization | undefined,
  confirm: ConfirmFn,
  screen: ArrayLike<number>,
): Promise<ProofCounterexample | undefined> {
  if (n === 0) return undefined;
  const d = net.inputSize;
  const k = net.outputSize;
  const scores = forward(net, toNetworkInput(points, n, d, normalize), n);
  const adv = decide(scores, n, k, decision);
  const sign = decision === 'argmax' ? 1 : -1;
  const suspects: number[] = [];
  for (let r = 0; r < n; r++) {
    // margin = best allowed score − best rival score (signs flipped for argmin)
    let bestIn = -Infinity;
    let bestOut = -Infinity;
    for (let j = 0; j < k; j++) {
      const v = sign * scores[r * k + j]!;
      if (allowed.has(j)) bestIn = Math.max(bestIn, v);
      else bestOut = Math.max(bestOut, v);
    }
    if (!allowed.has(adv[r]!) || bestIn - bestOut <= screen[r]!) suspects.push(r);
  }
  if (suspects.length === 0) return undefined;
  const batch = new Float64Array(suspects.length * d);
  suspects.forEach((r, t) => batch.set(points.subarray(r * d, r * d + d), t * d));
  const confirmed = await confirm(batch, suspects.length);
  for (let t = 0; t < suspects.length; t++) {
    if (!allowed.has(confirmed[t]!)) {
      const r = suspects[t]!;
      return {
        x: Array.from(points.subarray(r * d, r * d + d)),
        advisory: confirmed[t]!,
        scores: Array.from(scores.subarray(r * k, r * k + k)),
      };
    }
  }
  return undefined;
}
