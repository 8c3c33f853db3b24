import { join } from 'node:path';
import { writeFilesAtomic } from '../atomic-write.js';
import type { ExportFile } from './sha256-sums.js';

/**
 * Writes an export's files under `dir`, all or nothing (staged, then renamed: a failure leaves
 * earlier outputs untouched).
 * @returns the absolute or `dir`-relative paths written, in the files' order
 */
export function writeExport(dir: string, files: readonly ExportFile[]): string[] {
  const staged = files.map((f) => ({ path: join(dir, ...f.path.split('/')), data: f.data }));
  writeFilesAtomic(staged);
  return staged.map((f) => f.path);
}
