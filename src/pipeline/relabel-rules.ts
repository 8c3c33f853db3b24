import type { Evaluator, Rule } from '../types.js';
import { uniformInBox } from '../sampling/index.js';
import { createRng } from '../sampling/rng.js';
import { deriveSeed } from '../check/index.js';

/** Samples per rule used to find the advisory the network gives most often in its box. */
export const RELABEL_SAMPLES = 2_000;

/**
 * Gives each listed rule the advisory the network gives most often inside its box (on fresh
 * uniform samples). A pruned tree's leaf keeps the majority label of its learning samples,
 * which are concentrated near boundaries; in a few boxes that is not the majority by volume,
 * and a rule whose stated advisory the network gives on less than half of its box misleads a
 * reviewer. Rules not listed are returned unchanged.
 * @param which indices of the rules to relabel
 */
export async function relabelRules(
  rules: readonly Rule[],
  which: readonly number[],
  advisories: number,
  evaluate: Evaluator,
  seed: number,
): Promise<Rule[]> {
  const out = [...rules];
  for (const i of which) {
    const rule = rules[i]!;
    const x = uniformInBox(rule.box, RELABEL_SAMPLES, createRng(deriveSeed(seed, `relabel:${rule.id}`)));
    const ev = await evaluate(x, RELABEL_SAMPLES);
    const counts = new Int32Array(advisories);
    for (let r = 0; r < RELABEL_SAMPLES; r++) counts[ev.advisory[r]!]!++;
    let best = 0;
    for (let a = 1; a < advisories; a++) if (counts[a]! > counts[best]!) best = a;
    out[i] = { ...rule, allowed: [best] };
  }
  return out;
}
