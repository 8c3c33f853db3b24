/**
 * The expert policy of the survey-boat scenario: which collision-avoidance advisory a 9 m
 * uncrewed hydrographic survey boat should take against one other power-driven vessel, written
 * as a short decision list over axis-aligned thresholds on the five inputs. The demo network is
 * trained on this function and nothing else.
 *
 * Inputs, in order (x[0..4]):
 *   cpa_nm          [0, 1.5]    distance at the closest point of approach (nmi)
 *   tcpa_min        [-2, 20]    time to the closest point of approach (min; < 0: already past)
 *   bearing_deg     [-180, 180] relative bearing of the other vessel (+ starboard, 0 dead ahead)
 *   rel_course_deg  [-180, 180] other's course minus own course (0 same course, ±180 reciprocal)
 *   own_speed_kn    [0, 10]     own speed through the water (kn)
 *
 * Rule references are to the International Regulations for Preventing Collisions at Sea
 * (COLREGs), IMO, 1972, as amended; wording is paraphrased. The rules give no numbers for risk
 * of collision, the head-on sector or the size of an alteration: every such figure below is a
 * configurable setting marked "common practice" (see SURVEY_BOAT_POLICY_DEFAULTS). The 112.5°
 * sector of Rule 13 is in the rule itself.
 *
 * Simplification, stated once: the true encounter roles depend on each vessel's bearing as seen
 * from the other (bearing minus relative course), which is not an axis-aligned quantity. The
 * policy approximates them with sectors of bearing and of relative course separately, as a
 * watchkeeper's quick classification would; it is a demo policy, not a navigation aid.
 */

/** Advisory indices, in the network's output order. */
export const ADVISORIES = ['keep_course', 'starboard_small', 'starboard_large', 'slow_down', 'port_small'] as const;
export const KEEP_COURSE = 0;
export const STARBOARD_SMALL = 1;
export const STARBOARD_LARGE = 2;
export const SLOW_DOWN = 3;
export const PORT_SMALL = 4;

/**
 * Rule 13(b): a vessel is overtaking when she comes up from more than 22.5° abaft the other's
 * beam, i.e. from a relative bearing beyond 90° + 22.5° = 112.5° on either side. From the rule.
 */
export const ABAFT_BEAM_DEG = 112.5;

/** Tunable figures of the policy; none of them is fixed by the Rules. */
export interface SurveyBoatPolicySettings {
  /** No risk of collision when the CPA is at least this (nmi). */
  readonly cpaLimitNm: number;
  /** Look-ahead window: encounters with a larger TCPA are not acted on yet (min). */
  readonly tcpaWindowMin: number;
  /** "Close": CPA below this (nmi) ... */
  readonly cpaCloseNm: number;
  /** ... or TCPA below this (min). "Very close": both at once. */
  readonly tcpaCloseMin: number;
  /** The other is "ahead or nearly ahead" within ± this relative bearing (deg). */
  readonly aheadSectorDeg: number;
  /** Courses are "nearly reciprocal" within ± this of 180° (deg). */
  readonly reciprocalToleranceDeg: number;
  /** Courses are "similar" (an overtaking) within ± this (deg). */
  readonly similarCourseDeg: number;
  /** Own vessel is making way (can overtake, can usefully slow down) at or above this (kn). */
  readonly minSpeedKn: number;
}

/**
 * Default settings. All are common practice, no authoritative source ([P] in the project's
 * check-value notes), chosen for a small, slow boat in busy coastal water:
 * - cpaLimitNm 1.0: about 1 nmi is the outer limit of close quarters for vessels in sight of one
 *   another (Cockcroft & Lameijer, A Guide to the Collision Avoidance Rules, comment on Rule 8);
 *   company settings of 0.5–2 nmi are common.
 * - tcpaWindowMin 18: operators' CPA/TCPA alarm windows are typically 12–30 min; 18 min also
 *   makes the risk region (where the Rules ask for a decision) over half of the scenario's box,
 *   which keeps the demo from being mostly keep_course.
 * - cpaCloseNm 0.5, tcpaCloseMin 10: the inner "close" ring; a CPA of 0.4 nmi at a TCPA of 12 min
 *   has been treated as a risk needing action, so half a mile within ten minutes is close.
 * - aheadSectorDeg 22.5 and reciprocalToleranceDeg 22.5: older case law treated only courses
 *   within about 6° of reciprocal as end-on (Cockcroft & Lameijer, comment on Rule 14); the 1972
 *   rule is less limited, Rule 14(c) says "in doubt, assume head-on", and a 9 m boat yawing in a
 *   seaway with noisy target courses cannot resolve 6°. Two compass points (22.5°) on both axes
 *   gives the head-on case a real share of the domain (about 1.6 % of the risk region).
 * - similarCourseDeg 45: with the other within 22.5° of ahead and courses within 45°, own vessel
 *   is always more than 22.5° abaft the other's beam, so the encounter is an overtaking in the
 *   exact geometric sense of Rule 13(b), not only approximately.
 * - minSpeedKn 2: below about 2 kn the boat is loitering on a survey line; it overtakes nobody
 *   and slowing further does not help.
 */
