import type { InputSpec, Rule } from '../types.js';
import { formatNumber } from './format-number.js';
import { formatRule } from './format-rule.js';

/**
 * A whole rule file: one header comment naming the inputs (with domain and unit) and the
 * advisories, then one `formatRule` line per rule, in the given order, newline-terminated.
 * `parseRules` reads the result back to the same boxes, allowed sets and ids.
 *
 * @example
 * # inputs: cpa_nm [0, 1.5] nmi, tcpa_min [-2, 20] min; advisories: keep_course, slow_down
 * R1: when cpa_nm >= 1 expect keep_course
 */
export function formatRules(rules: readonly Rule[], inputs: readonly InputSpec[], advisories: readonly string[]): string {
  const domain = inputs
    .map((i) => `${i.name} [${formatNumber(i.min)}, ${formatNumber(i.max)}]${i.unit === '' ? '' : ` ${i.unit}`}`)
    .join(', ');
  const header = `# inputs: ${domain}; advisories: ${advisories.join(', ')}`;
  return [header, ...rules.map((r) => formatRule(r, inputs, advisories))].join('\n') + '\n';
}
