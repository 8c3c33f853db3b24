import type { Evaluator, Fidelity, InputSpec, Proportion, Rule } from '../types.js';
import { clopperPearsonInterval } from './clopper-pearson.js';
import { fidelityChunk, fidelityChunkSizes, type FidelityCounts } from './fidelity-chunk.js';

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
 * distribution", ICPR 2010). The sample is drawn in chunks of FIDELITY_CHUNK points, each from
 * its own derived seed (fidelity-chunk.ts), so worker threads can share the chunks out and
 * give the same figures.
 */
export async function measureFidelity(
  rules: readonly Rule[],
  inputs: readonly InputSpec[],
  evaluate: Evaluator,
  options: FidelityOptions,
): Promise<Fidelity> {
  const counts: FidelityCounts[] = [];
  const sizes = fidelityChunkSizes(options.samples);
  for (let c = 0; c < sizes.length; c++) counts.push(await fidelityChunk(rules, inputs, evaluate, options.seed, c, sizes[c]!, options.advisories));
  return fidelityFromCounts(counts, options);
}

/**
 * The fidelity figures from the counts of every chunk (sums of whole numbers: exact in any order).
 * @param counts one entry per chunk of fidelityChunkSizes(options.samples)
 */
export function fidelityFromCounts(counts: readonly FidelityCounts[], options: FidelityOptions): Fidelity {
  const k = options.advisories;
  const total = new Float64Array(k);
  const right = new Float64Array(k);
  let agree = 0;
  let uncovered = 0;
  let n = 0;
  for (const c of counts) {
    n += c.samples;
    agree += c.agree;
    uncovered += c.uncovered;
    for (let j = 0; j < k; j++) {
      total[j]! += c.total[j]!;
      right[j]! += c.right[j]!;
    }
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
