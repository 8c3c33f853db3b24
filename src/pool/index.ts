/**
 * Worker threads: a generic pool (tasks handed out in order, results back per task), the
 * worker-side task loop, and the bootstrap that runs .ts workers under tsx and .js workers
 * from dist/.
 */
export { haltAllPools, workerPool, type WorkerPool, type WorkerPoolOptions } from './worker-pool.js';
export { serveTasks } from './serve-tasks.js';
export { startWorker } from './start-worker.js';
export { errorData, reviveError } from './error-data.js';
export type { ErrorData } from './pool-protocol.js';
