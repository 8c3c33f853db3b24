import { availableParallelism } from 'node:os';
import type { Argv } from 'yargs';

/** Options shared by every command. */
export function commonOptions<T>(y: Argv<T>) {
  return y
    .option('json', { type: 'boolean', default: false, describe: 'print one machine-readable JSON document on stdout' })
    .option('quiet', { type: 'boolean', default: false, describe: 'no progress and no summary on the terminal' })
    .option('verbose', { type: 'boolean', default: false, describe: 'show stack traces of internal errors' });
}

/** Options of commands that sample the network. */
export function samplingOptions<T>(y: Argv<T>) {
  return y
    .option('seed', { type: 'number', default: 1, describe: 'seed of every random choice: the same seed gives the same rules' })
    .option('confidence', { type: 'number', default: 0.95, describe: 'confidence of the exact bounds and intervals' })
    .option('jobs', { type: 'number', default: availableParallelism(), describe: 'worker threads for sampling, dense checks and proving (default: the available cores)' })
    .option('threads', { type: 'number', default: 1, describe: 'onnxruntime intra-op threads' });
}

