import type { CheckedRule, RuleTable } from '../../types.js';
import { count, pct, prob } from '../format-number.js';
import { escapeHtml as e, idPart } from './escape-html.js';

function origin(r: CheckedRule['rule']): string {
  const o = r.origin;
  if (o.kind === 'mined') return 'mined from the network';
  if (o.kind === 'expected') return `expected by the experts (${o.file ? `${e(o.file)}, ` : ''}line ${o.line})`;
  return `repaired from ${e(o.from)}`;
}

function counterexampleHtml(table: RuleTable, c: NonNullable<CheckedRule['evidence']['counterexample']>): string {
  const xs = table.inputs.map((inp, i) => `<tr><td><code>${e(inp.name)}</code></td><td class="num">${c.x[i]}</td><td>${e(inp.unit)}</td></tr>`).join('');
  const scores = table.advisories
    .map((a, j) => `<tr${j === c.advisory ? ' class="status-refuted"' : ''}><td><code>${e(a)}</code></td><td class="num">${c.scores[j]}</td></tr>`)
    .join('');
  return (
    `<h4>Counterexample (confirmed by running the model)</h4>` +
    `<p>At this input the network gives <code>${e(table.advisories[c.advisory] ?? String(c.advisory))}</code>, ahead of the best allowed advisory by ${c.margin.toPrecision(3)} in score.</p>` +
    `<div class="slice-view"><table class="cx-inputs"><thead><tr><th>input</th><th class="num">value</th><th>unit</th></tr></thead><tbody>${xs}</tbody></table>` +
    `<table class="cx-scores"><thead><tr><th>advisory</th><th class="num">score</th></tr></thead><tbody>${scores}</tbody></table></div>`
  );
}

/** One `<article id="ev-<id>">` per rule: the rule, its origin, samples, violations, bound, counterexample and proof. */
export function evidenceHtml(table: RuleTable, texts: readonly string[]): string {
  const out: string[] = ['<section id="evidence"><h2>Evidence per rule</h2>'];
  table.rules.forEach(({ rule, evidence: ev }, i) => {
    const id = idPart(rule.id);
    const parts: string[] = [
      `<article class="evidence" id="ev-${id}"><h3>${e(rule.id)} <span class="status status-${ev.status}">${ev.status}</span> <a class="muted" href="#rule-${id}">(table)</a></h3>`,
      `<p><code>${e(texts[i] ?? '')}</code></p><dl class="kv">`,
      `<dt>origin</dt><dd>${origin(rule)}</dd>`,
      `<dt>share of the domain</dt><dd>${pct(ev.volumeFraction)}</dd>`,
      `<dt>dense samples in the box</dt><dd>${count(ev.samples)}, of which ${count(ev.violations)} gave another advisory</dd>`,
      `<dt>bound on the violation rate</dt><dd>${prob(ev.violationBound)} (one-sided exact Clopper–Pearson upper bound, ${pct(ev.confidence, 0)} confidence)</dd>`,
    ];
    const p = ev.proof;
    if (p) {
      parts.push(
        `<dt>proof</dt><dd>${e(p.method)}: ${pct(p.provenFraction)} of the box's volume proven in ${count(p.pieces)} pieces, ` +
          `${p.seconds.toFixed(2)} s, numerical margin ${p.margin} in score${p.note ? `; ${e(p.note)}` : ''}</dd>`,
      );
    }
    parts.push('</dl>');
    if (ev.counterexample) parts.push(counterexampleHtml(table, ev.counterexample));
    parts.push('</article>');
    out.push(parts.join(''));
  });
  out.push('</section>');
  return out.join('\n');
}
