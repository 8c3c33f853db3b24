import { UsageError } from '../errors.js';

/** `--name` must be a whole number ≥ 1. */
export function positiveInt(name: string, v: number): number {
  if (!Number.isInteger(v) || v < 1) throw new UsageError(`--${name}: expected a positive integer, found ${v}`);
  return v;
}

/** `--name` must be a finite number > 0. */
export function positiveNumber(name: string, v: number): number {
  if (!(Number.isFinite(v) && v > 0)) throw new UsageError(`--${name}: expected a positive number, found ${v}`);
  return v;
}

/** `--name` must be a share in [0, 1). */
export function shareBelowOne(name: string, v: number): number {
  if (!(v >= 0 && v < 1)) throw new UsageError(`--${name}: expected a number in [0, 1), found ${v}`);
  return v;
}

/** A compact UTC timestamp for default output folder names, e.g. 20261202T065500Z. */
export function timestamp(d: Date): string {
  return d.toISOString().replace(/[-:]/g, '').replace(/\.\d+Z$/, 'Z');
}
