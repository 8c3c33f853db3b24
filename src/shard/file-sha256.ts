import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { FileError } from '../errors.js';

/**
 * SHA-256 (hex) of a file's bytes: how a part names the file its work items came from.
 * @throws FileError `SHARD_INPUT_UNREADABLE` when the file cannot be read
 */
export function fileSha256(path: string): string {
  try {
    return createHash('sha256').update(readFileSync(path)).digest('hex');
  } catch (e) {
    throw new FileError('SHARD_INPUT_UNREADABLE', `${path}: cannot read (${(e as Error).message})`);
  }
}
