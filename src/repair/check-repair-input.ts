import { ToolError } from '../errors.js';
import type { Rule } from '../types.js';
import type { Network } from '../prove/index.js';
import type { RepairOptions, RepairScenario } from './repair-rule.js';

/**
 * Checks that a rule fits the scenario and the network and that the repair budgets make sense.
 * @throws ToolError `REPAIR_RULE` or `REPAIR_OPTION`, naming the rule and what was found
 */
export function checkRepairInput(net: Network, rule: Rule, scenario: RepairScenario, options: RepairOptions): void {
  const d = scenario.inputs.length;
  const ruleError = (what: string): ToolError => new ToolError('REPAIR_RULE', `rule ${rule.id}: ${what}`);
  if (net.inputSize !== d || rule.box.length !== d) {
    throw ruleError(`expected ${d} input ranges (scenario) for a network of ${net.inputSize} inputs, found ${rule.box.length}`);
  }
  if (net.outputSize !== scenario.advisories.length) {
    throw ruleError(`network has ${net.outputSize} outputs, scenario lists ${scenario.advisories.length} advisories`);
  }
  rule.box.forEach(([lo, hi], i) => {
    if (!(Number.isFinite(lo) && Number.isFinite(hi) && lo <= hi)) {
      throw ruleError(`${scenario.inputs[i]!.name}: expected finite min <= max, found [${lo}, ${hi}]`);
    }
  });
  if (rule.allowed.length === 0 || rule.allowed.some((a) => !Number.isInteger(a) || a < 0 || a >= scenario.advisories.length)) {
    throw ruleError(`allowed advisories must be indices in 0..${scenario.advisories.length - 1}, found [${rule.allowed.join(', ')}]`);
  }
  const optionError = (name: string, expected: string, found: unknown): ToolError =>
    new ToolError('REPAIR_OPTION', `repair of ${rule.id}: ${name}: expected ${expected}, found ${String(found)}`);
  if (!(options.maxSeconds >= 0)) throw optionError('maxSeconds', 'a number >= 0', options.maxSeconds);
  if (!(Number.isInteger(options.maxBoxesPerProof) && options.maxBoxesPerProof >= 1)) {
    throw optionError('maxBoxesPerProof', 'a whole number >= 1', options.maxBoxesPerProof);
  }
  if (options.maxPieces !== undefined && !(options.maxPieces >= 0)) throw optionError('maxPieces', 'a number >= 0', options.maxPieces);
  if (options.maxSteps !== undefined && !(options.maxSteps >= 0)) throw optionError('maxSteps', 'a number >= 0', options.maxSteps);
  if (options.known !== undefined && options.known.some((b) => b.length !== d)) {
    throw optionError('known', `boxes of ${d} input ranges`, options.known.find((b) => b.length !== d)?.length);
  }
  const { maxSubRules, minVolumeShare, screenPoints, clearanceShare, allowanceShare, samples } = options;
  if (maxSubRules !== undefined && !(Number.isInteger(maxSubRules) && maxSubRules >= 1)) {
    throw optionError('maxSubRules', 'a whole number >= 1', maxSubRules);
  }
  if (minVolumeShare !== undefined && !(minVolumeShare >= 0 && minVolumeShare <= 1)) {
    throw optionError('minVolumeShare', 'a share in [0, 1]', minVolumeShare);
  }
  if (screenPoints !== undefined && !(Number.isInteger(screenPoints) && screenPoints >= 1)) {
    throw optionError('screenPoints', 'a whole number >= 1', screenPoints);
  }
  if (clearanceShare !== undefined && !(clearanceShare > 0 && clearanceShare < 1)) {
    throw optionError('clearanceShare', 'a share in (0, 1)', clearanceShare);
  }
  const clearance = clearanceShare ?? 0;
  if (allowanceShare !== undefined && !(allowanceShare > clearance && allowanceShare <= 1)) {
    throw optionError('allowanceShare', `a share in (clearanceShare, 1]`, allowanceShare);
  }
  if (samples !== undefined && (samples.d !== d || samples.x.length < samples.n * d || samples.advisory.length < samples.n)) {
    throw optionError('samples', `${d} inputs and n rows of x and advisory`, `${samples.d} inputs, ${samples.x.length / Math.max(1, samples.d)} rows, ${samples.advisory.length} labels`);
  }
}
