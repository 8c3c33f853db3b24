import { UsageError } from '../../errors.js';
import { rulesCsvText } from '../rules-csv.js';
import { rulesMdText } from '../rules-md.js';
import type { RulesJsonDocument } from '../rules-json.js';
import { cautionsTxt } from './cautions-txt.js';
import { fromRulesJson } from './from-rules-json.js';
import { sha256Sums, type ExportFile } from './sha256-sums.js';
import { smtlibRule } from './smtlib-rule.js';

export const EXPORT_FORMATS = ['csv', 'md', 'json', 'smtlib', 'bundle'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

export interface ExportInput {
  /** The run's rules.json, parsed. */
  readonly doc: RulesJsonDocument;
  /** The run's rules.json text, copied unchanged into json exports. */
  readonly rulesJsonText: string;
  /** report.html, needed by the bundle only. */
  readonly reportHtml?: string;
}

/** File name of a rule's SMT-LIB query: its id with anything unsafe in file names replaced. */
function smtFileNames(ids: readonly string[]): string[] {
  const used = new Set<string>();
  return ids.map((id, i) => {
    let base = id.replace(/[^A-Za-z0-9_.-]/g, '_').replace(/^\.+/, '_') || `rule${i + 1}`;
    if (used.has(base.toLowerCase())) base = `${base}_${i + 1}`;
    used.add(base.toLowerCase());
    return `${base}.smt2`;
  });
}

/**
 * The files of one export, with paths relative to the export folder. Every export carries the
 * cautions: rules.json in its `cautions` field, rules.md at its top, rules.csv through its
 * companion CAUTIONS.txt, each SMT-LIB file in comments, report.html at its top.
 *
 * - csv: rules.csv, CAUTIONS.txt
 * - md: rules.md
 * - json: rules.json (the run's file, byte for byte)
 * - smtlib: `<rule id>.smt2` per rule
 * - bundle: all of the above (the SMT-LIB files under smtlib/), report.html, and SHA256SUMS
 *   listing every other file (`sha256sum -c SHA256SUMS` verifies the folder)
 * @throws UsageError for a bundle without report.html
 */
export function exportFiles(format: ExportFormat, input: ExportInput): ExportFile[] {
  const table = fromRulesJson(input.doc);
  const smt = (dir: string): ExportFile[] => {
    const names = smtFileNames(table.rules.map((r) => r.rule.id));
    return table.rules.map((_, i) => ({ path: dir + names[i]!, data: smtlibRule(table, i) }));
  };
  const csv = (): ExportFile[] => [
    { path: 'rules.csv', data: rulesCsvText(table) },
    { path: 'CAUTIONS.txt', data: cautionsTxt(table) },
  ];
  switch (format) {
    case 'csv':
      return csv();
    case 'md':
      return [{ path: 'rules.md', data: rulesMdText(table) }];
    case 'json':
      return [{ path: 'rules.json', data: input.rulesJsonText }];
    case 'smtlib':
      return smt('');
    case 'bundle': {
      if (input.reportHtml === undefined) throw new UsageError('export bundle: report.html is needed and was not built');
      const files: ExportFile[] = [
        { path: 'rules.json', data: input.rulesJsonText },
        ...csv(),
        { path: 'rules.md', data: rulesMdText(table) },
        { path: 'report.html', data: input.reportHtml },
        ...smt('smtlib/'),
      ];
      return [...files, { path: 'SHA256SUMS', data: sha256Sums(files) }];
    }
  }
}
