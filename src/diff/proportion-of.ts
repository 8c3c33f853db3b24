import type { Proportion } from '../types.js';
import { clopperPearsonInterval } from '../check/index.js';

/**
 * k successes in n trials as a proportion with its exact two-sided interval (Clopper & Pearson,
 * "The use of confidence or fiducial limits illustrated in the case of the binomial",
 * Biometrika 26(4), 1934). With n = 0 the value is NaN and the interval the whole [0, 1].
 */
export function proportionOf(k: number, n: number, confidence: number): Proportion {
  if (n === 0) return { value: NaN, lower: 0, upper: 1, n };
  const { lower, upper } = clopperPearsonInterval(k, n, confidence);
  return { value: k / n, lower, upper, n };
}
