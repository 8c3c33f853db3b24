#!/usr/bin/env node
import { main } from './main.js';
import { EXIT } from './exit-codes.js';

// Interrupted runs end cleanly: signals are handled between event-loop turns, so a file
// being staged synchronously is finished (as a temporary) and no target is half-written.
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    process.stderr.write(`\nspecula: interrupted (${signal}); earlier outputs are untouched\n`);
    process.exit(EXIT.INTERRUPTED);
  });
}

main(process.argv.slice(2)).then((code) => {
  process.exitCode = code;
});
