import { formatRule } from '../rules/index.js';
import { cautionsText } from '../report/index.js';
import { CHANGE_LABELS, REGRESSION_VERDICTS, type DiffResult } from './diff-result.js';
import type { GateOutcome } from './fail-on.js';
import { count, counterexampleText, pct, pctInterval } from './format-figures.js';

/** Change rules shown in the terminal (largest share of the domain first; all in diff.md). */
export const SUMMARY_CHANGE_RULES = 10;

/** The terminal summary of a diff, ending with the files written and the cautions. */
export function diffSummaryText(result: DiffResult, gates: readonly GateOutcome[], files: readonly string[]): string {
  const { manifest: m, inputs, advisories } = result;
  const L: string[] = [];
  L.push(`${m.scenario.name}: before ${m.before.sha256.slice(0, 12)}… → after ${m.after.sha256.slice(0, 12)}… (seed ${m.seed})`);
  L.push(`accepted table (${result.rulesSource}): ${REGRESSION_VERDICTS.map((v) => `${result.rules.filter((r) => r.verdict === v).length} ${v}`).join(', ')}`);
  for (const r of result.rules.filter((x) => x.verdict !== 'kept')) {
    L.push(`  ${r.rule.id} ${r.verdict} (${r.before.status} → ${r.after.status}): ${formatRule({ ...r.rule, id: '' }, inputs, advisories)}`);
    if (r.after.counterexample && r.after.status === 'refuted') L.push(`    ${counterexampleText(r.after.counterexample, inputs, advisories)}`);
  }
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
  } else L.push('where it changed: no change rules (no changed region found in the samples)');
  for (const g of gates) L.push(`gate ${g.gate}: ${g.tripped ? 'TRIPPED' : 'passed'} (${g.reason})`);
  for (const n of result.notes) L.push(`note: ${n}`);
  L.push('', 'files:', ...files.map((f) => `  ${f}`), '', cautionsText());
  return L.join('\n') + '\n';
}
