import type { CheckedRule, Scenario } from '../types.js';
import { workerPool } from '../pool/index.js';
import type { ProveTask, WorkerInit } from './prove-worker-protocol.js';

/** Proof workers that stay up between tables (proveInWorkers starts and stops its own). */
export interface ProofPool {
  /** Settles the rules, each followed by its sub-rules, in table order. */
  prove(rules: readonly CheckedRule[], onDone?: (done: number) => void): Promise<CheckedRule[][]>;
  close(): Promise<void>;
}

/**
 * Starts `jobs` proof workers (src/pool), each with its own onnxruntime session and layer
 * list. Rules are handed out one at a time (the next free worker takes the next rule) and
 * results are put back in table order, so the outcome does not depend on the number of
 * workers as long as no rule hits its time budget (the box budget is deterministic).
 */
export function proofPool(scenario: Scenario, init: Omit<WorkerInit, 'scenario'>, jobs: number): ProofPool {
  const pool = workerPool<ProveTask, CheckedRule[]>({
    base: import.meta.url,
    name: './prove-worker',
    workerData: { ...init, scenario } satisfies WorkerInit,
    size: jobs,
  });
  return {
    prove(rules, onDone) {
      let done = 0;
      return Promise.all(
        rules.map(async (checked) => {
          const settled = await pool.run({ checked });
          onDone?.(++done);
          return settled;
        }),
      );
    },
    close: () => pool.close(),
  };
}

/** Proves rules on `jobs` proof workers started for them (see proofPool) and stops them after. */
export async function proveInWorkers(
  rules: readonly CheckedRule[],
  scenario: Scenario,
  init: Omit<WorkerInit, 'scenario'>,
  jobs: number,
  onDone: (done: number) => void,
): Promise<CheckedRule[][]> {
  const pool = proofPool(scenario, init, Math.min(jobs, rules.length));
  try {
    return await pool.prove(rules, onDone);
  } finally {
    await pool.close();
  }
}
