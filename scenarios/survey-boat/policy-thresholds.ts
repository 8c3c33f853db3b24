import { ABAFT_BEAM_DEG, SURVEY_BOAT_POLICY_DEFAULTS, type SurveyBoatPolicySettings } from './policy.js';

/** The input box of the scenario, in units, in input order (mirrors scenario.json). */
export const SURVEY_BOAT_BOX: ReadonlyArray<readonly [number, number]> = Object.freeze([
  [0, 1.5],
  [-2, 20],
  [-180, 180],
  [-180, 180],
  [0, 10],
] as const);

/**
 * Every threshold at which surveyBoatPolicy can change its answer, per input, ascending and
 * strictly inside the box. The policy is constant on each open cell of the grid these values
 * cut the box into, which the training script uses to sample near the boundaries and the tests
 * use to compute exact volume shares.
 *
 * @param settings the policy's settings; defaults to SURVEY_BOAT_POLICY_DEFAULTS
 * @returns one ascending array of thresholds per input
 */
export function policyThresholds(
  settings: SurveyBoatPolicySettings = SURVEY_BOAT_POLICY_DEFAULTS,
): number[][] {
  const s = settings;
  const symmetric = (values: number[]): number[] => [...values.map((v) => -v).reverse(), 0, ...values];
  const lists = [
    [s.cpaCloseNm, s.cpaLimitNm],
    [0, s.tcpaCloseMin, s.tcpaWindowMin],
    symmetric([s.aheadSectorDeg, ABAFT_BEAM_DEG]),
    symmetric([s.similarCourseDeg, 180 - s.reciprocalToleranceDeg]),
    [s.minSpeedKn],
  ];
  return lists.map((list, i) => {
    const [lo, hi] = SURVEY_BOAT_BOX[i]!;
    return [...new Set(list)].filter((v) => v > lo && v < hi).sort((a, b) => a - b);
  });
}
