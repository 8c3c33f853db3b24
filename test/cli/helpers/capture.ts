import type { CliIo } from '../../../src/cli/io.js';

/** A CliIo that keeps what the CLI writes, for assertions on text and exit codes. */
export function capture(cwd: string): CliIo & { out: () => string; err: () => string } {
  let out = '';
  let err = '';
  return {
    stdout: (t) => (out += t),
    stderr: (t) => (err += t),
    isTTY: false,
    cwd,
    out: () => out,
    err: () => err,
  };
}
