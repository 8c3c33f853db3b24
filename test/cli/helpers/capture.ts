import type { CliIo } from '../../../src/cli/io.js';
import { main } from '../../../src/cli/main.js';

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

/** Runs the CLI in `cwd` and returns its exit code and what it wrote on stdout and stderr. */
export async function runCli(cwd: string, args: readonly string[]): Promise<{ code: number; out: string; err: string }> {
  const io = capture(cwd);
  const code = await main(args, io);
  return { code, out: io.out(), err: io.err() };
}
