import { join } from 'node:path';
import type { RuleTable } from '../types.js';
import { writeFilesAtomic } from './atomic-write.js';
import { rulesCsvText } from './rules-csv.js';
import { rulesJsonText } from './rules-json.js';
import { rulesMdText } from './rules-md.js';

/**
 * Writes rules.json, rules.csv and rules.md (and any extra files, e.g. report.html) into a run folder, all or nothing: every file is
 * staged under a temporary name first, so a failure leaves earlier outputs untouched.
 * @returns the paths written
 */
export function writeRunFolder(dir: string, table: RuleTable, extra: ReadonlyArray<{ name: string; data: string | Uint8Array }> = []): string[] {
  const files = [
    { path: join(dir, 'rules.json'), data: rulesJsonText(table) },
    { path: join(dir, 'rules.csv'), data: rulesCsvText(table) },
    { path: join(dir, 'rules.md'), data: rulesMdText(table) },
    ...(table.coverage ? [{ path: join(dir, 'atlas.json'), data: atlasJsonText(table) }] : []),
    ...extra.map((e) => ({ path: join(dir, e.name), data: e.data })),
  ];
  writeFilesAtomic(files);
  return files.map((f) => f.path);
}

/**
 * atlas.json: the proven boxes of a table with their allowed advisories (names), for the report
 * and for tools that want the proven partition without the rest of the evidence.
 */
export function atlasJsonText(table: RuleTable): string {
  const boxes = table.rules
    .filter((r) => r.evidence.status === 'proven')
    .map(({ rule }) => ({ rule: rule.id, allowed: rule.allowed.map((a) => table.advisories[a]!), box: rule.box.map(([lo, hi]) => [lo, hi]) }));
  return JSON.stringify({ inputs: table.inputs.map((i) => i.name), coverage: table.coverage ?? null, boxes }) + '\n';
}
