/** Messages between a worker pool and its workers (see worker-pool.ts and serve-tasks.ts). */

/** Main thread to worker: one task, numbered by the pool. */
export interface TaskMessage<T> {
  readonly id: number;
  readonly task: T;
}

/**
 * Main thread to worker: finish the task in hand, then end the thread by closing its port. A
 * worker is never terminated while onnxruntime works for it: a native call that completes into
 * a terminated thread aborts the whole process (seen as "terminate called after throwing an
 * instance of 'Napi::Error'").
 */
export interface StopMessage {
  readonly kind: 'stop';
}

/** A failure carried across threads: the error's class name, stable code and message. */
export interface ErrorData {
  readonly name: string;
  readonly code: string | undefined;
  readonly message: string;
}

/** Worker to main thread: ready for tasks, a task's result, or a failure (of a task, or of the start-up when `id` is absent). */
export type ReplyMessage<R> =
  | { readonly kind: 'ready' }
  | { readonly kind: 'done'; readonly id: number; readonly result: R }
  | { readonly kind: 'failed'; readonly id?: number; readonly error: ErrorData };
