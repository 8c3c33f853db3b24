import type { Evidence } from '../types.js';
import { clopperPearsonInterval } from '../check/index.js';
import type { RegressionVerdict } from './diff-result.js';

/**
 * How many times higher a refuted rule's violation rate must clearly be on the new model to be
 * called degraded. Retraining moves every boundary a little, so rates of refuted rules wobble by
 * tens of percent between versions; "at least doubled" separates a rule the new model breaks
 * much more often from that noise. Choice of this project, no source.
 */
export const DEGRADED_FACTOR = 2;

/**
 * True when the violation rate of `after` is clearly at least DEGRADED_FACTOR times that of
 * `before`: the lower end of the after rate's exact two-sided Clopper–Pearson interval (Clopper &
 * Pearson, Biometrika 26(4), 1934) exceeds DEGRADED_FACTOR times the upper end of the before
 * rate's, each at its evidence's confidence. Comparing interval ends is conservative (stricter
 * than a test of the ratio itself).
 */
export function clearlyHigherRate(before: Evidence, after: Evidence): boolean {
  if (before.samples === 0 || after.samples === 0) return false;
  const b = clopperPearsonInterval(before.violations, before.samples, before.confidence);
  const a = clopperPearsonInterval(after.violations, after.samples, after.confidence);
  return a.lower > DEGRADED_FACTOR * b.upper;
}

/**
 * Classifies what became of a rule between two models from its evidence on each (see
 * `RegressionVerdict`). A rule holds when it is not refuted: `sampled` and `unknown` both mean
 * no violation was found, only with weaker evidence than `proven`.
 */
export function regressionVerdict(before: Evidence, after: Evidence): RegressionVerdict {
  const heldBefore = before.status !== 'refuted';
  const holdsAfter = after.status !== 'refuted';
  if (!heldBefore) {
    if (holdsAfter) return 'fixed';
    return clearlyHigherRate(before, after) ? 'degraded' : 'still-refuted';
  }
  if (!holdsAfter) return 'broken';
  if (before.status === 'proven' && after.status !== 'proven') return 'no-longer-proven';
  return 'kept';
}
