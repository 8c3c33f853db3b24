import { noChangeRulesText } from './no-change-rules.js';
import { formatRule } from '../rules/index.js';
import { cautionsText } from '../report/index.js';
import { CHANGE_LABELS, REGRESSION_VERDICTS, type DiffResult } from './diff-result.js';
import type { GateOutcome } from './fail-on.js';
import { count, counterexampleText, pct, pctInterval } from './format-figures.js';

/** Change rules shown in the terminal (largest share of the domain first; all in diff.md). */
export const SUMMARY_CHANGE_RULES = 10;
/** Rules with a verdict other than kept or still-refuted shown in the terminal (all in diff.md). */
export const SUMMARY_VERDICT_RULES = 12;

/** Order in which verdicts are listed: the worst news first. */
const LISTED: readonly string[] = ['broken', 'degraded', 'no-longer-proven', 'fixed'];

/** The terminal summary of a diff, ending with the files written and the cautions. */
export function diffSummaryText(result: DiffResult, gates: readonly GateOutcome[], files: readonly string[]): string {
  const { manifest: m, inputs, advisories } = result;
  const L: string[] = [];
  L.push(`${m.scenario.name}: before ${m.before.sha256.slice(0, 12)}… → after ${m.after.sha256.slice(0, 12)}… (seed ${m.seed})`);
  L.push(`accepted table (${result.rulesSource}): ${REGRESSION_VERDICTS.map((v) => `${result.rules.filter((r) => r.verdict === v).length} ${v}`).join(', ')}`);
  // worst news first: by verdict, then by how much the violation rate rose
  const rise = (r: (typeof result.rules)[number]): number => r.after.violations / r.after.samples - r.before.violations / r.before.samples;
  const listed = result.rules
    .filter((x) => LISTED.includes(x.verdict))
    .sort((a, b) => LISTED.indexOf(a.verdict) - LISTED.indexOf(b.verdict) || rise(b) - rise(a));
  for (const r of listed.slice(0, SUMMARY_VERDICT_RULES)) {
    const rates = r.verdict === 'degraded' ? `, violations ${pct(r.before.violations / r.before.samples)} → ${pct(r.after.violations / r.after.samples)}` : '';
    L.push(`  ${r.rule.id} ${r.verdict} (${r.before.status} → ${r.after.status}${rates}): ${formatRule({ ...r.rule, id: '' }, inputs, advisories)}`);
    if (r.after.counterexample && r.after.status === 'refuted') L.push(`    ${counterexampleText(r.after.counterexample, inputs, advisories)}`);
  }
  if (listed.length > SUMMARY_VERDICT_RULES) L.push(`  … ${listed.length - SUMMARY_VERDICT_RULES} more (all in diff.md)`);
  L.push(`changed share of the domain: ${pctInterval(result.changed, 3)} on ${count(result.changed.n)} fresh uniform samples`);
  const moves: Array<[number, number, number]> = [];
  result.confusion.forEach((row, a) => row.forEach((c, b) => a !== b && c > 0 && moves.push([a, b, c])));
  moves.sort((s, t) => t[2] - s[2]);
  if (moves.length > 0) {
    L.push('  most frequent changes: ' + moves.slice(0, 4).map(([a, b, c]) => `${advisories[a]} → ${advisories[b]} ${pct(c / result.changed.n, 3)}`).join('; '));
  }
  if (result.changeRules.length > 0) {
    L.push(`where it changed: ${result.changeRules.length} rules, recall ${pctInterval(result.capture.recall, 1)}, precision ${pctInterval(result.capture.precision, 1)}`);
    const shown = [...result.changeRules].sort((s, t) => t.volumeFraction - s.volumeFraction).slice(0, SUMMARY_CHANGE_RULES);
    for (const c of shown) {
      const top = c.transitions[0];
      const main = top ? `, mostly ${advisories[top.before]} → ${advisories[top.after]}` : '';
      L.push(`  ${formatRule(c.rule, inputs, CHANGE_LABELS)}  [${pct(c.changed.value, 1)} of the box changed${main}]`);
    }
    if (result.changeRules.length > shown.length) L.push(`  … ${result.changeRules.length - shown.length} more (all in diff.md)`);
  } else L.push(`where it changed: no change rules (${noChangeRulesText(result.changed)})`);
  for (const g of gates) L.push(`gate ${g.gate}: ${g.tripped ? 'TRIPPED' : 'passed'} (${g.reason})`);
  for (const n of result.notes) L.push(`note: ${n}`);
  L.push('', 'files:', ...files.map((f) => `  ${f}`), '', cautionsText());
  return L.join('\n') + '\n';
}
