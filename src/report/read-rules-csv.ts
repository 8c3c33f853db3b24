import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { FileError } from '../errors.js';
import type { InputSpec, Rule } from '../types.js';

/** A CSV file as rows of text fields, each with the 1-based line it starts on. */
export interface CsvTable {
  readonly file: string;
  readonly fields: readonly string[];
  /** Data rows (header excluded, blank lines skipped). */
  readonly rows: ReadonlyArray<{ readonly line: number; readonly values: readonly string[] }>;
}

/** Rules read from a rules.csv, with the bounds that were clipped to the domain. */
export interface RulesFromCsv {
  readonly rules: Rule[];
  /** One message per clipped bound, located by file, line and column name. */
  readonly warnings: readonly string[];
}

/** At most this many problems are listed in one error; the rest are counted. */
export const CSV_ISSUES_SHOWN = 20;

/** A rule id that a rule file can hold (the rule-file grammar's names). */
const RULE_ID = /^[A-Za-z_][A-Za-z0-9_.-]*$/;

/** Throws one FileError listing the problems (file and line in each), if there are any. */
export function throwCsvIssues(code: string, issues: readonly string[]): void {
  if (issues.length === 0) return;
  const shown = issues.slice(0, CSV_ISSUES_SHOWN);
  const more = issues.length > shown.length ? [`… and ${issues.length - shown.length} more problems`] : [];
  throw new FileError(code, [...shown, ...more].join('\n'));
}

/**
 * Reads a comma-separated file (RFC 4180 quoting, through papaparse) into its header and rows,
 * keeping the line each row starts on for messages. Accepts a UTF-8 byte-order mark, LF or CRLF;
 * skips blank lines. A row with another number of fields than the header is an error.
 * @param path the file; named in messages as given
 * @throws FileError `CSV_UNREADABLE` (missing or unreadable) or `CSV_INVALID` (bad quoting,
 *   ragged rows, no header), listing every problem with its line
 */
export function readCsvTable(path: string): CsvTable {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new FileError('CSV_UNREADABLE', `${path}: cannot read (${code === 'ENOENT' ? 'no such file' : (e as Error).message})`);
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const issues: string[] = [];
  const records: { line: number; values: string[] }[] = [];
  // Rows are taken one by one with blank lines kept, so that each row starts right after the
  // previous one's end (papaparse's cursor) and its line is 1 + the newlines before that point.
  let line = 1;
  let cursor = 0;
  Papa.parse<string[]>(text, {
    delimiter: ',',
    skipEmptyLines: false,
    step: (result) => {
      const start = line;
      const end = result.meta.cursor;
      line += countNewlines(text, cursor, end);
      cursor = end;
      const values = result.data.map((v) => v.trim());
      if (values.every((v) => v === '')) return;
      for (const e of result.errors) issues.push(`${path} line ${start}: ${e.message.replace(/\.$/, '')}`);
      records.push({ line: start, values });
    },
  });
  if (records.length === 0) throwCsvIssues('CSV_INVALID', [`${path}: no header row, the file is empty`]);
  const [header, ...rows] = records;
  for (const r of rows) {
    if (r.values.length !== header!.values.length) {
      issues.push(`${path} line ${r.line}: ${r.values.length} fields, the header has ${header!.values.length}`);
    }
  }
  throwCsvIssues('CSV_INVALID', issues);
  return { file: path, fields: header!.values, rows };
}

function countNewlines(text: string, from: number, to: number): number {
  let c = 0;
  for (let i = from; i < to; i++) if (text.charCodeAt(i) === 10) c++;
  return c;
}

/**
 * Reads the rules of a rules.csv (docs/formats.md, "Run folder"; docs/checking.md) against a
 * scenario: columns `id`, `advisory` (allowed advisories joined by " or ") and `<input>_min`,
 * `<input>_max` for every input; other columns (status, samples, …) are ignored. Bounds past an
 * input's domain are clipped to it with a warning, as the rule-file parser does; a box that
 * misses the domain is an error. Every problem is collected, then thrown once.
 * @param path the rules.csv file
 * @param inputs the scenario's inputs (names and domains)
 * @param advisories the scenario's advisories
 * @returns rules in file order, with origin `expected` at their line
 * @throws FileError `CSV_UNREADABLE`, `CSV_INVALID` or `RULES_CSV_INVALID`, each problem located by line and column
 */
