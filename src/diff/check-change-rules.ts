import type { Evaluator, InputSpec, Rule } from '../types.js';
import { boxVolumeFraction, deriveSeed } from '../check/index.js';
import { createRng, uniformInBox } from '../sampling/index.js';
import type { ChangeRule, Transition } from './diff-result.js';
import { proportionOf } from './proportion-of.js';

export interface CheckChangeOptions {
  readonly seed: number;
  /** Dense samples per rule. */
  readonly samplesPerRule: number;
  /** Confidence of the two-sided exact intervals. */
  readonly confidence: number;
  readonly advisories: number;
}

/**
 * Checks each change rule on fresh uniform samples inside its box (seeded from the seed and the
 * rule id): the share of points where the two models give different advisories, with its exact
 * two-sided Clopper–Pearson interval, and the before → after pairs seen there, most frequent
 * first. A change rule is a description, not a guarantee: its share says how much of its box
 * really changed.
 */
export async function checkChangeRules(
  rules: readonly Rule[],
  inputs: readonly InputSpec[],
  before: Evaluator,
  after: Evaluator,
  options: CheckChangeOptions,
): Promise<ChangeRule[]> {
  const k = options.advisories;
  const m = options.samplesPerRule;
  const out: ChangeRule[] = [];
  for (const rule of rules) {
    const x = uniformInBox(rule.box, m, createRng(deriveSeed(options.seed, `diff:change:${rule.id}`)));
    const a = (await before(x, m)).advisory;
    const b = (await after(x, m)).advisory;
    const pairs = new Float64Array(k * k);
    let changed = 0;
    for (let i = 0; i < m; i++) {
      if (a[i] === b[i]) continue;
      changed++;
      pairs[a[i]! * k + b[i]!]!++;
    }
    const transitions: Transition[] = [];
    for (let p = 0; p < k * k; p++) if (pairs[p]! > 0) transitions.push({ before: Math.floor(p / k), after: p % k, count: pairs[p]! });
    transitions.sort((s, t) => t.count - s.count || s.before - t.before || s.after - t.after);
    out.push({ rule, volumeFraction: boxVolumeFraction(rule.box, inputs), changed: proportionOf(changed, m, options.confidence), transitions });
  }
  return out;
}
