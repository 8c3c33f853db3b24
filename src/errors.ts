/**
 * Typed errors. Every user-facing failure is a `ToolError` with a stable `code`; the CLI maps
 * `UsageError`/input errors to exit code 2 and prints only the message (no stack).
 * Messages say what is wrong, where, and what was found against what was expected; no final period.
 */
export class ToolError extends Error {
  readonly code: string;
  constructor(code: string, message: string) {
    super(message);
    this.name = new.target.name;
    this.code = code;
  }
}

/** One problem found while validating a file, with its location. */
export interface Issue {
  /** Field path such as `inputs[2].max`, or `line 4, col 18`. */
  readonly path: string;
  readonly message: string;
}

/** Bad scenario file; holds every issue found, not just the first. */
export class ScenarioError extends ToolError {
  readonly file: string;
  readonly issues: readonly Issue[];
  constructor(file: string, issues: readonly Issue[], code = 'SCENARIO_INVALID') {
    super(code, `${file}: ` + issues.map((i) => (i.path ? `${i.path}: ${i.message}` : i.message)).join('; '));
    this.file = file;
    this.issues = issues;
  }
}

/** Model file missing, not ONNX, wrong widths, or producing non-finite scores. */
export class ModelError extends ToolError {}

/** Training data or learning options that the tree learner cannot use. */
export class LearnError extends ToolError {}

/** Rule text or rule file that cannot be read. */
export class RuleSyntaxError extends ToolError {}

/** Bad command line. */
export class UsageError extends ToolError {
  constructor(message: string) {
    super('USAGE', message);
  }
}

/** A run folder or input file that cannot be read or written. */
export class FileError extends ToolError {}
