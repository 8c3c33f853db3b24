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
 * Screens candidate points with the TypeScript forward pass, sends those it finds outside
 * the allowed set to `confirm` (the runtime), and returns the first point both agree on.
 *
 * @param points n × d candidate points in scenario units (not changed)
 */
export async function confirmCandidates(
  net: Network,
  points: Float64Array,
  n: number,
  allowed: ReadonlySet<number>,
  decision: Decision,
  normalize: Normalization | undefined,
  confirm: ConfirmFn,
): Promise<ProofCounterexample | undefined> {
  if (n === 0) return undefined;
  const d = net.inputSize;
  const k = net.outputSize;
  const scores = forward(net, toNetworkInput(points, n, d, normalize), n);
  const adv = decide(scores, n, k, decision);
  const suspects: number[] = [];
  for (let r = 0; r < n; r++) if (!allowed.has(adv[r]!)) suspects.push(r);
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
