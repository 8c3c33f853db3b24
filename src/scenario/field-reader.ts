import type { Issue } from '../errors.js';
import { describeValue } from './describe-value.js';
import { childPath } from './json-read.js';
import { nearestField } from './nearest-field.js';

/**
 * Largest magnitude accepted for a bound, offset or normalised bound. The network sees float32
 * inputs: at 1e12 the spacing of float32 values is 65,536 units, so no threshold could be
 * placed with any meaning and interval bounds over such a box are useless (float32 spacing is
 * 2^(e−23) for values in [2^e, 2^(e+1)); IEEE 754-2019, binary32 format).
 */
export const MAX_ABS_VALUE = 1e12;

/**
 * Why a value is not usable as a finite number in a scenario, or undefined when it is.
 * @param value the JSON value found
 * @param what what was expected, e.g. `a finite number` or `a finite non-zero number`
 */
export function numberProblem(value: unknown, what = 'a finite number'): string | undefined {
  if (typeof value !== 'number') return `expected ${what}, found ${describeValue(value)}`;
  if (!Number.isFinite(value)) {
    return `expected ${what}, found ${value} (the number in the file does not fit a 64-bit float)`;
  }
  if (Math.abs(value) > MAX_ABS_VALUE) {
    return `expected a magnitude of at most 1e12, found ${value} (the network's float32 inputs are 65536 units apart there)`;
  }
  return undefined;
}

/** A JSON object, as jsonRead returns it. */
export type JsonObject = Record<string, unknown>;

/** True for a JSON object (not an array or null). */
export function isJsonObject(value: unknown): value is JsonObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/**
 * Reads typed fields from one JSON object, adding an issue (with the field's path) for each
 * field that is missing, of the wrong type or unknown. Never throws: validation collects every
 * problem first.
 */
export class FieldReader {
  constructor(
    private readonly object: JsonObject,
    private readonly path: string,
    private readonly issues: Issue[],
  ) {}

  private has(key: string): boolean {
    return Object.prototype.hasOwnProperty.call(this.object, key);
  }

  private add(key: string, message: string): void {
    this.issues.push({ path: childPath(this.path, key), message });
  }

  /**
   * A string field. Missing: the fallback when given, else an issue. Empty strings are refused
   * when `nonEmpty` is set.
   */
  string(key: string, options: { fallback?: string; nonEmpty?: boolean } = {}): string | undefined {
    const expected = options.nonEmpty ? 'a non-empty string' : 'a string';
    if (!this.has(key)) {
      if (options.fallback !== undefined) return options.fallback;
      this.add(key, `required field is missing (expected ${expected})`);
      return undefined;
    }
    const value = this.object[key];
    if (typeof value !== 'string' || (options.nonEmpty && value.trim() === '')) {
      this.add(key, `expected ${expected}, found ${describeValue(value)}`);
      return undefined;
    }
    return value;
  }

  /** A required finite number of magnitude at most MAX_ABS_VALUE. */
  number(key: string): number | undefined {
    if (!this.has(key)) {
      this.add(key, 'required field is missing (expected a finite number)');
      return undefined;
    }
    const value = this.object[key];
    const problem = numberProblem(value);
    if (problem !== undefined) {
      this.add(key, problem);
      return undefined;
    }
    return value as number;
  }

  /** A required (or optional, when `optional`) JSON value of any type, undefined when absent. */
  value(key: string, expected: string, optional = false): unknown {
    if (this.has(key)) return this.object[key];
    if (!optional) this.add(key, `required field is missing (expected ${expected})`);
    return undefined;
  }

  /** Adds an issue for every field not in `allowed`, suggesting the nearest allowed name. */
  unknownFields(allowed: readonly string[]): void {
    for (const key of Object.keys(this.object)) {
      if (allowed.includes(key)) continue;
      const near = nearestField(key, allowed);
      this.add(
        key,
        near !== undefined ? `unknown field (did you mean "${near}"?)` : `unknown field (expected one of: ${allowed.join(', ')})`,
      );
    }
  }
}
