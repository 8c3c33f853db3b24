import { noChangeRulesText } from './no-change-rules.js';
import { formatRule } from '../rules/index.js';
import { CAUTIONS } from '../report/index.js';
import { CHANGE_LABELS, REGRESSION_VERDICTS, type DiffResult } from './diff-result.js';
import { DIFF_CAUTIONS } from './diff-json.js';
import type { GateOutcome } from './fail-on.js';
import { count, counterexampleText, pct, pctInterval } from './format-figures.js';

const cell = (s: string): string => s.replace(/\|/g, '\\|');

/** diff.md: the regression report in Markdown (cautions first, then each part of the diff). */
export function diffMdText(result: DiffResult, gates: readonly GateOutcome[]): string {
  const { manifest: m, inputs, advisories } = result;
  const conf = pct(Number(m.settings['confidence']), 0);
  const L: string[] = [`# Regression of ${m.scenario.name}`, '', '> **Caution**', '>'];
  for (const c of [...CAUTIONS, ...DIFF_CAUTIONS]) L.push(`> - ${c}`);
  L.push(
    '',
    `- Before: \`${m.before.path}\` (SHA-256 \`${m.before.sha256}\`)`,
    `- After: \`${m.after.path}\` (SHA-256 \`${m.after.sha256}\`)`,
    `- Scenario: \`${m.scenario.path}\` (SHA-256 \`${m.scenario.sha256}\`)`,
    `- Accepted table: ${result.rulesSource}`,
    `- ${m.tool} ${m.toolVersion}, \`diff\`, seed ${m.seed}, ${m.date}`,
    '',
    '## Accepted rules on the new model',
    '',
    REGRESSION_VERDICTS.map((v) => `${result.rules.filter((r) => r.verdict === v).length} ${v}`).join(', '),
    '',
    '| rule | verdict | before | after | violations / samples before | after |',
    '| --- | --- | --- | --- | --- | --- |',
  );
  for (const r of result.rules) {
    const rate = (e: typeof r.before): string => `${count(e.violations)} / ${count(e.samples)}`;
    L.push(`| \`${cell(formatRule(r.rule, inputs, advisories))}\` | ${r.verdict} | ${r.before.status} | ${r.after.status} | ${rate(r.before)} | ${rate(r.after)} |`);
  }
  const broken = result.rules.filter((r) => r.after.counterexample && r.verdict !== 'kept');
  if (broken.length > 0) {
    L.push('', '### Counterexamples on the new model', '');
    for (const r of broken) L.push(`- ${r.rule.id} (${r.verdict}): ${counterexampleText(r.after.counterexample!, inputs, advisories)}`);
  }
  L.push(
    '',
    '## Where the advisory changed',
    '',
    `Changed share of the domain: **${pctInterval(result.changed, 3)}** (${conf} exact interval, ${count(result.changed.n)} fresh uniform samples).`,
    '',
    `| before \\ after | ${advisories.map((a) => `\`${a}\``).join(' | ')} |`,
    `| --- | ${advisories.map(() => '---').join(' | ')} |`,
  );
  result.confusion.forEach((row, a) => L.push(`| \`${advisories[a]}\` | ${row.map((c, b) => (a === b ? count(c) : `**${count(c)}**`)).join(' | ')} |`));
  L.push('', '### Change rules', '');
  if (result.changeRules.length === 0) L.push(`No change rules: ${noChangeRulesText(result.changed)}.`);
  else {
    L.push(
      `Recall ${pctInterval(result.capture.recall, 1)} (share of changed samples inside a change rule); ` +
        `precision ${pctInterval(result.capture.precision, 1)} (share of samples inside the rules that changed).`,
      '',
      '| rule | share of domain | changed in the box | most frequent changes |',
      '| --- | --- | --- | --- |',
    );
    for (const c of result.changeRules) {
      const top = c.transitions.slice(0, 3).map((t) => `${advisories[t.before]} → ${advisories[t.after]} (${count(t.count)})`).join('; ');
      L.push(`| \`${cell(formatRule(c.rule, inputs, CHANGE_LABELS))}\` | ${pct(c.volumeFraction)} | ${pctInterval(c.changed, 1)} | ${cell(top)} |`);
    }
  }
  if (gates.length > 0) {
    L.push('', '## Gates', '', '| gate | result | because |', '| --- | --- | --- |');
    for (const g of gates) L.push(`| \`${g.gate}\` | ${g.tripped ? '**tripped**' : 'passed'} | ${cell(g.reason)} |`);
  }
  if (result.notes.length > 0) L.push('', '## Notes', '', ...result.notes.map((n) => `- ${n}`));
  L.push('');
  return L.join('\n');
}
