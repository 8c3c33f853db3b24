import { toolVersion } from '../version.js';
import { itemsSha256 } from './make-partial.js';
import type { PartialRun, ShardCommand } from './partial-file.js';

/** What a command knows of its whole run when it writes one shard's part. */
export interface RunOfShard<S extends { readonly seed: number }> {
  readonly scenarioSha256: string;
  /** SHA-256 of each model file by role (`model`; `before` and `after` for diff). */
  readonly models: Readonly<Record<string, string>>;
  /** SHA-256 of the file the work items come from. */
  readonly inputSha256: string;
  /** The run's settings with its seed; `jobs` (speed only) is left out of the part. */
  readonly settings: S;
  /** N of `--shard K/N`. */
  readonly shards: number;
  /** Ids of the whole run's work items, in item order. */
  readonly ids: readonly string[];
  /** Whether the merged run folder gets report.html. */
  readonly report: boolean;
}

/**
 * The identity of the whole run that every part carries and `merge` compares: this tool and
 * version, the hashes of scenario, models and input, the seed, the settings that change the
 * result (the worker count does not), N and the whole work list.
 */
export function partialRun<S extends { readonly seed: number }>(command: ShardCommand, run: RunOfShard<S>): PartialRun {
  const { tool, version } = toolVersion();
  const recorded: Record<string, number | string | boolean> = {};
  for (const [key, value] of Object.entries(run.settings)) {
    if (key === 'seed' || key === 'jobs') continue;
    // settings are plain values (numbers, strings, flags); unset ones would vanish in JSON anyway
    if (value !== undefined) recorded[key] = value as number | string | boolean;
  }
  return {
    command,
    tool,
    toolVersion: version,
    scenarioSha256: run.scenarioSha256,
    models: run.models,
    inputSha256: run.inputSha256,
    seed: run.settings.seed,
    settings: recorded,
    shards: run.shards,
    items: run.ids.length,
    itemsSha256: itemsSha256(run.ids),
    report: run.report,
  };
}
