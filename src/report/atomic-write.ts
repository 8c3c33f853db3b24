import { mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { FileError } from '../errors.js';

let counter = 0;
/** Targets this process has replaced so far (after their rename), for the interrupt message. */
let replaced = 0;

/** How many output files this process has written completely (renamed into place) so far. */
export function filesReplaced(): number {
  return replaced;
}

/**
 * Writes a file atomically: the data go to a temporary file in the same folder, which is then
 * renamed over the target (rename is atomic within one file system on POSIX). A failure or an
 * interruption never leaves half a file; the previous content stays until the rename.
 */
export function writeFileAtomic(path: string, data: string | Uint8Array): void {
  const dir = dirname(path);
  const tmp = join(dir, `.${basename(path)}.${process.pid}.${counter++}.tmp`);
  try {
    mkdirSync(dir, { recursive: true });
    writeFileSync(tmp, data);
    renameSync(tmp, path);
    replaced++;
  } catch (e) {
    rmSync(tmp, { force: true });
    throw new FileError('FILE_WRITE', `${path}: cannot write (${(e as Error).message})`);
  }
}

/**
 * Writes several files so that none is replaced until all are ready: each goes to a temporary
 * file first, then all are renamed. If preparing any fails, the temporaries are removed and the
 * earlier outputs stay untouched.
 */
export function writeFilesAtomic(files: ReadonlyArray<{ path: string; data: string | Uint8Array }>): void {
  const staged: Array<{ tmp: string; path: string }> = [];
  try {
    for (const f of files) {
      const dir = dirname(f.path);
      mkdirSync(dir, { recursive: true });
      const tmp = join(dir, `.${basename(f.path)}.${process.pid}.${counter++}.tmp`);
      writeFileSync(tmp, f.data);
      staged.push({ tmp, path: f.path });
    }
  } catch (e) {
    for (const s of staged) rmSync(s.tmp, { force: true });
    throw new FileError('FILE_WRITE', `cannot write outputs (${(e as Error).message})`);
  }
  for (const s of staged) {
    renameSync(s.tmp, s.path);
    replaced++;
  }
}
