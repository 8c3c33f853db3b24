#!/usr/bin/env node
import { main } from './main.js';
import { EXIT } from './exit-codes.js';
import { filesReplaced } from '../report/index.js';

// Interrupted runs end cleanly: signals are handled between event-loop turns, so a set of files
// being written synchronously is finished (all renamed into place) before the handler runs and
// no target is half-written. The message says which of the two cases happened.
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    const n = filesReplaced();
    const state = n === 0 ? 'earlier outputs are untouched' : `the ${n} output file${n === 1 ? '' : 's'} written before it are complete`;
    process.stderr.write(`\nspecula: interrupted (${signal}); ${state}\n`);
    process.exit(EXIT.INTERRUPTED);
  });
}

main(process.argv.slice(2)).then((code) => {
  process.exitCode = code;
});
