import type { Evaluator, InputSpec, Proportion } from '../types.js';
import { deriveSeed } from '../check/index.js';
import { createRng, uniformInBox } from '../sampling/index.js';
import { proportionOf } from './proportion-of.js';

export interface MeasureChangeOptions {
  readonly seed: number;
  /** Fresh uniform samples over the domain. */
  readonly samples: number;
  /** Confidence of the two-sided exact interval, e.g. 0.95. */
  readonly confidence: number;
  /** Number of advisories (k). */
  readonly advisories: number;
}

/** Where the advisory changed on a fresh uniform sample of the domain. */
export interface ChangeSample {
  readonly n: number;
  readonly d: number;
  /** n × d points, float64, scenario units. */
  readonly x: Float64Array;
  /** 1 where the two models give different advisories, else 0. */
  readonly changed: Uint8Array;
  /** Share of the domain's volume where the advisory changed, with its exact interval. */
  readonly share: Proportion;
  /** confusion[a][b]: samples with advisory a before and b after. */
  readonly confusion: number[][];
}

/**
 * Estimates the share of the input domain whose advisory differs between two models: n points
 * uniform over the domain (seeded from `seed` and the label `diff:volume`), both models run on
 * the same points; the count of changed points is binomial with the changed share as its rate,
 * so its exact two-sided Clopper–Pearson interval covers the true share with the stated
 * confidence. Also counts the before × after confusion matrix.
 * @param before the old model's evaluator
 * @param after the new model's evaluator
 * @returns the points and flags (for later use by the change rules) and the figures
 */
export async function measureChange(before: Evaluator, after: Evaluator, inputs: readonly InputSpec[], options: MeasureChangeOptions): Promise<ChangeSample> {
  const n = options.samples;
  const d = inputs.length;
  const k = options.advisories;
  const x = uniformInBox(
    inputs.map((i) => [i.min, i.max] as const),
    n,
    createRng(deriveSeed(options.seed, 'diff:volume')),
  );
  const a = (await before(x, n)).advisory;
  const b = (await after(x, n)).advisory;
  const changed = new Uint8Array(n);
  const flat = new Float64Array(k * k);
  let count = 0;
  for (let i = 0; i < n; i++) {
    flat[a[i]! * k + b[i]!]!++;
    if (a[i] !== b[i]) {
      changed[i] = 1;
      count++;
    }
  }
  const confusion = Array.from({ length: k }, (_, r) => Array.from(flat.subarray(r * k, r * k + k)));
  return { n, d, x, changed, share: proportionOf(count, n, options.confidence), confusion };
}