export const SURVEY_BOAT_POLICY_DEFAULTS: SurveyBoatPolicySettings = Object.freeze({
  cpaLimitNm: 1.0,
  tcpaWindowMin: 18,
  cpaCloseNm: 0.5,
  tcpaCloseMin: 10,
  aheadSectorDeg: 22.5,
  reciprocalToleranceDeg: 22.5,
  similarCourseDeg: 45,
  minSpeedKn: 2,
});

/**
 * The expert advisory for one encounter.
 *
 * @param x the five inputs in scenario units, in the order of the file comment
 * @param settings thresholds; defaults to SURVEY_BOAT_POLICY_DEFAULTS
 * @returns the advisory index (0 keep_course … 4 port_small)
 */
export function surveyBoatPolicy(
  x: ArrayLike<number>,
  settings: SurveyBoatPolicySettings = SURVEY_BOAT_POLICY_DEFAULTS,
): number {
  const cpa = x[0]!;
  const tcpa = x[1]!;
  const bearing = x[2]!;
  const relCourse = x[3]!;
  const speed = x[4]!;

  // Rule 7 (risk of collision) and Rule 8(d) (passing at a safe distance): no risk when the CPA
  // is safe, the vessels are opening (CPA already past), or the CPA lies beyond the look-ahead.
  if (cpa >= settings.cpaLimitNm || tcpa < 0 || tcpa > settings.tcpaWindowMin) return KEEP_COURSE;

  const close = cpa < settings.cpaCloseNm || tcpa < settings.tcpaCloseMin;
  const veryClose = cpa < settings.cpaCloseNm && tcpa < settings.tcpaCloseMin;

  // Rule 13(b): the other comes up from more than 22.5° abaft own beam, so she is overtaking
  // and keeps out of the way (13(a)); own vessel stands on (17(a)(i)). Only when very close,
  // Rule 17(b): a small turn away from her (Rule 17(c) forbids only a port turn for a vessel on
  // own port side; turning away also avoids turning towards a vessel abaft the beam, cf. 19(d)).
  if (bearing > ABAFT_BEAM_DEG) return veryClose ? PORT_SMALL : KEEP_COURSE;
  if (bearing < -ABAFT_BEAM_DEG) return veryClose ? STARBOARD_SMALL : KEEP_COURSE;

  const ahead = Math.abs(bearing) <= settings.aheadSectorDeg;
  // Rule 14: meeting on reciprocal or nearly reciprocal courses, other ahead or nearly ahead:
  // alter to starboard. Substantial (Rule 8(b)): a small turn is not readily apparent head-on.
  if (ahead && Math.abs(relCourse) >= 180 - settings.reciprocalToleranceDeg) return STARBOARD_LARGE;

  // Rule 13(a): own vessel overtaking a slower vessel ahead keeps out of her way; either side is
  // allowed, so pass on the side away from her with a small turn: a vessel fine on the starboard
  // bow holding her course or diverging to starboard is passed on her port side (port_small); one
  // on the port bow or dead ahead on her starboard side. A vessel on the starboard bow converging
  // towards own track falls through to Rule 15 below (pass astern of her: starboard).
  if (ahead && Math.abs(relCourse) < settings.similarCourseDeg && speed >= settings.minSpeedKn) {
    if (bearing <= 0) return STARBOARD_SMALL;
    if (relCourse >= 0) return PORT_SMALL;
  }

  // Rule 15: other on own starboard side, crossing: own vessel gives way and avoids crossing
  // ahead of her: turn to starboard. Rule 16 asks for early and substantial action: large when
  // close or when she is nearly ahead (a small turn would not be readily apparent, Rule 8(b)),
  // small otherwise (early action while there is time).
  if (bearing > 0) return ahead || close ? STARBOARD_LARGE : STARBOARD_SMALL;

  // Rule 17(a)(i): other on own port side: she is the give-way vessel; stand on. Rule 17(a)(ii)
  // and (b): act only when very close. Rule 17(c): never alter to port for a vessel on own port
  // side; Rule 8(e): slow down if making way, otherwise a large turn to starboard.
  if (!veryClose) return KEEP_COURSE;
  return speed >= settings.minSpeedKn ? SLOW_DOWN : STARBOARD_LARGE;
}
