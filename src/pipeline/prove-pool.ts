import { Worker } from 'node:worker_threads';
import type { CheckedRule, Scenario } from '../types.js';
import { ToolError } from '../errors.js';
import type { WorkerInit, WorkerReply } from './prove-worker-protocol.js';

/**
 * Proves rules on `jobs` worker threads, each with its own onnxruntime session and layer list.
 * Rules are handed out one at a time (the next free worker takes the next rule) and results
 * are put back in table order, so the outcome does not depend on the number of workers as
 * long as no rule hits its time budget (the box budget is deterministic).
 */
export async function proveInWorkers(
  rules: readonly CheckedRule[],
  scenario: Scenario,
  init: Omit<WorkerInit, 'scenario'>,
  jobs: number,
  onDone: (done: number) => void,
): Promise<CheckedRule[][]> {
  const fromSources = import.meta.url.endsWith('.ts');
  const url = new URL(fromSources ? './prove-worker.ts' : './prove-worker.js', import.meta.url);
  // The built CLI runs the .js worker. Under the TypeScript sources (tests, tsx) the worker
  // first registers tsx's loader (a dev dependency), then imports the .ts worker.
  const boot = `import(${JSON.stringify(import.meta.resolve('tsx/esm/api'))}).then((m) => { m.register(); return import(${JSON.stringify(url.href)}); })`;
  const start = (data: WorkerInit): Worker => (fromSources ? new Worker(boot, { eval: true, workerData: data }) : new Worker(url, { workerData: data }));
  const results: CheckedRule[][] = new Array(rules.length);
  let next = 0;
  let done = 0;
  const workers: Worker[] = [];
  try {
    await Promise.all(
      Array.from({ length: Math.min(jobs, rules.length) }, () =>
        new Promise<void>((resolve, reject) => {
          const w = start({ ...init, scenario });
          workers.push(w);
          const feed = (): void => {
            if (next >= rules.length) {
              resolve();
              return;
            }
            const i = next++;
            w.postMessage({ i, checked: rules[i] });
          };
          w.on('message', (m: WorkerReply) => {
            if (m.kind === 'ready') return feed();
            if (m.kind === 'error') return reject(m.tool ? new ToolError(m.code, m.message) : new Error(m.message));
            results[m.i] = m.rules;
            onDone(++done);
            feed();
          });
          w.on('error', reject);
          w.on('exit', (code) => {
            if (code !== 0) reject(new Error(`proof worker exited with code ${code}`));
          });
        }),
      ),
    );
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
  return results;
}
