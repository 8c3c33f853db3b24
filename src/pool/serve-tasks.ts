import { parentPort } from 'node:worker_threads';
import { errorData } from './error-data.js';
import type { ReplyMessage, StopMessage, TaskMessage } from './pool-protocol.js';

/**
 * The worker side of a pool: runs `start` once (load a model, say), reports ready, then runs
 * the tasks it is sent one after another, in the order they arrive, and posts each result (or
 * the task's error) back. A stop message (sent before or after start-up ends) closes the port
 * once the tasks before it are done, and the thread ends on its own. A failure of `start` is reported without a task id and stops the pool.
 * @param start prepares the worker and returns the task handler
 */
export async function serveTasks<T, R>(start: () => Promise<(task: T) => Promise<R>>): Promise<void> {
  const port = parentPort;
  if (!port) throw new Error('serveTasks: not running in a worker thread');
  const send = (m: ReplyMessage<R>): void => port.postMessage(m);
  let handle: (task: T) => Promise<R>;
  try {
    handle = await start();
  } catch (e) {
    send({ kind: 'failed', error: errorData(e) });
    return;
  }
  // one task at a time: tasks arriving while one runs wait their turn in arrival order
  let chain: Promise<void> = Promise.resolve();
  port.on('message', (m: TaskMessage<T> | StopMessage) => {
    if ('kind' in m) {
      // stop: after the tasks already here, close the port; the thread then ends by itself
      chain = chain.then(() => port.close());
      return;
    }
    chain = chain.then(async () => {
      try {
        send({ kind: 'done', id: m.id, result: await handle(m.task) });
      } catch (e) {
        send({ kind: 'failed', id: m.id, error: errorData(e) });
      }
    });
  });
  send({ kind: 'ready' });
}
