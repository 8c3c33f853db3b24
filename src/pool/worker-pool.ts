import type { Worker } from 'node:worker_threads';
import { reviveError } from './error-data.js';
import type { ReplyMessage, StopMessage, TaskMessage } from './pool-protocol.js';
import { startWorker } from './start-worker.js';

export interface WorkerPoolOptions {
  /** The caller's `import.meta.url`; the worker module is found beside it (see startWorker). */
  readonly base: string;
  /** The worker module's file name without extension, e.g. `./model-worker`. */
  readonly name: string;
  /** Given to every worker as `workerData`. */
  readonly workerData: unknown;
  /** Number of worker threads (≥ 1). */
  readonly size: number;
  /**
   * Tasks handed to one worker before it reports back (default 1). 1 balances uneven tasks
   * best; 2 lets a worker start its next task at once instead of waiting for the main thread,
   * for short, even tasks.
   */
  readonly depth?: number;
}

/** Threads that run tasks of type T to results of type R (see serveTasks for the worker side). */
export interface WorkerPool<T, R> {
  readonly size: number;
  /** Number of workers started so far (ready for tasks). */
  readonly started: number;
  /** Resolves once every worker has started (tasks may be given before: they wait). */
  ready(): Promise<void>;
  /** Runs one task on the next free worker; rejects with the task's (revived) error. */
  run(task: T): Promise<R>;
  /** Stops every worker once idle (see STOP_GRACE_MS); tasks still waiting are rejected. */
  close(): Promise<void>;
}

interface Pending<R> {
  readonly resolve: (r: R) => void;
  readonly reject: (e: Error) => void;
}

interface Slot {
  readonly worker: Worker;
  ready: boolean;
  inFlight: number;
  /** Resolves when the thread has ended (by itself after a stop, or terminated). */
  readonly ended: Promise<void>;
}

/**
 * How long a stopped worker may take to finish its task in hand and end by itself before it is
 * terminated. Terminating a thread while onnxruntime works for it can abort the process, so
 * this is long; it only matters on error paths (a normal close finds every worker idle).
 */
export const STOP_GRACE_MS = 30_000;

/** Every pool not yet closed, so that an interrupt can halt them all (haltAllPools). */
const livePools = new Set<{ halt(): Promise<void> }>();

/**
 * For an interrupt: every live pool hands out no more tasks and asks its workers to end once
 * idle; resolves when they have all ended. Waiting tasks are left unresolved (the process is
 * about to exit). The caller bounds the wait: a worker may be in the middle of a long task.
 */
export async function haltAllPools(): Promise<void> {
  await Promise.all([...livePools].map((p) => p.halt()));
}

/** Asks a worker to end once idle; terminates it only if it has not ended after STOP_GRACE_MS. */
function stopWorker(slot: Slot): Promise<void> {
  try {
    slot.worker.postMessage({ kind: 'stop' } satisfies StopMessage);
  } catch {
    // the thread has ended already: nothing to stop
  }
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<void>((resolve) => {
    timer = setTimeout(() => {
      void slot.worker.terminate().then(() => resolve());
    }, STOP_GRACE_MS);
    timer.unref();
  });
  return Promise.race([slot.ended, late]).finally(() => clearTimeout(timer));
}

/**
 * Starts a pool of worker threads and hands tasks out in the order `run` was called, each to
 * the ready worker with the fewest tasks in hand (up to `depth`). Callers keep results in their
 * own order (each `run` has its own promise), so what a task computes must not depend on which
 * worker runs it. A worker that fails to start, throws outside a task or exits stops the whole
 * pool: every task waiting or running is rejected with that error.
 */
export function workerPool<T, R>(options: WorkerPoolOptions): WorkerPool<T, R> {
  const depth = options.depth ?? 1;
  const queue: Array<{ id: number; task: T }> = [];
  const pending = new Map<number, Pending<R>>();
  let nextId = 0;
  let failure: Error | undefined;
  let closing = false;
  let halted = false;
  let started = 0;
  const waiting: Array<Pending<void>> = [];

  const fail = (error: Error): void => {
    if (failure || closing) return;
    failure = error;
    queue.length = 0;
    for (const p of pending.values()) p.reject(error);
    pending.clear();
    for (const w of waiting.splice(0)) w.reject(error);
    for (const s of slots) void stopWorker(s);
  };

  const dispatch = (): void => {
    while (queue.length > 0 && !halted) {
      let best: Slot | undefined;
      for (const s of slots) if (s.ready && s.inFlight < depth && (!best || s.inFlight < best.inFlight)) best = s;
      if (!best) return;
      const { id, task } = queue.shift()!;
      best.inFlight++;
      best.worker.postMessage({ id, task } satisfies TaskMessage<T>);
    }
  };

  const slots: Slot[] = Array.from({ length: options.size }, () => {
    const worker = startWorker(options.base, options.name, options.workerData);
    const slot: Slot = { worker, ready: false, inFlight: 0, ended: new Promise<void>((resolve) => worker.once('exit', () => resolve())) };
    slot.worker.on('message', (m: ReplyMessage<R>) => {
      if (m.kind === 'ready') {
        slot.ready = true;
        if (++started === options.size) for (const w of waiting.splice(0)) w.resolve();
      } else if (m.kind === 'failed' && m.id === undefined) {
        fail(reviveError(m.error));
        return;
      } else {
        slot.inFlight--;
        const p = pending.get(m.id!);
        pending.delete(m.id!);
        if (m.kind === 'done') p?.resolve(m.result);
        else p?.reject(reviveError(m.error));
      }
      dispatch();
    });
    slot.worker.on('error', (e) => fail(e));
    slot.worker.on('exit', (code) => fail(new Error(`worker thread ${options.name} exited with code ${code}`)));
    return slot;
  });

  const halt = (): Promise<void> => {
    halted = true;
    return Promise.all(slots.map((s) => stopWorker(s))).then(() => undefined);
  };
  const live = { halt };
  livePools.add(live);

  return {
    size: options.size,
    get started() {
      return started;
    },
    ready(): Promise<void> {
      if (failure) return Promise.reject(failure);
      if (started === options.size) return Promise.resolve();
      return new Promise<void>((resolve, reject) => waiting.push({ resolve, reject }));
    },
    run(task: T): Promise<R> {
      if (failure) return Promise.reject(failure);
      if (closing) return Promise.reject(new Error(`worker pool ${options.name} is closed`));
      return new Promise<R>((resolve, reject) => {
        const id = nextId++;
        pending.set(id, { resolve, reject });
        queue.push({ id, task });
        dispatch();
      });
    },
    async close(): Promise<void> {
      if (closing) return;
      closing = true;
      livePools.delete(live);
      const stopped = new Error(`worker pool ${options.name} was closed`);
      for (const p of pending.values()) p.reject(stopped);
      pending.clear();
      for (const w of waiting.splice(0)) w.reject(stopped);
      queue.length = 0;
      await halt();
    },
  };
}
