/**
 * The expert policy of the cruise-spacing scenario: which spacing advisory a delivery van's
 * controller should give behind one lead vehicle, from the time gap and the time to collision.
 * The demo network is trained on this function and nothing else.
 *
 * Inputs, in order (x[0..2]):
 *   gap_m              [0, 120]  clearance to the lead vehicle (m)
 *   own_speed_mps      [0, 30]   own speed (m/s)
 *   closing_speed_mps  [-10, 15] own speed minus lead speed (m/s; > 0: the gap is shrinking)
 *
 * Two derived quantities drive it:
 *   time gap         τ   = gap / own speed               (∞ at standstill)
 *   time to collision TTC = gap / closing speed           (only when closing speed > 0, else ∞)
 * Both are ratios, so the policy's boundaries are planes through the origin (gap = τ·speed,
 * gap = TTC·closing), oblique to the input axes. They are written as products below
 * (gap < τ·speed), which is exact, needs no division and gives ∞ at zero speed for free.
 *
 * Sources of the figures (tags as in the project's check-value notes):
 * - ISO 15622:2018 (Intelligent transport systems — Adaptive cruise control systems —
 *   Performance requirements and test procedures): time gap τ = clearance / own speed; minimum
 *   selectable time gap 0.8 s in steady-state following [from memory]; at least one selectable
 *   time gap between 1.5 s and 2.2 s must be offered [from memory].
 * - NHTSA NCAP "Forward Collision Warning System Confirmation Test" (Feb 2013): the warning
 *   must come no later than TTC 2.1 s with the lead vehicle stopped [seen]; 2.4 s with it
 *   decelerating and 2.0 s with it moving slower [from memory].
 * - Traffic-conflict research [from memory, low confidence, illustration only]: TTC ≤ 1.5 s
 *   marks a serious conflict (van der Horst, 1990); about 4 s separates critical from normal
 *   car-following (Hogema & Janssen, 1996; Hirst & Graham, 1997).
 *
 * A demo policy for an invented setting, not a vehicle controller: no standstill clearance,
 * no acceleration or jerk limits, no sensor model, and a reversing lead vehicle (closing speed
 * above own speed) is treated like any other.
 */

/** Advisory indices, in the network's output order. */
export const ADVISORIES = ['speed_up', 'hold', 'ease_off', 'brake', 'brake_hard'] as const;
export const SPEED_UP = 0;
export const HOLD = 1;
export const EASE_OFF = 2;
export const BRAKE = 3;
export const BRAKE_HARD = 4;

/** The policy's thresholds, in seconds; each is the TTC or time gap below which it acts. */
export interface CruiseSpacingPolicySettings {
  /** TTC below this: brake hard. */
  readonly brakeHardTtcS: number;
  /** TTC below this: brake. */
  readonly brakeTtcS: number;
  /** TTC below this: ease off. */
  readonly easeOffTtcS: number;
  /** Time gap below this: never hold or speed up; brake if closing, else ease off. */
  readonly minTimeGapS: number;
  /** Time gap below this: ease off (the short end of the band the van holds). */
  readonly lowTimeGapS: number;
  /** Time gap above this with the gap not shrinking: speed up (the long end of the band). */
  readonly highTimeGapS: number;
}

/**
 * Default settings, each with its source and tag:
 * - brakeHardTtcS 1.5: TTC ≤ 1.5 s is a "serious" conflict in traffic-conflict research
 *   (van der Horst, 1990) [from memory, low confidence, illustration].
 * - brakeTtcS 2.1: NHTSA's FCW confirmation test requires the warning no later than TTC 2.1 s
 *   for a stopped lead vehicle [seen]; the van brakes by the time a warning would be due. (The
 *   same test's 2.4 s decelerating-lead and 2.0 s slower-lead figures [from memory] bracket it.)
 * - easeOffTtcS 4: about 4 s separates critical from normal car-following (Hogema & Janssen,
 *   1996; Hirst & Graham, 1997) [from memory, low confidence, illustration].
 * - minTimeGapS 0.8: ISO 15622 minimum time gap in steady-state following [from memory].
 * - lowTimeGapS 1.5 and highTimeGapS 2.2: ISO 15622 asks for at least one selectable time gap
 *   in 1.5–2.2 s [from memory]; the van holds its speed while the time gap is in that band.
 */
export const CRUISE_SPACING_POLICY_DEFAULTS: CruiseSpacingPolicySettings = Object.freeze({
  brakeHardTtcS: 1.5,
  brakeTtcS: 2.1,
  easeOffTtcS: 4,
  minTimeGapS: 0.8,
  lowTimeGapS: 1.5,
  highTimeGapS: 2.2,
});

/**
 * The expert advisory for one situation: a decision list, most urgent first.
 *
 * @param x the three inputs in scenario units, in the order of the file comment
 * @param settings thresholds; defaults to CRUISE_SPACING_POLICY_DEFAULTS
 * @returns the advisory index (0 speed_up … 4 brake_hard)
 */
export function cruiseSpacingPolicy(
  x: ArrayLike<number>,
  settings: CruiseSpacingPolicySettings = CRUISE_SPACING_POLICY_DEFAULTS,
): number {
  const gap = x[0]!;
  const speed = x[1]!;
  const closing = x[2]!;
  const s = settings;
  // gap < T·closing is TTC < T when the gap is shrinking (closing > 0); gap < τ·speed is
  // "time gap < τ" and never holds at standstill. Plain products: no division, no allocation.
  const shrinking = closing > 0;

  // Imminent collision: a serious conflict (TTC < 1.5 s), then the FCW deadline (TTC < 2.1 s).
  if (shrinking && gap < s.brakeHardTtcS * closing) return BRAKE_HARD;
  if (shrinking && gap < s.brakeTtcS * closing) return BRAKE;
  // Closer than the ISO 15622 minimum time gap: brake while the gap still shrinks, else let it
  // open by easing off.
  if (gap < s.minTimeGapS * speed) return shrinking ? BRAKE : EASE_OFF;
  // Closing into critical car-following (TTC < 4 s), or following shorter than the band: ease off.
  if ((shrinking && gap < s.easeOffTtcS * closing) || gap < s.lowTimeGapS * speed) return EASE_OFF;
  // Longer than the band and the gap is not shrinking: close up to it.
  if (gap > s.highTimeGapS * speed && !shrinking) return SPEED_UP;
  return HOLD;
}
