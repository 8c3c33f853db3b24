import type { InputSpec } from '../types.js';
import { CAUTIONS } from '../report/index.js';
import type { ReferenceComparison } from './compare-reference.js';
import { referenceScope } from './reference-scope.js';
import { disagreementText, gridShapeText } from './reference-text.js';

/** Identifies reference.json and its layout version. */
export const REFERENCE_JSON_FORMAT = 'specula-reference';
export const REFERENCE_JSON_VERSION = 1;

/** Provenance of a comparison: the model and the table compared. */
export interface ReferenceProvenance {
  readonly scenario: { readonly path: string; readonly sha256: string; readonly name: string };
  readonly model: { readonly path: string; readonly sha256: string };
  readonly table: { readonly path: string; readonly sha256: string };
  readonly tool: string;
  readonly toolVersion: string;
  readonly date: string;
}

const cell = (s: string): string => s.replace(/\|/g, '\\|');

/**
 * reference.json (canonical) and reference.md (readable) of a comparison, both carrying the
 * cautions and the statement of what is and is not checked between grid points.
 * @returns file names (relative to the output folder) with their contents
 */
export function referenceFiles(c: ReferenceComparison, p: ReferenceProvenance, inputs: readonly InputSpec[], advisories: readonly string[]): Array<{ name: string; data: string }> {
  const scope = referenceScope(c.points);
  const json = {
    format: REFERENCE_JSON_FORMAT,
    formatVersion: REFERENCE_JSON_VERSION,
    cautions: CAUTIONS,
    scope,
    provenance: p,
    inputs,
    advisories,
    axes: Object.fromEntries(inputs.map((inp, f) => [inp.name, c.axes[f]])),
    points: c.points,
    agree: c.agree,
    perAdvisory: c.perAdvisory.map((a) => ({ advisory: advisories[a.advisory], points: a.points, agree: a.agree })),
    confusion: { rowsAre: 'table', columnsAre: 'network', advisories, counts: c.confusion },
    disagreements: c.disagreements.map((g, i) => ({
      id: g.rule.id,
      text: disagreementText(c, i, inputs, advisories),
      table: advisories[g.table],
      network: advisories[g.rule.allowed[0]!],
      box: Object.fromEntries(inputs.map((inp, f) => [inp.name, g.rule.box[f]])),
      points: g.points,
    })),
  };
  const pct = (x: number): string => (Number.isFinite(x) ? `${(100 * x).toFixed(2)} %` : 'n/a');
  const L: string[] = [`# ${p.scenario.name}: network against a reference table`, '', '> **Caution**', '>'];
  for (const s of CAUTIONS) L.push(`> - ${s}`);
  L.push(
    '',
    `- Model: \`${p.model.path}\` (SHA-256 \`${p.model.sha256}\`)`,
    `- Table: \`${p.table.path}\` (SHA-256 \`${p.table.sha256}\`), ${c.points} grid points (${gridShapeText(c, inputs)})`,
    `- ${p.tool} ${p.toolVersion}, \`check --reference\`, ${p.date}`,
    '',
    '## What is checked',
    '',
    ...scope.checked.map((s) => `- Checked: ${s}.`),
    ...scope.notChecked.map((s) => `- Not checked: ${s}.`),
    '',
    '## Agreement at the grid points',
    '',
    `Overall ${pct(c.agree / c.points)} (${c.agree} of ${c.points}).`,
    '',
    '| table advisory | grid points | network agrees | share |',
    '| --- | --- | --- | --- |',
    ...c.perAdvisory.map((a) => `| \`${advisories[a.advisory]}\` | ${a.points} | ${a.agree} | ${pct(a.agree / a.points)} |`),
    '',
    `| table \\ network | ${advisories.map((a) => `\`${a}\``).join(' | ')} |`,
    `| --- | ${advisories.map(() => '---').join(' | ')} |`,
    ...c.confusion.map((row, t) => `| \`${advisories[t]}\` | ${row.map((v, m) => (t === m ? String(v) : `**${v}**`)).join(' | ')} |`),
    '',
    '## Disagreeing grid points, grouped',
    '',
  );
  if (c.disagreements.length === 0) L.push('None: the network gives the table\'s advisory at every grid point.');
  else {
    L.push('Every grid point inside a box has the table advisory shown and the network advisory after `expect`; inputs between grid points are not covered.', '');
    L.push('| group | table | network | grid points |', '| --- | --- | --- | --- |');
    c.disagreements.forEach((g, i) => {
      const text = disagreementText(c, i, inputs, advisories).replace(/\s+\[table:.*$/, '');
      L.push(`| \`${cell(text)}\` | \`${advisories[g.table]}\` | \`${advisories[g.rule.allowed[0]!]}\` | ${g.points} |`);
    });
  }
  L.push('');
  return [
    { name: 'reference.json', data: JSON.stringify(json, null, 2) + '\n' },
    { name: 'reference.md', data: L.join('\n') },
  ];
}
