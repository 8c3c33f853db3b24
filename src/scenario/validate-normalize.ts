import type { Issue } from '../errors.js';
import type { InputSpec, Normalization } from '../types.js';
import { describeValue } from './describe-value.js';
import { FieldReader, isJsonObject, MAX_ABS_VALUE, numberProblem } from './field-reader.js';

const NORMALIZE_FIELDS = ['offset', 'scale'] as const;

function numberArray(value: unknown, path: string, width: number | undefined, nonZero: boolean, issues: Issue[]): number[] | undefined {
  if (value === undefined) return undefined;
  if (!Array.isArray(value)) {
    issues.push({ path, message: `expected an array of numbers (one per input), found ${describeValue(value)}` });
    return undefined;
  }
  const before = issues.length;
  if (width !== undefined && value.length !== width) {
    issues.push({ path, message: `expected ${width} numbers (one per input), found ${value.length}` });
  }
  value.forEach((v: unknown, i: number) => {
    const problem = nonZero && v === 0 ? 'expected a finite non-zero number, found 0' : numberProblem(v, nonZero ? 'a finite non-zero number' : 'a finite number');
    if (problem !== undefined) issues.push({ path: `${path}[${i}]`, message: problem });
  });
  return issues.length === before ? (value as number[]) : undefined;
}

/**
 * Validates the optional `normalize` object: the network's input is `(x - offset) / scale`, per
 * input, so both arrays need one finite number per input and no scale may be 0. The normalised
 * box must also stay within ±1e12 (a tiny scale would push float32 network inputs to overflow).
 * @param value the JSON value of `normalize` (undefined when absent: no normalisation)
 * @param width the number of entries in `inputs`, when that is an array
 * @param inputs the validated inputs, when they are all valid
 * @param issues receives one issue per problem found; nothing is thrown
 */
export function validateNormalize(
  value: unknown,
  width: number | undefined,
  inputs: readonly InputSpec[] | undefined,
  issues: Issue[],
): Normalization | undefined {
  if (value === undefined) return undefined;
  if (!isJsonObject(value)) {
    issues.push({ path: 'normalize', message: `expected an object {"offset": [...], "scale": [...]}, found ${describeValue(value)}` });
    return undefined;
  }
  const fields = new FieldReader(value, 'normalize', issues);
  fields.unknownFields(NORMALIZE_FIELDS);
  const offset = numberArray(fields.value('offset', 'an array of numbers, one per input'), 'normalize.offset', width, false, issues);
  const scale = numberArray(fields.value('scale', 'an array of non-zero numbers, one per input'), 'normalize.scale', width, true, issues);
  if (offset === undefined || scale === undefined) return undefined;
  if (inputs !== undefined) {
    let ok = true;
    inputs.forEach((input, i) => {
      const lo = (input.min - offset[i]!) / scale[i]!;
      const hi = (input.max - offset[i]!) / scale[i]!;
      if (Math.max(Math.abs(lo), Math.abs(hi)) > MAX_ABS_VALUE) {
        ok = false;
        issues.push({
          path: `normalize`,
          message: `input ${JSON.stringify(input.name)} maps to [${Math.min(lo, hi)}, ${Math.max(lo, hi)}], beyond ±1e12 (check scale[${i}])`,
        });
      }
    });
    if (!ok) return undefined;
  }
  return { offset: [...offset], scale: [...scale] };
}
