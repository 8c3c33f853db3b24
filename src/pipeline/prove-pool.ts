import type { CheckedRule, Scenario } from '../types.js';
import { workerPool } from '../pool/index.js';
import type { ProveTask, WorkerInit } from './prove-worker-protocol.js';

/**
 * Proves rules on `jobs` worker threads (src/pool), each with its own onnxruntime session and
 * layer list. Rules are handed out one at a time (the next free worker takes the next rule) and
 * results are put back in table order, so the outcome does not depend on the number of workers
 * as long as no rule hits its time budget (the box budget is deterministic).
 */
export async function proveInWorkers(
  rules: readonly CheckedRule[],
  scenario: Scenario,
  init: Omit<WorkerInit, 'scenario'>,
  jobs: number,
  onDone: (done: number) => void,
): Promise<CheckedRule[][]> {
  const pool = workerPool<ProveTask, CheckedRule[]>({
    base: import.meta.url,
    name: './prove-worker',
    workerData: { ...init, scenario } satisfies WorkerInit,
    size: Math.min(jobs, rules.length),
  });
  let done = 0;
  try {
    return await Promise.all(
      rules.map(async (checked) => {
        const settled = await pool.run({ checked });
        onDone(++done);
        return settled;
      }),
    );
  } finally {
    await pool.close();
  }
}
