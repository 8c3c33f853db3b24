import { describe, expect, it } from 'vitest';
import { FIDELITY_CHUNK, fidelityChunk, fidelityChunkSizes, fidelityFromCounts, measureFidelity } from '../../src/check/index.js';
import type { Evaluation, InputSpec, Rule } from '../../src/types.js';

const inputs: readonly InputSpec[] = Object.freeze([
  Object.freeze({ name: 'u', unit: '', min: 0, max: 1, description: '' }),
  Object.freeze({ name: 'v', unit: '', min: 0, max: 1, description: '' }),
]);

/** A two-advisory network in plain TypeScript: advisory 0 where u < 0.3, else 1. */
async function step(x: Float64Array, n: number): Promise<Evaluation> {
  const scores = new Float32Array(2 * n);
  const advisory = new Int32Array(n);
  const margin = new Float32Array(n);
  for (let i = 0; i < n; i++) {
    const s = x[2 * i]! - 0.3;
    scores[2 * i] = -s;
    scores[2 * i + 1] = s;
    advisory[i] = s < 0 ? 0 : 1;
    margin[i] = 2 * Math.abs(s);
  }
  return { scores, advisory, margin };
}

/** A table that puts the boundary at u = 0.5 instead of 0.3. */
const rules: readonly Rule[] = [
  { id: 'R1', box: [[0, 0.5], [0, 1]], allowed: [0], origin: { kind: 'mined' } },
  { id: 'R2', box: [[0.5, 1], [0, 1]], allowed: [1], origin: { kind: 'mined' } },
];

describe('measureFidelity', () => {
  it('brackets the closed-form fidelity of a table with a misplaced boundary', async () => {
    const f = await measureFidelity(rules, inputs, step, { seed: 2, samples: 60_000, confidence: 0.999, advisories: 2 });
    // closed form: the table agrees with the network for u in [0, 0.3) and [0.5, 1], 80 % of the
    // box; recall of advisory 0 is 1, of advisory 1 (u ≥ 0.3) 0.5 / 0.7; balanced their mean
    expect(f.samples).toBe(60_000);
    expect(f.overall.lower).toBeLessThan(0.8);
    expect(f.overall.upper).toBeGreaterThan(0.8);
    expect(f.perAdvisory[0]!.value).toBe(1);
    expect(f.perAdvisory[1]!.lower).toBeLessThan(0.5 / 0.7);
    expect(f.perAdvisory[1]!.upper).toBeGreaterThan(0.5 / 0.7);
    // balanced: a mean of two sample proportions; 0.01 is > 10 standard errors at this n
    // (common practice, no source)
    expect(Math.abs(f.balanced - (1 + 0.5 / 0.7) / 2)).toBeLessThan(0.01);
    expect(f.uncovered).toBe(0);
  });

  it('is the sum of its fixed chunks, in any order, each from its own seed', async () => {
    const sizes = fidelityChunkSizes(40_000);
    expect(sizes).toEqual([FIDELITY_CHUNK, FIDELITY_CHUNK, 40_000 - 2 * FIDELITY_CHUNK]);
    const options = { seed: 9, samples: 40_000, confidence: 0.95, advisories: 2 };
    const whole = await measureFidelity(rules, inputs, step, options);
    const chunks = await Promise.all(sizes.map((rows, c) => fidelityChunk(rules, inputs, step, 9, c, rows, 2)));
    expect(fidelityFromCounts([...chunks].reverse(), options)).toEqual(whole);
    // chunks differ from each other (own seeds), and a chunk is the same when made again
    expect(chunks[0]!.agree).not.toBe(chunks[1]!.agree);
    expect(await fidelityChunk(rules, inputs, step, 9, 1, sizes[1]!, 2)).toEqual(chunks[1]);
  });
});
