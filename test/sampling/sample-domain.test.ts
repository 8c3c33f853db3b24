import { describe, expect, it } from 'vitest';
import { evaluatorLabeller, sampleDomain, type RowLabeller } from '../../src/sampling/index.js';
import type { InputSpec } from '../../src/types.js';
import { boundaryDistance, circleEvaluator } from './circle-evaluator.js';

const inputs: readonly InputSpec[] = Object.freeze([
  Object.freeze({ name: 'a', unit: 'm', min: 0, max: 1, description: '' }),
  Object.freeze({ name: 'b', unit: 's', min: -2, max: 2, description: '' }),
]);

describe('sampleDomain', () => {
  it('returns exactly the budget, in batches no larger than batchSize, with matching labels', async () => {
    const calls: number[] = [];
    const progress: number[] = [];
    const set = await sampleDomain(inputs, circleEvaluator(calls), {
      seed: 1,
      budget: 5003,
      batchSize: 700,
      onProgress: (done, total) => {
        expect(total).toBe(5003);
        progress.push(done);
      },
    });
    expect(set.n).toBe(5003);
    expect(set.d).toBe(2);
    expect(set.seed).toBe(1);
    expect(set.x.length).toBe(2 * 5003);
    expect(calls.every((n) => n >= 1 && n <= 700)).toBe(true);
    expect(calls.reduce((a, b) => a + b, 0)).toBe(5003);
    expect(progress.at(-1)).toBe(5003);
    expect(progress.every((v, i) => i === 0 || v > progress[i - 1]!)).toBe(true);
    // the stored labels belong to the stored rows: evaluate them again
    const again = await circleEvaluator()(set.x, set.n);
    expect(Array.from(set.advisory)).toEqual(Array.from(again.advisory));
    expect(Array.from(set.margin)).toEqual(Array.from(again.margin));
  });

  it('gives the identical sample set for the same seed and a different one for another seed', async () => {
    const a = await sampleDomain(inputs, circleEvaluator(), { seed: 7, budget: 3000 });
    const b = await sampleDomain(inputs, circleEvaluator(), { seed: 7, budget: 3000 });
    const c = await sampleDomain(inputs, circleEvaluator(), { seed: 8, budget: 3000 });
    expect(Array.from(a.x)).toEqual(Array.from(b.x));
    expect(Array.from(a.advisory)).toEqual(Array.from(b.advisory));
    expect(Array.from(a.x)).not.toEqual(Array.from(c.x));
  });

  it('spends the boundary share near the boundary and covers the whole box with the rest', async () => {
    const budget = 20_000;
    const set = await sampleDomain(inputs, circleEvaluator(), { seed: 3, budget, boundaryShare: 0.6 });
    let near = 0;
    let outside = 0;
    const coarse = new Int32Array(100); // 10 × 10 cells of the box
    for (let i = 0; i < budget; i++) {
      const a = set.x[2 * i]!;
      const b = set.x[2 * i + 1]!;
      if (a < 0 || a > 1 || b < -2 || b > 2) outside++;
      if (boundaryDistance(a, b) < 0.01) near++;
      coarse[Math.min(9, Math.floor(a * 10)) * 10 + Math.min(9, Math.floor(((b + 2) / 4) * 10))]!++;
    }
    expect(outside).toBe(0);
    // a band of half-width 0.01 covers 2·0.01·2π·0.3 ≈ 3.8 % of the box: uniform sampling puts
    // ~760 of 20,000 there. Measured with this seed: 55 %. More than 25 % (6.5× uniform) cannot
    // happen without refinement, and leaves room for changes to its constants.
    const NEAR_SHARE_MIN = 0.25;
    expect(near / budget).toBeGreaterThan(NEAR_SHARE_MIN);
    // the 8,000 space-filling points put about 80 in each of the 100 cells: the 63 × 63 grid
    // gives every cell at least 36 (the 6 × 6 grid cells wholly inside it) and the Sobol points
    // about 40 more, so 60 holds whatever the refinement does
    const CELL_COUNT_MIN = 60;
    expect(Math.min(...coarse)).toBeGreaterThanOrEqual(CELL_COUNT_MIN);
  });

  it('refuses bad options with messages naming the option', async () => {
    const ev = circleEvaluator();
    await expect(sampleDomain(inputs, ev, { seed: 1, budget: 0 })).rejects.toThrowErrorMatchingInlineSnapshot(
      `[ToolError: sampleDomain: budget: expected a whole number >= 1, found 0]`,
    );
    await expect(sampleDomain(inputs, ev, { seed: 1, budget: 10, boundaryShare: 1 })).rejects.toThrow(
      'boundaryShare: expected a number in [0, 1), found 1',
    );
    await expect(sampleDomain(inputs, ev, { seed: 1, budget: 10, batchSize: 0 })).rejects.toThrow('batchSize');
    await expect(sampleDomain(inputs, ev, { seed: 0.5, budget: 10 })).rejects.toThrow('seed');
    const many = Array.from({ length: 22 }, (_, j) => ({ name: `x${j}`, unit: '', min: 0, max: 1, description: '' }));
    await expect(sampleDomain(many, ev, { seed: 1, budget: 10 })).rejects.toThrowErrorMatchingInlineSnapshot(
      `[ToolError: sampleDomain: expected 1 to 21 inputs, found 22]`,
    );
  });

  it('refuses an evaluator that returns fewer rows than asked', async () => {
    const short = async (_x: Float64Array, n: number) => ({
      scores: new Float32Array(2 * n),
      advisory: new Int32Array(n - 1),
      margin: new Float32Array(n),
    });
    await expect(sampleDomain(inputs, short, { seed: 1, budget: 10 })).rejects.toThrow('evaluator returned');
  });

  it('gives the same sample set through a labeller with batches in flight at once, finishing out of order', async () => {
    const plain = await sampleDomain(inputs, circleEvaluator(), { seed: 11, budget: 9_000, batchSize: 400 });
    const inner = evaluatorLabeller(circleEvaluator(), 2);
    const inFlight: number[] = [];
    let running = 0;
    let call = 0;
    const labeller: RowLabeller = {
      concurrency: 3,
      allocate: (n, d) => inner.allocate(n, d),
      async labelInPlace(arrays, from, rows) {
        inFlight.push(++running);
        // later calls finish first: 3, 2, 1 event-loop turns of delay in turn
        for (let t = 3 - (call++ % 3); t > 0; t--) await new Promise((r) => setImmediate(r));
        await inner.labelInPlace(arrays, from, rows);
        running--;
      },
    };
    const progress: number[] = [];
    const set = await sampleDomain(inputs, labeller, { seed: 11, budget: 9_000, batchSize: 400, onProgress: (done) => progress.push(done) });
    expect(Math.max(...inFlight)).toBe(3);
    expect(Array.from(set.x)).toEqual(Array.from(plain.x));
    expect(Array.from(set.advisory)).toEqual(Array.from(plain.advisory));
    expect(Array.from(set.margin)).toEqual(Array.from(plain.margin));
    expect(progress.every((v, i) => i === 0 || v > progress[i - 1]!)).toBe(true);
    expect(progress.at(-1)).toBe(9_000);
  });

  it("passes on a labeller's failure once the batches still running have settled", async () => {
    let settled = 0;
    let calls = 0;
    const labeller: RowLabeller = {
      concurrency: 4,
      allocate: (n, d) => evaluatorLabeller(circleEvaluator(), d).allocate(n, d),
      async labelInPlace() {
        const mine = calls++;
        await new Promise((r) => setImmediate(r));
        settled++;
        if (mine === 1) throw new Error('batch 1 failed');
      },
    };
    await expect(sampleDomain(inputs, labeller, { seed: 1, budget: 2_000, batchSize: 100 })).rejects.toThrow('batch 1 failed');
    expect(settled).toBe(calls);
  });
});
