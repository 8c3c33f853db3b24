import type { RuleTable } from '../../types.js';
import { cautionsText } from '../cautions.js';

/**
 * CAUTIONS.txt, written beside every rules.csv export: CSV has no comment syntax that every
 * reader accepts, so the cautions, the provenance and the meaning of the columns travel in this
 * companion file, and rules.csv itself stays plain data that any spreadsheet opens.
 */
export function cautionsTxt(table: RuleTable): string {
  const m = table.manifest;
  const inputs = table.inputs.map((i) => `  ${i.name}_min, ${i.name}_max: the rule's closed interval of ${i.name}, in ${i.unit || 'its units'} (domain [${i.min}, ${i.max}])`);
  return [
    cautionsText(),
    '',
    'PROVENANCE',
    `- model: ${m.model.path}`,
    `  SHA-256 ${m.model.sha256}`,
    `- scenario: ${m.scenario.path} (${m.scenario.name})`,
    `  SHA-256 ${m.scenario.sha256}`,
    `- ${m.tool} ${m.toolVersion}, command "${m.command}", seed ${m.seed}, ${m.date}`,
    '',
    'COLUMNS OF rules.csv (one row a rule: inputs in the box => the network gives an allowed advisory)',
    '  id: the rule',
    `  advisory: the allowed advisories, joined by " or " (decision: ${table.decision} of the scores)`,
    ...inputs,
    '  status: proven | sampled | refuted | unknown',
    '  samples, violations: dense samples drawn inside the box, and how many gave another advisory',
    '  bound: one-sided exact (Clopper-Pearson) upper bound on the violation rate, at the stated confidence',
    '  confidence: the confidence of that bound',
    '  proven_fraction: share of the box\'s volume proven (empty when no proof was tried)',
    '',
  ].join('\n');
}
