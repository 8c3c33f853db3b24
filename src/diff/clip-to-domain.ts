import type { InputSpec } from '../types.js';

/** A box clipped to the domain, the warnings for each clipped bound, or why it cannot be. */
export interface ClippedBox {
  readonly box: Array<[number, number]>;
  readonly warnings: string[];
  /** Set when the box misses the domain on some input: no input could test the rule. */
  readonly error?: string;
}

/**
 * Clips a rule's box to the scenario's domain, the policy of the rule-file parser (docs/formats.md,
 * "Rule files"): a bound past the domain means "as far as the domain goes" and is clipped with a
 * warning; a box that misses the domain on any input is an error.
 * @param box one [min, max] per input, min <= max (not changed)
 * @param where prefix of the messages, e.g. `rules.json: rules[3] ("R4") box`
 */
export function clipToDomain(box: ReadonlyArray<readonly [number, number]>, inputs: readonly InputSpec[], where: string): ClippedBox {
  const warnings: string[] = [];
  let error: string | undefined;
  const out = inputs.map(({ name, min, max }, f): [number, number] => {
    const [lo, hi] = box[f]!;
    if (lo > max || hi < min) {
      error ??= `${where}: ${name} [${lo}, ${hi}] lies outside its domain [${min}, ${max}]`;
      return [min, max];
    }
    if (lo < min) warnings.push(`${where}: ${name} lower bound ${lo} is below the domain minimum ${min}, clipped to ${min}`);
    if (hi > max) warnings.push(`${where}: ${name} upper bound ${hi} is above the domain maximum ${max}, clipped to ${max}`);
    return [Math.max(lo, min), Math.min(hi, max)];
  });
  return { box: out, warnings, ...(error !== undefined ? { error } : {}) };
}
