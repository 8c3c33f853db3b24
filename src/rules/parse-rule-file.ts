import type { InputSpec, Rule } from '../types.js';
import { formatNumber } from './format-number.js';
import { nearestName } from './nearest-name.js';
import { parseRuleLine, type RawRule } from './parse-rule-line.js';
import { RuleFileError, type RuleIssue } from './rule-file-error.js';

/** Rules read from a rule file, with the non-fatal problems found (never printed here). */
export interface ParsedRules {
  readonly rules: Rule[];
  /** Bounds that reached past an input's domain and were clipped to it. */
  readonly warnings: readonly RuleIssue[];
}

/**
 * Reads a rule file (syntax in docs/formats.md, "Rule files") against a scenario's inputs and
 * advisories. Accepts a UTF-8 byte-order mark, LF, CRLF or CR line ends, blank lines and `#`
 * comments. Conditions on the same input in one rule are intersected. Rules without `ID:` get
 * R1, R2, … in file order, skipping ids used explicitly anywhere in the file.
 *
 * Bounds past an input's domain are clipped to it, with a warning: a rule file says what is
 * expected where the scenario is defined, and `cpa_nm < 2` on a domain [0, 1.5] plainly means
 * "everywhere below 2". A box that misses the domain entirely is an error: no input could test it.
 *
 * Every error in the text is collected first (a line with a syntax error yields that one error),
 * then all are thrown together.
 *
 * @param text the file's contents
 * @param file name used in messages (`expectations.rules line 4, col 18: …`) and in rule origins
 * @throws RuleFileError (a RuleSyntaxError, code RULE_SYNTAX) listing every problem with line and column
 */
export function parseRuleFile(
  text: string,
  inputs: readonly InputSpec[],
  advisories: readonly string[],
  file?: string,
): ParsedRules {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const lines = body.split(/\r\n|\r|\n/);
  const issues: RuleIssue[] = [];
  const warnings: RuleIssue[] = [];
  const firstLineOfId = new Map<string, number>();
  const rules: { rule: Omit<Rule, 'id'>; id: string | undefined }[] = [];
  for (let l = 0; l < lines.length; l++) {
    const line = l + 1;
    const parsed = parseRuleLine(lines[l]!);
    if (parsed.kind === 'blank') continue;
    if (parsed.kind === 'error') {
      issues.push({ line, column: parsed.column, message: parsed.message });
      continue;
    }
    const raw = parsed.rule;
    const errorCount = issues.length;
    const report = (column: number, message: string): void => void issues.push({ line, column, message });
    const warn = (column: number, message: string): void => void warnings.push({ line, column, message });
    const box = resolveBox(raw, inputs, report, warn);
    const allowed = resolveAdvisories(raw, advisories, report);
    if (raw.id !== undefined) {
      const first = firstLineOfId.get(raw.id.value);
      if (first !== undefined) report(raw.id.column, `duplicate rule id '${raw.id.value}', first used on line ${first}`);
      else firstLineOfId.set(raw.id.value, line);
    }
    if (issues.length > errorCount) continue;
    const origin = { kind: 'expected' as const, line, ...(file !== undefined && { file }) };
    rules.push({ rule: { box, allowed, origin }, id: raw.id?.value });
  }
  if (issues.length > 0) throw new RuleFileError(issues, file);
  let next = 1;
  const named = rules.map(({ rule, id }) => {
    if (id !== undefined) return { id, ...rule };
    while (firstLineOfId.has(`R${next}`)) next++;
    return { id: `R${next++}`, ...rule };
  });
  return { rules: named, warnings };
}

type Report = (column: number, message: string) => void;

/** The rule's closed box: written bounds intersected per input, then clipped to the domain. */
function resolveBox(raw: RawRule, inputs: readonly InputSpec[], report: Report, warn: Report): [number, number][] {
  const d = inputs.length;
  const lo = new Array<number>(d).fill(-Infinity);
  const hi = new Array<number>(d).fill(Infinity);
  const loColumn = new Array<number>(d).fill(0);
  const hiColumn = new Array<number>(d).fill(0);
  const empty = new Array<boolean>(d).fill(false);
  const names = inputs.map((i) => i.name);
  for (const c of raw.conditions) {
    const f = names.indexOf(c.name.value);
    if (f < 0) {
      const near = nearestName(c.name.value, names);
      const hint = near === undefined ? '' : ` (did you mean '${near}'?)`;
      report(c.name.column, `unknown input '${c.name.value}'${hint}, inputs are: ${names.join(', ')}`);
      continue;
    }
    if (c.lower !== undefined && c.lower.value > lo[f]!) [lo[f], loColumn[f]] = [c.lower.value, c.lower.column];
    if (c.upper !== undefined && c.upper.value < hi[f]!) [hi[f], hiColumn[f]] = [c.upper.value, c.upper.column];
    if (lo[f]! > hi[f]! && !empty[f]) {
      empty[f] = true;
      report(c.column, `contradictory bounds on ${names[f]}: lower ${formatNumber(lo[f]!)} > upper ${formatNumber(hi[f]!)}, the box is empty`);
    }
  }
  return inputs.map(({ name, min, max }, f) => {
    if (empty[f]) return [min, max];
    if (lo[f]! > max || hi[f]! < min) {
      const column = lo[f]! > max ? loColumn[f]! : hiColumn[f]!;
      const shown = `[${lo[f] === -Infinity ? '-inf' : formatNumber(lo[f]!)}, ${hi[f] === Infinity ? 'inf' : formatNumber(hi[f]!)}]`;
      report(column, `${name} ${shown} lies outside its domain [${formatNumber(min)}, ${formatNumber(max)}]`);
      return [min, max];
    }
    if (lo[f]! < min && loColumn[f]! > 0) {
      warn(loColumn[f]!, `${name} lower bound ${formatNumber(lo[f]!)} is below the domain minimum ${formatNumber(min)}, clipped to ${formatNumber(min)}`);
    }
    if (hi[f]! > max && hiColumn[f]! > 0) {
      warn(hiColumn[f]!, `${name} upper bound ${formatNumber(hi[f]!)} is above the domain maximum ${formatNumber(max)}, clipped to ${formatNumber(max)}`);
    }
    return [Math.max(lo[f]!, min), Math.min(hi[f]!, max)];
  });
}

/** Allowed advisory indices, ascending and unique; `expect not …` takes every other advisory. */
function resolveAdvisories(raw: RawRule, advisories: readonly string[], report: Report): number[] {
  const listed = new Set<number>();
  let unknown = 0;
  for (const a of raw.advisories) {
    const k = advisories.indexOf(a.value);
    if (k >= 0) {
      listed.add(k);
      continue;
    }
    unknown++;
    const near = nearestName(a.value, advisories);
    const hint = near === undefined ? '' : ` (did you mean '${near}'?)`;
    report(a.column, `unknown advisory '${a.value}'${hint}, advisories are: ${advisories.join(', ')}`);
  }
  const allowed = advisories.map((_, k) => k).filter((k) => listed.has(k) !== raw.negated);
  if (allowed.length === 0 && unknown === 0) {
    report(raw.advisories[0]!.column, `'expect not' leaves no advisory allowed`);
  }
  return allowed;
}
