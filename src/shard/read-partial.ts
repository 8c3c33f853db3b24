import { readFileSync } from 'node:fs';
import { FileError } from '../errors.js';
import { PARTIAL_FORMAT, PARTIAL_VERSION, type PartialFile } from './partial-file.js';

function kindOf(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (Array.isArray(v)) return 'an array';
  return v === null ? 'null' : typeof v;
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/**
 * Reads a partial result file (`shard-K-of-N.json`) and checks its outline: the format name and
 * version, the run identity, the shard number, the items and the table. Whether the parts fit
 * together is `checkParts`' job.
 * @param path the file, named in messages as given
 * @throws FileError `PARTIAL_UNREADABLE`, `PARTIAL_JSON` or `PARTIAL_INVALID`
 */
export function readPartial(path: string): PartialFile {
  let text: string;
  try {
    text = readFileSync(path, 'utf8').replace(/^\uFEFF/, '');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new FileError('PARTIAL_UNREADABLE', `${path}: cannot read the partial result (${code === 'ENOENT' ? 'no such file' : (e as Error).message})`);
  }
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch (e) {
    throw new FileError('PARTIAL_JSON', `${path}: not valid JSON (${(e as Error).message})`);
  }
  if (!isObject(doc)) throw new FileError('PARTIAL_INVALID', `${path}: expected a JSON object, found ${kindOf(doc)}`);
  if (doc['format'] !== PARTIAL_FORMAT || doc['formatVersion'] !== PARTIAL_VERSION) {
    throw new FileError(
      'PARTIAL_INVALID',
      `${path}: expected format "${PARTIAL_FORMAT}" version ${PARTIAL_VERSION}, found ${JSON.stringify(doc['format'] ?? null)} version ${JSON.stringify(doc['formatVersion'] ?? null)}`,
    );
  }
  const run = doc['run'];
  if (!isObject(run)) throw new FileError('PARTIAL_INVALID', `${path}: run: expected an object, found ${kindOf(run)}`);
  const shards = run['shards'];
  if (!Number.isInteger(shards) || (shards as number) < 1) throw new FileError('PARTIAL_INVALID', `${path}: run.shards: expected a whole number >= 1, found ${JSON.stringify(shards ?? null)}`);
  const k = doc['shard'];
  if (!Number.isInteger(k) || (k as number) < 1 || (k as number) > (shards as number)) {
    throw new FileError('PARTIAL_INVALID', `${path}: shard: expected a whole number in [1, ${shards}], found ${JSON.stringify(k ?? null)}`);
  }
  const items = doc['items'];
  if (!Array.isArray(items)) throw new FileError('PARTIAL_INVALID', `${path}: items: expected an array, found ${kindOf(items)}`);
  items.forEach((it: unknown, i) => {
    if (!isObject(it) || !Number.isInteger(it['index']) || typeof it['id'] !== 'string' || !Number.isInteger(it['results'])) {
      throw new FileError('PARTIAL_INVALID', `${path}: items[${i}]: expected { index, id, results }, found ${JSON.stringify(it)}`);
    }
  });
  const isDiff = run['command'] === 'diff';
  const body = isDiff ? doc['diff'] : doc['table'];
  const name = isDiff ? 'diff' : 'table';
  if (!isObject(body) || !Array.isArray(body['rules'])) {
    throw new FileError('PARTIAL_INVALID', `${path}: ${name}: expected ${isDiff ? 'a share of a diff' : 'a rule table'} with rules, found ${kindOf(body)}`);
  }
  const held = (body['rules'] as unknown[]).length;
  const total = (items as Array<{ results: number }>).reduce((s, it) => s + it.results, 0);
  if (total !== held) throw new FileError('PARTIAL_INVALID', `${path}: items hold ${total} result rules, ${name}.rules has ${held}`);
  return doc as unknown as PartialFile;
}
