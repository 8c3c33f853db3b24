import { FileError, LearnError, ModelError, RuleSyntaxError, ToolError, UsageError } from '../errors.js';
import type { ErrorData } from './pool-protocol.js';

/** An error as data that can cross threads (class name, code, message). */
export function errorData(error: unknown): ErrorData {
  const e = error instanceof Error ? error : new Error(String(error));
  return { name: e.name, code: e instanceof ToolError ? e.code : undefined, message: e.message };
}

const TOOL_ERRORS: Record<string, new (code: string, message: string) => ToolError> = { ModelError, LearnError, RuleSyntaxError, FileError, ToolError };

/**
 * The error again on this side: a ToolError of the same class (so the CLI maps it to the same
 * exit code and prints the same message), else a plain Error (an internal defect).
 */
export function reviveError(data: ErrorData): Error {
  if (data.code === undefined) return new Error(data.message);
  if (data.name === 'UsageError') return new UsageError(data.message);
  const Class = TOOL_ERRORS[data.name] ?? ToolError;
  return new Class(data.code, data.message);
}
