import type { Evaluator, Fidelity, InputSpec, Proportion, Rule } from '../types.js';
import { uniformInBox } from '../sampling/index.js';
import { createRng } from '../sampling/rng.js';
import { tableLabel } from '../rules/index.js';
import { clopperPearsonInterval } from './clopper-pearson.js';
import { deriveSeed } from './derive-seed.js';

export interface FidelityOptions {
  readonly seed: number;
  readonly samples: number;
  /** Confidence of the two-sided exact intervals, e.g. 0.95. */
  readonly confidence: number;
  readonly advisories: number;
}

function proportion(k: number, n: number, confidence: number): Proportion {
  if (n === 0) return { value: NaN, lower: 0, upper: 1, n };
  const { lower, upper } = clopperPearsonInterval(k, n, confidence);
  return { value: k / n, lower, upper, n };
}

/**
 * Fidelity of a rule table to the network on a fresh uniform sample of the whole domain:
 * the share of samples where the table's label (first rule whose box contains the point)
 * equals the network's advisory, with its exact two-sided Clopper–Pearson interval; the
 * per-advisory recall (share of each advisory's region the table labels right) and the
 * balanced fidelity, the mean of those recalls over advisories present in the sample
 * (balanced accuracy: Brodersen et al., "The balanced accuracy and its posterior
 * distribution", ICPR 2010).
 */
export async function measureFidelity(
  rules: readonly Rule[],
  inputs: readonly InputSpec[],
  evaluate: Evaluator,
  options: FidelityOptions,
): Promise<Fidelity> {
  const d = inputs.length;
  const n = options.samples;
  const rng = createRng(deriveSeed(options.seed, 'fidelity'));
  const x = uniformInBox(
    inputs.map((s) => [s.min, s.max] as const),
    n,
    rng,
  );
  const ev = await evaluate(x, n);
  const table = tableLabel(rules, x, n, d);
  const k = options.advisories;
  const total = new Float64Array(k);
  const right = new Float64Array(k);
  let agree = 0;
  let uncovered = 0;
  for (let i = 0; i < n; i++) {
    const a = ev.advisory[i]!;
    total[a]!++;
    if (table[i] === a) {
      agree++;
      right[a]!++;
    }
    if (table[i] === -1) uncovered++;
  }
  const perAdvisory: Proportion[] = [];
  let sum = 0;
  let present = 0;
  for (let j = 0; j < k; j++) {
    perAdvisory.push(proportion(right[j]!, total[j]!, options.confidence));
    if (total[j]! > 0) {
      sum += right[j]! / total[j]!;
      present++;
    }
  }
  return {
    samples: n,
    confidence: options.confidence,
    overall: proportion(agree, n, options.confidence),
    balanced: present > 0 ? sum / present : NaN,
    perAdvisory,
    share: Array.from(total, (t) => t / n),
    uncovered: uncovered / n,
  };
}
