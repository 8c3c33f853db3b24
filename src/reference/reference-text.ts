import type { InputSpec } from '../types.js';
import { formatRule } from '../rules/index.js';
import type { ReferenceComparison } from './compare-reference.js';
import { referenceScope } from './reference-scope.js';

/** Disagreement boxes shown in the terminal (most grid points first; all in reference.md). */
export const SUMMARY_DISAGREEMENTS = 10;

function pct(x: number): string {
  return Number.isFinite(x) ? `${(100 * x).toFixed(2)} %` : 'n/a';
}

function count(x: number): string {
  return x.toLocaleString('en-US');
}

/** One disagreement box as text: `D1: when … expect <network>  [table: <advisory>; 12 grid points]`. */
export function disagreementText(c: ReferenceComparison, i: number, inputs: readonly InputSpec[], advisories: readonly string[]): string {
  const g = c.disagreements[i]!;
  return `${formatRule(g.rule, inputs, advisories)}  [table: ${advisories[g.table]}; ${count(g.points)} grid point${g.points > 1 ? 's' : ''}]`;
}

/** The grid's shape: `cpa_nm 6 × tcpa_min 7 × …`. */
export function gridShapeText(c: ReferenceComparison, inputs: readonly InputSpec[]): string {
  return inputs.map((inp, f) => `${inp.name} ${c.axes[f]!.length}`).join(' × ');
}

/** The terminal summary of a reference-table comparison, ending with its scope statement. */
export function referenceSummaryText(c: ReferenceComparison, inputs: readonly InputSpec[], advisories: readonly string[]): string {
  const L: string[] = [];
  L.push(`reference table ${c.file}: ${count(c.points)} grid points (${gridShapeText(c, inputs)})`);
  L.push(`agreement at the grid points: ${pct(c.agree / c.points)} (${count(c.agree)} of ${count(c.points)})`);
  L.push('per table advisory: ' + c.perAdvisory.filter((a) => a.points > 0).map((a) => `${advisories[a.advisory]} ${pct(a.agree / a.points)} (${count(a.agree)}/${count(a.points)})`).join(', '));
  const wrong = c.points - c.agree;
  if (wrong > 0) {
    L.push(`disagreeing grid points: ${count(wrong)}, in ${c.disagreements.length} boxes (each box: every grid point in it has the table's advisory shown and the network's advisory after 'expect'):`);
    const shown = Math.min(SUMMARY_DISAGREEMENTS, c.disagreements.length);
    for (let i = 0; i < shown; i++) L.push(`  ${disagreementText(c, i, inputs, advisories)}`);
    if (c.disagreements.length > shown) L.push(`  … ${c.disagreements.length - shown} more boxes (all in reference.md)`);
  }
  const scope = referenceScope(c.points);
  L.push('checked: ' + scope.checked.join('; '));
  L.push('not checked:', ...scope.notChecked.map((s) => `  - ${s}`));
  return L.join('\n') + '\n';
}
