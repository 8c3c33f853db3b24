import type { Counterexample, Decision, Evaluator } from '../types.js';
import { violationMargin } from '../check/index.js';

/**
 * Runs the model (onnxruntime) at one point and returns it as a counterexample of a rule with
 * the given allowed advisories, or undefined when the runtime does not confirm a violation
 * there (an allowed advisory wins or ties). Scores are the runtime's own float32 scores.
 */
export async function counterexampleAt(
  x: readonly number[],
  allowed: readonly number[],
  evaluate: Evaluator,
  decision: Decision,
): Promise<Counterexample | undefined> {
  const ev = await evaluate(Float64Array.from(x), 1);
  const k = ev.scores.length;
  const mask = new Uint8Array(k);
  for (const a of allowed) mask[a] = 1;
  const margin = violationMargin(ev.scores, 0, k, mask, decision);
  if (mask[ev.advisory[0]!] === 1 || !(margin > 0)) return undefined;
  return { x: [...x], scores: Array.from(ev.scores.subarray(0, k)), advisory: ev.advisory[0]!, margin };
}
