import { join } from 'node:path';
import { writeFileAtomic } from '../report/index.js';
import { partialFileName, partialJsonText, type PartialFile } from './partial-file.js';

/**
 * Writes a partial result file atomically into a folder, as `shard-K-of-N.json` (the parts of
 * one run may share the folder).
 * @returns the path written
 */
export function writePartial(dir: string, part: PartialFile): string {
  const path = join(dir, partialFileName({ k: part.shard, n: part.run.shards }));
  writeFileAtomic(path, partialJsonText(part));
  return path;
}
