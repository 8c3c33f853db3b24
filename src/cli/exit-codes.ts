import { ToolError } from '../errors.js';

/** Exit codes of every command (docs/cli.md). */
export const EXIT = {
  /** Success; for check/diff: every rule holds and no gate tripped. */
  OK: 0,
  /** Some rule refuted, or a regression gate tripped. */
  FINDINGS: 1,
  /** Bad input or usage: the message names the file, field or line. */
  BAD_INPUT: 2,
  /** An internal error (a defect of the tool): please report it with --verbose output. */
  INTERNAL: 3,
  /** Interrupted by a signal before outputs were written. */
  INTERRUPTED: 130,
} as const;

/** Maps an error to an exit code: every ToolError is bad input or usage; anything else is ours. */
export function exitCodeFor(error: unknown): number {
  return error instanceof ToolError ? EXIT.BAD_INPUT : EXIT.INTERNAL;
}
