/** Scenario stage: read and validate scenario.json -> Scenario (format: docs/formats.md). */
export { loadScenario } from './load-scenario.js';
export { safeLoadScenario, type ScenarioResult } from './safe-load-scenario.js';
export { parseScenario } from './parse-scenario.js';
export { MAX_INPUTS } from './validate-inputs.js';
export { MAX_ABS_VALUE } from './field-reader.js';
export { IDENTIFIER, RESERVED_NAMES } from './names.js';
export { SCENARIO_FIELDS } from './validate-scenario.js';
