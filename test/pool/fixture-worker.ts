import { threadId, workerData } from 'node:worker_threads';
import { ModelError } from '../../src/errors.js';
import { serveTasks } from '../../src/pool/index.js';

/**
 * A worker for the pool tests: squares numbers after a given number of event-loop turns (so
 * tasks finish out of order across workers), throws a ModelError on a negative number, and
 * fails its start-up when workerData says so.
 */
const init = workerData as { failStart?: boolean };

await serveTasks<{ value: number; turns: number }, { square: number; thread: number }>(async () => {
  if (init.failStart) throw new ModelError('MODEL_CHANGED', 'fixture: start-up refused');
  return async ({ value, turns }) => {
    for (let t = 0; t < turns; t++) await new Promise((r) => setImmediate(r));
    if (value < 0) throw new ModelError('MODEL_NONFINITE_SCORE', `fixture: negative value ${value}`);
    return { square: value * value, thread: threadId };
  };
});
