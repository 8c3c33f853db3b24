import Papa from 'papaparse';
import type { RuleTable } from '../types.js';

/**
 * rules.csv: one row a rule. Columns: id, advisory (allowed advisories joined by " or "),
 * `<input>_min`, `<input>_max` for each input, status, samples, violations, bound (one-sided
 * upper bound on the violation rate), confidence, proven_fraction (empty when not proved).
 */
export function rulesCsvText(table: RuleTable): string {
  const fields = ['id', 'advisory'];
  for (const inp of table.inputs) fields.push(`${inp.name}_min`, `${inp.name}_max`);
  fields.push('status', 'samples', 'violations', 'bound', 'confidence', 'proven_fraction');
  const data = table.rules.map(({ rule, evidence }) => {
    const row: Array<string | number> = [rule.id, rule.allowed.map((a) => table.advisories[a]).join(' or ')];
    rule.box.forEach(([lo, hi]) => row.push(lo, hi));
    row.push(
      evidence.status,
      evidence.samples,
      evidence.violations,
      evidence.violationBound,
      evidence.confidence,
      evidence.proof ? evidence.proof.provenFraction : '',
    );
    return row;
  });
  return Papa.unparse({ fields, data }, { newline: '\n' }) + '\n';
}
