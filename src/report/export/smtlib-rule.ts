import type { RuleTable } from '../../types.js';
import { formatRule } from '../../rules/index.js';
import { CAUTIONS } from '../cautions.js';
import { smtDecimal } from './smt-decimal.js';
import { smtSymbol } from './smt-symbol.js';

/** Text for a `;` comment: line breaks would end the comment, so they become spaces. */
function oneLine(s: string): string {
  return s.replace(/[\r\n]+/g, ' ');
}

/** SMT-LIB symbol of an advisory's score; the dot keeps it apart from every input name (identifiers have none). */
export function scoreSymbol(advisory: string): string {
  return smtSymbol(`score.${advisory}`);
}

/**
 * The negation of a rule's output property over the scores. With argmax the rule holds when the
 * best allowed score beats every other score strictly, so it FAILS when some disallowed score is
 * >= every allowed score (ties count as failures); argmin is the same with <=. When every
 * advisory is allowed the rule cannot fail and the negation is `false`.
 */
function negatedProperty(table: RuleTable, allowed: readonly number[]): string {
  const cmp = table.decision === 'argmax' ? '>=' : '<=';
  const others = table.advisories.map((_, j) => j).filter((j) => !allowed.includes(j));
  if (others.length === 0) return 'false';
  const wins = others.map((j) => {
    const parts = allowed.map((a) => `(${cmp} ${scoreSymbol(table.advisories[j]!)} ${scoreSymbol(table.advisories[a]!)})`);
    return parts.length === 1 ? parts[0]! : `(and ${parts.join(' ')})`;
  });
  return wins.length === 1 ? wins[0]! : `(or\n    ${wins.join('\n    ')})`;
}

/**
 * One rule as an SMT-LIB 2.6 query (SMT-LIB Standard: Version 2.6, Barrett, Fontaine & Tinelli,
 * 2017, smt-lib.org): the inputs and the advisory scores declared as Real constants, the rule's
 * closed box asserted, and the NEGATION of its output property asserted, then `(check-sat)`.
 * The query is unsatisfiable exactly when the rule holds — once the network's own encoding
 * (each score as a function of the inputs) is added; the network is not encoded here, so on
 * its own the query is satisfiable (the scores are free).
 * Comments carry the rule, its run evidence, the model's and scenario's SHA-256 and the cautions.
 * @param table the rule table
 * @param index which rule
 */
export function smtlibRule(table: RuleTable, index: number): string {
  const { rule, evidence } = table.rules[index]!;
  const m = table.manifest;
  const lines: string[] = [];
  lines.push(`; ${m.tool} ${m.toolVersion}: rule ${rule.id} as an SMT-LIB 2.6 query`);
  lines.push(`; ${oneLine(formatRule(rule, table.inputs, table.advisories))}`);
  lines.push(`; status in the run: ${evidence.status} (${evidence.violations} violations in ${evidence.samples} samples)`);
  lines.push(`; model: ${oneLine(m.model.path)}`, `; model SHA-256: ${m.model.sha256}`);
  lines.push(`; scenario: ${oneLine(m.scenario.path)}`, `; scenario SHA-256: ${m.scenario.sha256}`);
  lines.push(`; run date: ${m.date}, seed ${m.seed}`);
  lines.push(';', '; CAUTION');
  for (const c of CAUTIONS) lines.push(`; - ${c}`);
  lines.push(
    ';',
    '; THE NETWORK IS NOT ENCODED IN THIS FILE. The scores below are free variables: a solver',
    '; needs the network\'s encoding (each score as a function of the inputs, after any input',
    '; normalisation of the scenario) added before (check-sat); producing it is out of scope here.',
    '; With it, "unsat" means the rule holds on the whole closed box; "sat" gives an input where',
    `; it fails (decision: ${table.decision}; ties count as failures).`,
    '; Bounds are the decimals of rules.json (shortest round-trip form of the float64 values).',
    '',
    '(set-info :smt-lib-version 2.6)',
    '(set-logic QF_LRA)',
    '',
  );
  table.inputs.forEach((inp) => lines.push(`(declare-const ${smtSymbol(inp.name)} Real) ; ${oneLine(inp.unit)}, domain [${inp.min}, ${inp.max}]`));
  table.advisories.forEach((a) => lines.push(`(declare-const ${scoreSymbol(a)} Real)`));
  lines.push('', '; the rule\'s box (closed)', '(assert (and');
  table.inputs.forEach((inp, i) => {
    const [lo, hi] = rule.box[i]!;
    const x = smtSymbol(inp.name);
    lines.push(`  (<= ${smtDecimal(lo)} ${x}) (<= ${x} ${smtDecimal(hi)})`);
  });
  lines.push('))', '');
  const allowedNames = rule.allowed.map((a) => table.advisories[a]).join(' or ');
  lines.push(`; negation of "expect ${allowedNames}"`);
  lines.push(`(assert ${negatedProperty(table, rule.allowed)})`, '', '(check-sat)', '(exit)', '');
  return lines.join('\n');
}
