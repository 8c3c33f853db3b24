import type { RulesJsonDocument } from '../report/index.js';
import type { DiffPart } from '../diff/index.js';
import type { ShardSpec } from './shard-spec.js';

/** Identifies a partial result file and its layout version (docs/formats.md). */
export const PARTIAL_FORMAT = 'specula-partial';
export const PARTIAL_VERSION = 1;

/** The commands whose work can be split with `--shard`. */
export type ShardCommand = 'check' | 'prove' | 'diff';

/** The id of diff's one work item that is not a rule: the changed share and the change rules. */
export const CHANGE_ITEM = '*change';

/**
 * What every part of one run shares, and `merge` compares: the tool, the input files (by
 * SHA-256), the seed, the settings that change the result, the shard count and the whole list
 * of work items (its length and the SHA-256 of its ids).
 */
export interface PartialRun {
  readonly command: ShardCommand;
  readonly tool: string;
  readonly toolVersion: string;
  readonly scenarioSha256: string;
  /** SHA-256 of each model file by role (`model`; `before` and `after` for diff). */
  readonly models: Readonly<Record<string, string>>;
  /** SHA-256 of the file the work items come from (a rule file, rules.json or rules.csv). */
  readonly inputSha256: string;
  readonly seed: number;
  /** Settings that change the result; paths and worker counts are left out. */
  readonly settings: Readonly<Record<string, number | string | boolean>>;
  /** N of `--shard K/N`. */
  readonly shards: number;
  /** Number of work items of the whole run. */
  readonly items: number;
  /** SHA-256 of the whole run's item ids, one a line in item order. */
  readonly itemsSha256: string;
  /** Whether the merged run folder gets report.html (as the single run would write it). */
  readonly report: boolean;
}

/** One work item a part holds: its index and id in the whole run, and how many result rules it gave. */
export interface PartialItem {
  readonly index: number;
  readonly id: string;
  /** Consecutive rules of `table.rules` that belong to this item (0, 1, or 1 + sub-rules). */
  readonly results: number;
}

/** A partial result file: one shard's share of a run. */
export interface PartialFile {
  readonly format: string;
  readonly formatVersion: number;
  readonly run: PartialRun;
  /** K of `--shard K/N`. */
  readonly shard: number;
  readonly items: readonly PartialItem[];
  /** check, prove: this shard's rule table, as rules.json holds one; its rules are the items' results in item order. */
  readonly table?: RulesJsonDocument;
  /** diff: this shard's share of the diff; its rules are the items' results in item order. */
  readonly diff?: DiffPart;
}

/** The file name of a part: `shard-K-of-N.json`, so the parts of one run can share a folder. */
export function partialFileName(spec: ShardSpec): string {
  return `shard-${spec.k}-of-${spec.n}.json`;
}

/** The partial file's text: JSON, two-space indentation, ending with a newline. */
export function partialJsonText(part: PartialFile): string {
  return JSON.stringify(part, null, 2) + '\n';
}
