import { FileError } from '../errors.js';
import { itemsSha256 } from './make-partial.js';
import { partialFileName, type PartialFile, type PartialRun } from './partial-file.js';

/** A partial file with the path it was read from. */
export interface PartAt {
  readonly path: string;
  readonly part: PartialFile;
}

/** Characters of a SHA-256 shown in messages: enough to tell two files apart at a glance. */
const SHA_SHOWN = 12;

function shown(v: unknown): string {
  if (typeof v === 'string' && /^[0-9a-f]{64}$/.test(v)) return v.slice(0, SHA_SHOWN) + '…';
  return JSON.stringify(v ?? null);
}

/** The first field where two runs differ, as [what, found, expected]; undefined when they match. */
function firstDifference(a: PartialRun, b: PartialRun): [string, unknown, unknown] | undefined {
  const fields: Array<[string, unknown, unknown]> = [
    ['command', a.command, b.command],
    ['tool version', a.toolVersion, b.toolVersion],
    ['scenario SHA-256', a.scenarioSha256, b.scenarioSha256],
  ];
  const roles = [...new Set([...Object.keys(a.models ?? {}), ...Object.keys(b.models ?? {})])].sort();
  for (const r of roles) fields.push([`${r} SHA-256`, a.models?.[r], b.models?.[r]]);
  fields.push(['rules input SHA-256', a.inputSha256, b.inputSha256], ['seed', a.seed, b.seed]);
  const keys = [...new Set([...Object.keys(a.settings ?? {}), ...Object.keys(b.settings ?? {})])].sort();
  for (const key of keys) fields.push([`setting ${key}`, a.settings?.[key], b.settings?.[key]]);
  fields.push(
    ['shard count N', a.shards, b.shards],
    ['number of work items', a.items, b.items],
    ['work-item list SHA-256', a.itemsSha256, b.itemsSha256],
    ['report', a.report, b.report],
  );
  return fields.find(([, x, y]) => JSON.stringify(x) !== JSON.stringify(y));
}

/**
 * Checks that partial files are the complete set of parts of one run: the same command, tool
 * version, input files (SHA-256), seed, settings and shard count N; each K once; the work items
 * disjoint and together exactly the run's list. Stops at the first problem.
 * @throws FileError with a one-line message naming the file and what differs:
 *   `SHARD_MIXED` (parts of different runs), `SHARD_OVERLAP` (a shard or an item given twice),
 *   `SHARD_MISSING` (a shard or an item not given)
 */
export function checkParts(parts: readonly PartAt[]): void {
  if (parts.length === 0) throw new FileError('SHARD_MISSING', 'no partial result files given');
  const ref = parts[0]!;
  for (const p of parts.slice(1)) {
    const diff = firstDifference(p.part.run, ref.part.run);
    if (diff) {
      const [what, found, expected] = diff;
      throw new FileError('SHARD_MIXED', `${p.path}: ${what} ${shown(found)} differs from ${shown(expected)} in ${ref.path}; the parts are not from one run`);
    }
  }
  const n = ref.part.run.shards;
  const byK = new Map<number, string>();
  for (const p of parts) {
    const other = byK.get(p.part.shard);
    if (other !== undefined) throw new FileError('SHARD_OVERLAP', `${p.path}: shard ${p.part.shard}/${n} is also given as ${other}`);
    byK.set(p.part.shard, p.path);
  }
  const total = ref.part.run.items;
  const owner = new Array<string | undefined>(total);
  const ids = new Array<string>(total);
  for (const p of parts) {
    for (const it of p.part.items) {
      if (it.index < 0 || it.index >= total) throw new FileError('SHARD_MIXED', `${p.path}: work item ${it.index} (${it.id}) is outside the run's ${total} items`);
      const other = owner[it.index];
      if (other !== undefined) throw new FileError('SHARD_OVERLAP', `${p.path}: work item ${it.index} (${it.id}) is also in ${other}`);
      owner[it.index] = p.path;
      ids[it.index] = it.id;
    }
  }
  const missingK: number[] = [];
  for (let k = 1; k <= n; k++) if (!byK.has(k)) missingK.push(k);
  if (missingK.length > 0) {
    const names = missingK.map((k) => partialFileName({ k, n })).join(', ');
    throw new FileError('SHARD_MISSING', `missing ${missingK.length} of ${n} parts: ${names} (given: ${parts.map((p) => p.path).join(', ')})`);
  }
  const hole = owner.findIndex((o) => o === undefined);
  if (hole >= 0) throw new FileError('SHARD_MISSING', `work item ${hole} of ${total} is in no part (given: ${parts.map((p) => p.path).join(', ')})`);
  if (itemsSha256(ids) !== ref.part.run.itemsSha256) {
    throw new FileError('SHARD_MIXED', `${ref.path}: the parts' work-item ids do not match the run's list (work-item list SHA-256 ${shown(ref.part.run.itemsSha256)})`);
  }
}
