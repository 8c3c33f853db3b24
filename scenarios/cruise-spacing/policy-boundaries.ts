import { CRUISE_SPACING_POLICY_DEFAULTS, type CruiseSpacingPolicySettings } from './policy.js';

/** The input box of the scenario, in units, in input order (mirrors scenario.json). */
export const CRUISE_SPACING_BOX: ReadonlyArray<readonly [number, number]> = Object.freeze([
  [0, 120],
  [0, 30],
  [-10, 15],
] as const);

/**
 * A plane where cruiseSpacingPolicy can change its answer: `gap = ratio × x[against]` (a time
 * gap when against is own speed, 1; a TTC when against is the closing speed, 2), or, with
 * against −1, the plane closing speed = 0 where the gap stops shrinking.
 */
export interface PolicyBoundary {
  readonly against: 1 | 2 | -1;
  /** Seconds; 0 for the closing-speed plane. */
  readonly ratio: number;
}

/**
 * Every boundary of the policy: the three TTC planes, the three time-gap planes and the plane
 * of zero closing speed. The training script samples near them (a network needs the most data
 * where the advisory changes) and the tests use them to compute exact volume shares.
 *
 * @param settings the policy's settings; defaults to CRUISE_SPACING_POLICY_DEFAULTS
 */
export function policyBoundaries(settings: CruiseSpacingPolicySettings = CRUISE_SPACING_POLICY_DEFAULTS): PolicyBoundary[] {
  const s = settings;
  return [
    ...[s.brakeHardTtcS, s.brakeTtcS, s.easeOffTtcS].map((ratio) => ({ against: 2 as const, ratio })),
    ...[s.minTimeGapS, s.lowTimeGapS, s.highTimeGapS].map((ratio) => ({ against: 1 as const, ratio })),
    { against: -1 as const, ratio: 0 },
  ];
}
