import type { Decision } from '../types.js';

/**
 * How far the network's winning advisory is ahead of the best allowed advisory at one sample,
 * in score units: > 0 exactly when the sample violates the rule (the winner is not allowed),
 * 0 or less when an allowed advisory wins. Used to pick the worst counterexample.
 *
 * For argmax: max over all scores − max over allowed scores. For argmin: min over allowed
 * scores − min over all scores.
 *
 * @param scores n × k score matrix, row-major
 * @param row sample index
 * @param k number of advisories
 * @param allowedMask allowedMask[j] = 1 when advisory j is allowed
 */
export function violationMargin(
  scores: Float32Array,
  row: number,
  k: number,
  allowedMask: Uint8Array,
  decision: Decision,
): number {
  const base = row * k;
  let bestAll = scores[base]!;
  let bestAllowed = decision === 'argmax' ? -Infinity : Infinity;
  for (let j = 0; j < k; j++) {
    const s = scores[base + j]!;
    if (decision === 'argmax') {
      if (s > bestAll) bestAll = s;
      if (allowedMask[j] === 1 && s > bestAllowed) bestAllowed = s;
    } else {
      if (s < bestAll) bestAll = s;
      if (allowedMask[j] === 1 && s < bestAllowed) bestAllowed = s;
    }
  }
  return decision === 'argmax' ? bestAll - bestAllowed : bestAllowed - bestAll;
}
