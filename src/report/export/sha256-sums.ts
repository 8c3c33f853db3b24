import { createHash } from 'node:crypto';

/** A file of an export: its path relative to the export folder (forward slashes) and its bytes. */
export interface ExportFile {
  readonly path: string;
  readonly data: string | Uint8Array;
}

/**
 * A `SHA256SUMS` listing in the format GNU coreutils `sha256sum` writes and `sha256sum -c`
 * reads: one line per file, `<64 hex digits><two spaces><relative path>` (two spaces: text
 * mode, which GNU treats the same as binary), sorted by path. Paths holding a backslash or a
 * line break would need the escaped form; export paths never do (refused here).
 * @throws RangeError for such a path
 */
export function sha256Sums(files: readonly ExportFile[]): string {
  const lines = files
    .map((f) => {
      if (/[\\\r\n]/.test(f.path)) throw new RangeError(`sha256Sums: path ${JSON.stringify(f.path)} needs escaping`);
      const hex = createHash('sha256').update(typeof f.data === 'string' ? Buffer.from(f.data, 'utf8') : f.data).digest('hex');
      return { path: f.path, line: `${hex}  ${f.path}` };
    })
    .sort((a, b) => (a.path < b.path ? -1 : a.path > b.path ? 1 : 0));
  return lines.map((l) => l.line).join('\n') + '\n';
}
