import { Worker } from 'node:worker_threads';

/**
 * Starts a worker thread on the module `name` (no extension) beside `base`, a caller's
 * `import.meta.url`. The built CLI runs the compiled `.js` file from dist/. Under the TypeScript
 * sources (tests, `tsx`) the caller's URL ends in `.ts`: the worker then first registers tsx's
 * loader (a dev dependency, absent from an installed CLI, which never takes this path) and
 * imports the `.ts` module.
 * @param base the caller's `import.meta.url`
 * @param name the worker module's file name without extension, e.g. `./prove-worker`
 * @param workerData cloned into the worker as `workerData`
 */
export function startWorker(base: string, name: string, workerData: unknown): Worker {
  const fromSources = base.endsWith('.ts');
  const url = new URL(`${name}${fromSources ? '.ts' : '.js'}`, base);
  if (!fromSources) return new Worker(url, { workerData });
  const boot = `import(${JSON.stringify(import.meta.resolve('tsx/esm/api'))}).then((m) => { m.register(); return import(${JSON.stringify(url.href)}); })`;
  return new Worker(boot, { eval: true, workerData });
}
