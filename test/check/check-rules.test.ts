/**
 * checkRules makes and evaluates a rule's dense samples a chunk at a time; the evidence must be
 * the one of the whole set made at once (same points in the same order, same counterexample),
 * whatever the chunk size. The evaluator here is a closed-form function, so any difference is
 * the checker's own.
 */
import { describe, expect, it } from 'vitest';
import { checkRules } from '../../src/check/index.js';
import { boxSurfacePoints, createRng, uniformInBox } from '../../src/sampling/index.js';
import { deriveSeed } from '../../src/check/index.js';
import type { Evaluator, InputSpec, Rule } from '../../src/types.js';

const INPUTS: InputSpec[] = [
  { name: 'a', unit: '', min: 0, max: 1, description: '' },
  { name: 'b', unit: '', min: 0, max: 1, description: '' },
];

/** Two advisories: 1 wins by a + b − 1.2 when a + b > 1.2 (an oblique boundary), else 0. */
const evaluate: Evaluator = async (x, n) => {
  const scores = new Float32Array(2 * n);
  const advisory = new Int32Array(n);
  const margin = new Float32Array(n);
  for (let i = 0; i < n; i++) {
    const s = x[2 * i]! + x[2 * i + 1]! - 1.2;
    scores[2 * i] = 0;
    scores[2 * i + 1] = s;
    advisory[i] = s > 0 ? 1 : 0;
    margin[i] = Math.abs(s);
  }
  return { scores, advisory, margin };
};

const RULE: Rule = { id: 'R1', box: [[0.2, 0.9], [0.1, 0.8]], allowed: [0], origin: { kind: 'mined' } };

describe('checkRules in chunks', () => {
  const options = { seed: 7, samplesPerRule: 1_000, confidence: 0.95, decision: 'argmax' as const };

  it('gives the same evidence for any chunk size', async () => {
    const whole = await checkRules([RULE], INPUTS, evaluate, { ...options, chunkRows: 1_000_000 });
    for (const chunkRows of [1, 7, 100, 899, 900, 901]) {
      expect(await checkRules([RULE], INPUTS, evaluate, { ...options, chunkRows })).toEqual(whole);
    }
    expect(whole[0]!.evidence.status).toBe('refuted');
  });

  it('counts the violations of the points drawn as uniformInBox then boxSurfacePoints draw them', async () => {
    // the documented order of draws: 900 uniform points, then 100 on the faces and corners
    const rng = createRng(deriveSeed(options.seed, 'check:R1'));
    const inside = uniformInBox(RULE.box, 900, rng);
    const surface = boxSurfacePoints(RULE.box, 100, rng);
    let expected = 0;
    let worst = -Infinity;
    for (const [pts, m] of [[inside, 900], [surface, 100]] as const) {
      for (let i = 0; i < m; i++) {
        const s = pts[2 * i]! + pts[2 * i + 1]! - 1.2;
        if (Math.fround(s) > 0) {
          expected++;
          worst = Math.max(worst, Math.fround(s));
        }
      }
    }
    const [checked] = await checkRules([RULE], INPUTS, evaluate, { ...options, chunkRows: 64 });
    expect(checked!.evidence.samples).toBe(1_000);
    expect(checked!.evidence.violations).toBe(expected);
    expect(checked!.evidence.counterexample!.margin).toBe(worst);
  });
});
