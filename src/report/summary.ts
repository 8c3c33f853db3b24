import type { RuleTable } from '../types.js';
import { cautionsText } from './cautions.js';
import { count, pct, prob } from './format-number.js';

export interface SummaryOptions {
  /** Files written, shown at the end. */
  readonly files: readonly string[];
  /** Rows of the rule table shown (largest share of the domain first). */
  readonly maxRows?: number;
}

function pad(s: string, w: number): string {
  return s.length >= w ? s : s + ' '.repeat(w - s.length);
}

/** The compact terminal summary of a run, ending with the hazard cautions. */
export function summaryText(table: RuleTable, options: SummaryOptions): string {
  const m = table.manifest;
  const out: string[] = [];
  const byStatus = new Map<string, number>();
  for (const r of table.rules) byStatus.set(r.evidence.status, (byStatus.get(r.evidence.status) ?? 0) + 1);
  out.push(`${m.scenario.name}: ${table.rules.length} rules (seed ${m.seed}, model sha256 ${m.model.sha256.slice(0, 12)}…)`);
  const f = table.fidelity;
  if (f) {
    out.push(
      `fidelity ${pct(f.overall.value)} [${pct(f.overall.lower)}, ${pct(f.overall.upper)}] on ${count(f.samples)} fresh uniform samples; ` +
        `balanced ${pct(f.balanced)}; uncovered ${pct(f.uncovered)}`,
    );
  }
  out.push('status: ' + [...byStatus.entries()].map(([s, c]) => `${c} ${s}`).join(', '));
  if (table.coverage) {
    out.push(
      `proven coverage of the domain: ${pct(table.coverage.total)} (` +
        table.advisories.map((a, j) => `${a} ${pct(table.coverage!.perAdvisory[j]!, 1)}`).join(', ') +
        ')',
    );
  }
  for (const note of table.notes ?? []) out.push(`note: ${note}`);
  const rows = [...table.rules].sort((a, b) => b.evidence.volumeFraction - a.evidence.volumeFraction || (a.rule.id < b.rule.id ? -1 : 1));
  const shown = rows.slice(0, options.maxRows ?? 15);
  const cells = shown.map(({ rule, evidence: e }) => [
    rule.id,
    rule.allowed.map((a) => table.advisories[a]).join('|'),
    pct(e.volumeFraction, 1),
    e.status,
    `${count(e.violations)}/${count(e.samples)}`,
    prob(e.violationBound),
    e.proof ? pct(e.proof.provenFraction, 1) : '',
  ]);
  const head = ['rule', 'advisory', 'share', 'status', 'violations', 'bound', 'proven'];
  const widths = head.map((h, c) => Math.max(h.length, ...cells.map((r) => r[c]!.length)));
  out.push('', head.map((h, c) => pad(h, widths[c]!)).join('  '));
  for (const r of cells) out.push(r.map((v, c) => pad(v, widths[c]!)).join('  '));
  if (rows.length > shown.length) out.push(`… ${rows.length - shown.length} more rules (largest share first; all in rules.md)`);
  out.push('', 'files:', ...options.files.map((p) => `  ${p}`), '', cautionsText());
  return out.join('\n') + '\n';
}
