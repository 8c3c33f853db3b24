import type { InputSpec } from '../../src/types.js';

/** The survey-boat scenario's inputs and advisories as DESIGN.md lists them. */
export const BOAT_INPUTS: readonly InputSpec[] = [
  { name: 'cpa_nm', unit: 'nmi', min: 0, max: 1.5, description: 'distance at closest point of approach' },
  { name: 'tcpa_min', unit: 'min', min: -2, max: 20, description: 'time to closest point of approach' },
  { name: 'bearing_deg', unit: 'deg', min: -180, max: 180, description: 'relative bearing of the other vessel' },
  { name: 'rel_course_deg', unit: 'deg', min: -180, max: 180, description: "other's course minus own" },
  { name: 'own_speed_kn', unit: 'kn', min: 0, max: 10, description: 'own speed through the water' },
];

export const BOAT_ADVISORIES: readonly string[] = ['keep_course', 'starboard_small', 'starboard_large', 'slow_down', 'port_small'];
