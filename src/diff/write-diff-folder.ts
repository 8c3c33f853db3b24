import { join } from 'node:path';
import { writeFilesAtomic } from '../report/index.js';
import type { DiffResult } from './diff-result.js';
import { diffJsonText } from './diff-json.js';
import { diffMdText } from './diff-md.js';
import type { GateOutcome } from './fail-on.js';

/**
 * Writes diff.json (canonical) and diff.md (readable) into a folder, all or nothing: both are
 * staged under temporary names first, so a failure leaves earlier outputs untouched.
 * @returns the paths written
 */
export function writeDiffFolder(dir: string, result: DiffResult, gates: readonly GateOutcome[]): string[] {
  const files = [
    { path: join(dir, 'diff.json'), data: diffJsonText(result, gates) },
    { path: join(dir, 'diff.md'), data: diffMdText(result, gates) },
  ];
  writeFilesAtomic(files);
  return files.map((f) => f.path);
}
