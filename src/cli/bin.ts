#!/usr/bin/env node
import { main } from './main.js';
import { EXIT } from './exit-codes.js';
import { filesReplaced } from '../report/index.js';
import { haltAllPools } from '../pool/index.js';

// Interrupted runs end cleanly: signals are handled between event-loop turns, so a set of files
// being written synchronously is finished (all renamed into place) before the handler runs and
// no target is half-written. Worker threads are asked to end once idle before the process exits
// (at most INTERRUPT_GRACE_MS): exiting while onnxruntime works in a worker aborts the process.
// The message, written at exit, says whether any output was replaced meanwhile.
const INTERRUPT_GRACE_MS = 3_000;
let interrupted = false;
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    const exit = (): never => {
      const n = filesReplaced();
      const state = n === 0 ? 'earlier outputs are untouched' : `the ${n} output file${n === 1 ? '' : 's'} written before it are complete`;
      process.stderr.write(`\nspecula: interrupted (${signal}); ${state}\n`);
      process.exit(EXIT.INTERRUPTED);
    };
    if (interrupted) exit(); // a second signal: do not wait for the workers
    interrupted = true;
    const grace = new Promise<void>((resolve) => setTimeout(resolve, INTERRUPT_GRACE_MS).unref());
    void Promise.race([haltAllPools(), grace]).finally(exit);
  });
}

main(process.argv.slice(2)).then((code) => {
  process.exitCode = code;
});
