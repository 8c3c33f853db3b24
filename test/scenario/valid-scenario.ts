/** A valid scenario object for tests to copy and spoil one field at a time. */
export function validScenario(): Record<string, unknown> {
  return {
    name: 'survey-boat',
    title: 'Collision-avoidance advisory',
    model: 'model.onnx',
    decision: 'argmax',
    inputs: [
      { name: 'cpa_nm', unit: 'nmi', min: 0, max: 1.5, description: 'distance at closest point of approach' },
      { name: 'tcpa_min', unit: 'min', min: -2, max: 20, description: 'time to closest point of approach' },
      { name: 'bearing_deg', unit: 'deg', min: -180, max: 180 },
    ],
    advisories: ['keep_course', 'starboard_small', 'port_small'],
    normalize: { offset: [0, 9, 0], scale: [1.5, 11, 180] },
  };
}
