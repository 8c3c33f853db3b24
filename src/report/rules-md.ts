import type { RuleTable } from '../types.js';
import { formatRule } from '../rules/index.js';
import { CAUTIONS } from './cautions.js';
import { count, pct, prob } from './format-number.js';

function escapeCell(s: string): string {
  return s.replace(/\|/g, '\\|');
}

/** rules.md: cautions, provenance, fidelity and the rule table with its evidence, in Markdown. */
export function rulesMdText(table: RuleTable): string {
  const m = table.manifest;
  const lines: string[] = [];
  lines.push(`# Rules of ${m.scenario.name}`, '');
  lines.push('> **Caution**', '>');
  for (const c of CAUTIONS) lines.push(`> - ${c}`);
  lines.push('');
  lines.push(`- Model: \`${m.model.path}\` (SHA-256 \`${m.model.sha256}\`)`);
  lines.push(`- Scenario: \`${m.scenario.path}\` (SHA-256 \`${m.scenario.sha256}\`)`);
  lines.push(`- ${m.tool} ${m.toolVersion}, \`${m.command}\`, seed ${m.seed}, ${m.date}`);
  lines.push(`- Decision: ${table.decision} over ${table.advisories.map((a) => `\`${a}\``).join(', ')}`);
  const f = table.fidelity;
  if (f) {
    lines.push(
      `- Fidelity to the network on ${count(f.samples)} fresh uniform samples: ${pct(f.overall.value)} ` +
        `(${pct(f.confidence, 0)} interval ${pct(f.overall.lower)} – ${pct(f.overall.upper)}); ` +
        `balanced fidelity ${pct(f.balanced)}; not covered by any rule ${pct(f.uncovered)}`,
    );
  }
  if (table.coverage) {
    lines.push(
      `- Proven coverage of the domain: ${pct(table.coverage.total)} (` +
        table.advisories.map((a, j) => `\`${a}\` ${pct(table.coverage!.perAdvisory[j]!)}`).join(', ') +
        ')',
    );
  }
  for (const note of table.notes ?? []) lines.push(`- Note: ${note}`);
  lines.push('', '## Inputs', '', '| input | unit | min | max | description |', '| --- | --- | --- | --- | --- |');
  for (const i of table.inputs) lines.push(`| \`${i.name}\` | ${i.unit} | ${i.min} | ${i.max} | ${escapeCell(i.description)} |`);
  if (f) {
    lines.push('', '## Per advisory', '', '| advisory | share of domain | recall of the table |', '| --- | --- | --- |');
    table.advisories.forEach((a, j) => lines.push(`| \`${a}\` | ${pct(f.share[j]!)} | ${pct(f.perAdvisory[j]!.value)} |`));
  }
  lines.push('', '## Rules', '');
  lines.push('| rule | status | samples | violations | bound on violation rate | share of domain | proven share |');
  lines.push('| --- | --- | --- | --- | --- | --- | --- |');
  for (const { rule, evidence: e } of table.rules) {
    lines.push(
      `| \`${escapeCell(formatRule(rule, table.inputs, table.advisories))}\` | ${e.status} | ${count(e.samples)} | ${count(e.violations)} | ` +
        `${prob(e.violationBound)} (${pct(e.confidence, 0)}) | ${pct(e.volumeFraction)} | ${e.proof ? pct(e.proof.provenFraction) : ''} |`,
    );
  }
  const withCx = table.rules.filter((r) => r.evidence.counterexample);
  if (withCx.length > 0) {
    lines.push('', '## Counterexamples', '');
    for (const { rule, evidence } of withCx) {
      const cx = evidence.counterexample!;
      const at = table.inputs.map((inp, i) => `${inp.name} = ${cx.x[i]} ${inp.unit}`.trim()).join(', ');
      lines.push(`- ${rule.id}: at ${at} the network gives \`${table.advisories[cx.advisory]}\` (ahead by ${cx.margin.toPrecision(3)} in score)`);
    }
  }
  lines.push('');
  return lines.join('\n');
}
