import type { RuleStatus, RuleTable } from '../../types.js';
import { count, pct, prob } from '../format-number.js';
import { escapeHtml as e, idPart } from './escape-html.js';

const STATUSES: readonly RuleStatus[] = ['proven', 'sampled', 'refuted', 'unknown'];

/**
 * The rule table with its filters: one row per rule (`id="rule-<id>"`, `data-advisory` holding
 * the allowed advisories, `data-status`), sortable columns (`data-sort`, each cell's sort key in
 * `data-v`), and a link from every row to its evidence (`#ev-<id>`).
 * @param texts the rules' text as rules.json states it, in table order
 */
export function ruleTableHtml(table: RuleTable, texts: readonly string[]): string {
  const advOptions = table.advisories.map((a) => `<option value="${e(a)}">${e(a)}</option>`).join('');
  const stOptions = STATUSES.map((s) => `<option value="${s}">${s}</option>`).join('');
  const rows = table.rules.map(({ rule, evidence: ev }, i) => {
    const allowed = rule.allowed.map((a) => table.advisories[a]!);
    const id = idPart(rule.id);
    const proven = ev.proof ? ev.proof.provenFraction : NaN;
    return (
      `<tr id="rule-${id}" data-advisory="${e(allowed.join(' '))}" data-status="${ev.status}">` +
      `<td data-v="${e(rule.id)}"><a href="#ev-${id}">${e(rule.id)}</a></td>` +
      `<td class="text">${e(texts[i] ?? '')}</td>` +
      `<td>${allowed.map((a) => `<code>${e(a)}</code>`).join(' or ')}</td>` +
      `<td class="status status-${ev.status}">${ev.status}</td>` +
      `<td class="num" data-v="${ev.volumeFraction}">${pct(ev.volumeFraction)}</td>` +
      `<td class="num" data-v="${ev.samples}">${count(ev.samples)}</td>` +
      `<td class="num" data-v="${ev.violations}">${count(ev.violations)}</td>` +
      `<td class="num" data-v="${ev.violationBound}">${prob(ev.violationBound)}</td>` +
      `<td class="num" data-v="${Number.isNaN(proven) ? '' : proven}">${Number.isNaN(proven) ? '' : pct(proven)}</td>` +
      `</tr>`
    );
  });
  const conf = table.rules[0]?.evidence.confidence;
  return [
    '<section id="rule-table"><h2>Rules</h2>',
    '<p class="muted">Each rule reads: inputs in the box ⇒ the network gives one of the allowed advisories. ' +
      'Click a column heading to sort, a rule id for its evidence.</p>',
    '<div class="controls">',
    `<label>advisory <select id="filter-advisory"><option value="">all</option>${advOptions}</select></label>`,
    `<label>status <select id="filter-status"><option value="">all</option>${stOptions}</select></label>`,
    `<span id="rule-count" class="muted">${table.rules.length} of ${table.rules.length} rules shown</span>`,
    '</div>',
    '<div class="scroll"><table id="rules"><thead><tr>',
    '<th data-sort="text">rule</th><th>when … expect …</th><th data-sort="text">advisory</th><th data-sort="text">status</th>',
    '<th class="num" data-sort="num">share of domain</th><th class="num" data-sort="num">samples</th><th class="num" data-sort="num">violations</th>',
    `<th class="num" data-sort="num">bound on violation rate${conf !== undefined ? ` (${pct(conf, 0)})` : ''}</th><th class="num" data-sort="num">proven share</th>`,
    '</tr></thead><tbody>',
    rows.join('\n'),
    '</tbody></table></div></section>',
  ].join('\n');
}
