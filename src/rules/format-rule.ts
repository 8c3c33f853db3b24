import { ToolError } from '../errors.js';
import type { InputSpec, Rule } from '../types.js';
import { formatNumber } from './format-number.js';

/**
 * One rule as a line of a rule file (docs/formats.md, "Rule files"):
 * `R2: when cpa_nm <= 0.5 and bearing_deg in [6, 112.5] expect starboard_large`.
 *
 * Per input, in scenario order: nothing when the interval is the whole domain; `name >= a` when
 * only the lower end differs from the domain; `name <= b` when only the upper end does;
 * `name in [a, b]` otherwise. Boxes are closed, so `<=`/`>=` are printed (a rule file may say
 * `<`, read as `<=`). A rule without conditions prints `always expect …`; several allowed
 * advisories are joined with ` or `. Numbers print shortest-round-trip (`formatNumber`), so
 * `parseRules` reads back exactly the same box.
 *
 * @throws ToolError `RULES_SHAPE` when the box or an advisory index does not fit the scenario
 */
export function formatRule(rule: Rule, inputs: readonly InputSpec[], advisories: readonly string[]): string {
  if (rule.box.length !== inputs.length) {
    throw new ToolError('RULES_SHAPE', `rule ${rule.id}: box has ${rule.box.length} intervals, scenario has ${inputs.length} inputs`);
  }
  const conditions: string[] = [];
  for (let f = 0; f < inputs.length; f++) {
    const { name, min, max } = inputs[f]!;
    const [lo, hi] = rule.box[f]!;
    const cutLo = lo !== min;
    const cutHi = hi !== max;
    if (cutLo && cutHi) conditions.push(`${name} in [${formatNumber(lo)}, ${formatNumber(hi)}]`);
    else if (cutLo) conditions.push(`${name} >= ${formatNumber(lo)}`);
    else if (cutHi) conditions.push(`${name} <= ${formatNumber(hi)}`);
  }
  const names = rule.allowed.map((a) => {
    const name = advisories[a];
    if (name === undefined) {
      throw new ToolError('RULES_SHAPE', `rule ${rule.id}: advisory index ${a}, scenario has ${advisories.length} advisories`);
    }
    return name;
  });
  const head = rule.id === '' ? '' : `${rule.id}: `;
  const when = conditions.length === 0 ? 'always' : `when ${conditions.join(' and ')}`;
  return `${head}${when} expect ${names.join(' or ')}`;
}
