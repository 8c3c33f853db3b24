import { join } from 'node:path';
import type { RuleTable } from '../types.js';
import { writeFilesAtomic } from './atomic-write.js';
import { rulesCsvText } from './rules-csv.js';
import { rulesJsonText } from './rules-json.js';
import { rulesMdText } from './rules-md.js';

/**
 * Writes rules.json, rules.csv and rules.md into a run folder, all or nothing: every file is
 * staged under a temporary name first, so a failure leaves earlier outputs untouched.
 * @returns the paths written
 */
export function writeRunFolder(dir: string, table: RuleTable): string[] {
  const files = [
    { path: join(dir, 'rules.json'), data: rulesJsonText(table) },
    { path: join(dir, 'rules.csv'), data: rulesCsvText(table) },
    { path: join(dir, 'rules.md'), data: rulesMdText(table) },
  ];
  writeFilesAtomic(files);
  return files.map((f) => f.path);
}
