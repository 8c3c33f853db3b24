import type { Evidence } from '../types.js';
import type { RegressionVerdict } from './diff-result.js';

/**
 * Classifies what became of a rule between two models from its evidence on each (see
 * `RegressionVerdict`). A rule holds when it is not refuted: `sampled` and `unknown` both mean
 * no violation was found, only with weaker evidence than `proven`.
 */
export function regressionVerdict(before: Evidence, after: Evidence): RegressionVerdict {
  const heldBefore = before.status !== 'refuted';
  const holdsAfter = after.status !== 'refuted';
  if (!heldBefore) return holdsAfter ? 'fixed' : 'still-refuted';
  if (!holdsAfter) return 'broken';
  if (before.status === 'proven' && after.status !== 'proven') return 'no-longer-proven';
  return 'kept';
}
