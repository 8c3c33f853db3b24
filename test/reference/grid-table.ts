import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { thresholdLabel, THRESHOLD_ADVISORIES } from '../diff/threshold-network.js';

/** Grid values on each axis of the tests' tables: cell centres 0.5, 1.5, …, 9.5 of [0, 10]. */
export const AXIS = Array.from({ length: 10 }, (_, i) => i + 0.5);

/**
 * CSV text of a reference table made from the threshold regions (t1, t2) on the AXIS × AXIS grid,
 * rows in the given order of the columns.
 */
export function gridTableCsv(t1: number, t2: number, columns: readonly string[] = ['x1', 'x2', 'advisory']): string {
  const lines = [columns.join(',')];
  for (const x1 of AXIS) {
    for (const x2 of AXIS) {
      const row: Record<string, string> = { x1: String(x1), x2: String(x2), advisory: THRESHOLD_ADVISORIES[thresholdLabel(x1, x2, t1, t2)]! };
      lines.push(columns.map((c) => row[c]).join(','));
    }
  }
  return lines.join('\n') + '\n';
}

/** Writes text to a fresh temporary file and returns its path. */
export function writeTemp(name: string, text: string): string {
  const path = join(mkdtempSync(join(tmpdir(), 'specula-ref-')), name);
  writeFileSync(path, text);
  return path;
}