export function readRulesCsv(path: string, inputs: readonly InputSpec[], advisories: readonly string[]): RulesFromCsv {
  const table = readCsvTable(path);
  const issues: string[] = [];
  const at = (line: number, column: string, message: string): string => `${path} line ${line}, column ${column}: ${message}`;
  const index = new Map(table.fields.map((f, i) => [f, i]));
  const wanted = ['id', 'advisory', ...inputs.flatMap((i) => [`${i.name}_min`, `${i.name}_max`])];
  const missing = wanted.filter((w) => !index.has(w));
  if (missing.length > 0) issues.push(`${path} line 1: missing column${missing.length > 1 ? 's' : ''} ${missing.map((m) => `'${m}'`).join(', ')}; expected columns: ${wanted.join(', ')}`);
  const names = new Set(inputs.map((i) => i.name));
  for (const f of table.fields) {
    const m = /^(.*)_(min|max)$/.exec(f);
    if (m && !names.has(m[1]!)) issues.push(`${path} line 1: column '${f}' names no input of the scenario; inputs are: ${[...names].join(', ')}`);
  }
  throwCsvIssues('RULES_CSV_INVALID', issues);
  if (table.rows.length === 0) throwCsvIssues('RULES_CSV_INVALID', [`${path}: no rules, only a header`]);
  const warnings: string[] = [];
  const seen = new Map<string, number>();
  const rules: Rule[] = [];
  for (const { line, values } of table.rows) {
    const before = issues.length;
    const cell = (name: string): string => values[index.get(name)!]!;
    const id = cell('id');
    if (!RULE_ID.test(id)) issues.push(at(line, 'id', `expected a rule id (a letter or '_', then letters, digits, '_', '.', '-'), found '${id}'`));
    else if (seen.has(id)) issues.push(at(line, 'id', `duplicate rule id '${id}', first used on line ${seen.get(id)}`));
    else seen.set(id, line);
    const allowed = new Set<number>();
    for (const name of cell('advisory').split(/\s+or\s+/)) {
      const k = advisories.indexOf(name.trim());
      if (k < 0) issues.push(at(line, 'advisory', `unknown advisory '${name.trim()}', advisories are: ${advisories.join(', ')}`));
      else allowed.add(k);
    }
    const box = inputs.map(({ name, min, max }): [number, number] => {
      const lo = Number(cell(`${name}_min`));
      const hi = Number(cell(`${name}_max`));
      const bad = (side: string, v: string): void => void issues.push(at(line, `${name}_${side}`, `expected a finite number, found '${v}'`));
      if (cell(`${name}_min`) === '' || !Number.isFinite(lo)) bad('min', cell(`${name}_min`));
      if (cell(`${name}_max`) === '' || !Number.isFinite(hi)) bad('max', cell(`${name}_max`));
      if (!(lo <= hi)) {
        if (Number.isFinite(lo) && Number.isFinite(hi)) issues.push(at(line, `${name}_min`, `${name}_min ${lo} > ${name}_max ${hi}, the box is empty`));
        return [min, max];
      }
      if (lo > max || hi < min) {
        issues.push(at(line, `${name}_min`, `${name} [${lo}, ${hi}] lies outside its domain [${min}, ${max}]`));
        return [min, max];
      }
      if (lo < min) warnings.push(at(line, `${name}_min`, `${name} lower bound ${lo} is below the domain minimum ${min}, clipped to ${min}`));
      if (hi > max) warnings.push(at(line, `${name}_max`, `${name} upper bound ${hi} is above the domain maximum ${max}, clipped to ${max}`));
      return [Math.max(lo, min), Math.min(hi, max)];
    });
    if (issues.length > before) continue;
    rules.push({ id, box, allowed: [...allowed].sort((a, b) => a - b), origin: { kind: 'expected', line, file: path } });
  }
  throwCsvIssues('RULES_CSV_INVALID', issues);
  return { rules, warnings };
}
