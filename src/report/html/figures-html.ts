import type { RuleStatus, RuleTable } from '../../types.js';
import { count, pct } from '../format-number.js';
import { escapeHtml } from './escape-html.js';

const STATUSES: readonly RuleStatus[] = ['proven', 'sampled', 'refuted', 'unknown'];

/**
 * Share of the domain proven: the sum over rules of (share of the domain in the box) × (share
 * of the box proven). Mined rules come from the leaves of one tree, so their boxes are disjoint
 * and the sum is the proven share; overlapping expected rules can make it an overcount, so it
 * is capped at 1 and labelled as a sum. Undefined when no rule has proof details.
 */
export function provenShare(table: RuleTable): number | undefined {
  let any = false;
  let s = 0;
  for (const { evidence } of table.rules) {
    if (!evidence.proof) continue;
    any = true;
    s += evidence.volumeFraction * evidence.proof.provenFraction;
  }
  return any ? Math.min(1, s) : undefined;
}

function figure(id: string, label: string, value: string, note: string): string {
  return `<div class="figure" id="${id}"><div class="muted">${label}</div><div class="value">${value}</div><div class="note">${note}</div></div>`;
}

/** The summary figures: fidelity with its interval, balanced fidelity, proven share, counts by status. */
export function figuresHtml(table: RuleTable): string {
  const out: string[] = ['<section id="summary"><h2>Summary</h2><div class="figures">'];
  const f = table.fidelity;
  if (f) {
    out.push(
      figure('fig-fidelity', 'fidelity to the network', pct(f.overall.value), `${pct(f.confidence, 0)} interval ${pct(f.overall.lower)} – ${pct(f.overall.upper)}, on ${count(f.samples)} fresh uniform samples`),
      figure('fig-balanced', 'balanced fidelity', pct(f.balanced), 'mean over advisories of the share of its region the table labels right'),
      figure('fig-uncovered', 'not covered by any rule', pct(f.uncovered), 'share of the fresh samples'),
    );
  }
  const proven = provenShare(table);
  if (proven !== undefined) out.push(figure('fig-proven', 'domain proven', pct(proven), 'sum over rules of box share × proven share of the box'));
  const by = new Map<RuleStatus, number>();
  for (const r of table.rules) by.set(r.evidence.status, (by.get(r.evidence.status) ?? 0) + 1);
  const counts = STATUSES.map((s) => `<span class="status status-${s}" data-status="${s}">${by.get(s) ?? 0} ${s}</span>`).join(', ');
  out.push(figure('fig-status', 'rules by status', String(table.rules.length), counts));
  out.push('</div>');
  if (f) {
    const rows = table.advisories
      .map((a, j) => `<tr><td><code>${escapeHtml(a)}</code></td><td class="num">${pct(f.share[j] ?? NaN)}</td><td class="num">${pct(f.perAdvisory[j]?.value ?? NaN)}</td></tr>`)
      .join('');
    out.push(`<h3>Per advisory</h3><table id="per-advisory"><thead><tr><th>advisory</th><th class="num">share of the domain</th><th class="num">recall of the table</th></tr></thead><tbody>${rows}</tbody></table>`);
  }
  out.push('</section>');
  return out.join('\n');
}
