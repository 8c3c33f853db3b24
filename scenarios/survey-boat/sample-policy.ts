import { surveyBoatPolicy } from './policy.js';
import { policyThresholds, SURVEY_BOAT_BOX } from './policy-thresholds.js';

/** How many samples to draw, and where. */
export interface PolicySampleOptions {
  /** Samples uniform over the whole box. */
  readonly uniform: number;
  /**
   * Samples near the policy's thresholds: one input is placed within ± nearWidth × its range of
   * one of its thresholds (chosen at random), the others uniform over the box.
   */
  readonly nearThreshold: number;
  /** Half-width of the band around a threshold, as a fraction of the input's range. */
  readonly nearWidth: number;
}

/** Labelled samples of the expert policy, in scenario units. */
export interface PolicySamples {
  readonly n: number;
  readonly d: number;
  /** n × d, row-major, scenario units. */
  readonly x: Float64Array;
  /** The policy's advisory per row. */
  readonly labels: Int32Array;
}

/**
 * Draws inputs over the survey-boat box and labels them with surveyBoatPolicy. The uniform part
 * covers the whole domain in proportion to volume; the near-threshold part puts extra weight
 * where the advisory changes, which is where a network needs the most data to place its
 * boundaries (sampling the decision boundary densely is standard practice when distilling a
 * rule into a network; no single source).
 *
 * @param options sample counts and band width
 * @param rng uniform random source on [0, 1)
 * @returns the samples, uniform rows first
 */
export function samplePolicy(options: PolicySampleOptions, rng: () => number): PolicySamples {
  const d = SURVEY_BOAT_BOX.length;
  const n = options.uniform + options.nearThreshold;
  const x = new Float64Array(n * d);
  const labels = new Int32Array(n);
  const thresholds = policyThresholds();
  const row = new Float64Array(d);
  for (let r = 0; r < n; r++) {
    for (let j = 0; j < d; j++) {
      const [lo, hi] = SURVEY_BOAT_BOX[j]!;
      row[j] = lo + (hi - lo) * rng();
    }
    if (r >= options.uniform) {
      const j = Math.floor(rng() * d);
      const list = thresholds[j]!;
      const [lo, hi] = SURVEY_BOAT_BOX[j]!;
      const t = list[Math.floor(rng() * list.length)]!;
      const v = t + (2 * rng() - 1) * options.nearWidth * (hi - lo);
      row[j] = Math.min(hi, Math.max(lo, v));
    }
    x.set(row, r * d);
    labels[r] = surveyBoatPolicy(row);
  }
  return { n, d, x, labels };
}
