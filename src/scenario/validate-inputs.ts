import type { Issue } from '../errors.js';
import type { InputSpec } from '../types.js';
import { describeValue } from './describe-value.js';
import { FieldReader, isJsonObject } from './field-reader.js';
import { nameProblem } from './names.js';

/**
 * Most inputs a scenario may have: a limit of this tool. It equals the dimensions of the
 * sampler's Sobol direction-number table (SOBOL_MAX_DIMENSION in src/sampling/sobol.ts; a test
 * keeps the two equal), so a scenario the loader accepts can always be sampled.
 */
export const MAX_INPUTS = 21;

const INPUT_FIELDS = ['name', 'unit', 'min', 'max', 'description'] as const;

/**
 * Validates the `inputs` array of a scenario.
 * @param value the JSON value of `inputs` (undefined when the field is missing)
 * @param issues receives one issue per problem found; nothing is thrown
 * @returns the inputs when all of them are valid, else undefined
 */
export function validateInputs(value: unknown, issues: Issue[]): InputSpec[] | undefined {
  if (value === undefined) {
    issues.push({ path: 'inputs', message: 'required field is missing (expected an array of inputs)' });
    return undefined;
  }
  if (!Array.isArray(value)) {
    issues.push({ path: 'inputs', message: `expected an array of inputs, found ${describeValue(value)}` });
    return undefined;
  }
  if (value.length === 0) {
    issues.push({ path: 'inputs', message: 'expected at least 1 input, found 0' });
    return undefined;
  }
  if (value.length > MAX_INPUTS) {
    issues.push({
      path: 'inputs',
      message: `expected at most ${MAX_INPUTS} inputs (a limit of this tool), found ${value.length}`,
    });
    return undefined;
  }
  const before = issues.length;
  const out: InputSpec[] = [];
  const firstIndexOf = new Map<string, number>();
  value.forEach((item: unknown, i: number) => {
    const path = `inputs[${i}]`;
    if (!isJsonObject(item)) {
      issues.push({
        path,
        message: `expected an object with fields ${INPUT_FIELDS.join(', ')}, found ${describeValue(item)}`,
      });
      return;
    }
    const fields = new FieldReader(item, path, issues);
    fields.unknownFields(INPUT_FIELDS);
    const name = fields.string('name');
    const unit = fields.string('unit', { fallback: '' });
    const min = fields.number('min');
    const max = fields.number('max');
    const description = fields.string('description', { fallback: '' });
    if (name !== undefined) {
      const problem = nameProblem(name);
      if (problem !== undefined) issues.push({ path: `${path}.name`, message: problem });
      const first = firstIndexOf.get(name);
      if (first !== undefined) {
        issues.push({ path: `${path}.name`, message: `duplicate ${JSON.stringify(name)} (also inputs[${first}])` });
      } else {
        firstIndexOf.set(name, i);
      }
    }
    if (min !== undefined && max !== undefined && !(min < max)) {
      const label = name !== undefined ? `${path} ${JSON.stringify(name)}` : path;
      const units = unit !== undefined && unit !== '' ? ` (${unit})` : '';
      issues.push({ path: label, message: `min ${min} >= max ${max}${units}` });
    }
    if (name !== undefined && unit !== undefined && min !== undefined && max !== undefined && description !== undefined) {
      out.push({ name, unit, min, max, description });
    }
  });
  return issues.length === before ? out : undefined;
}
