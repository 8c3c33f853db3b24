import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { type CostJob, COST_MODEL, estimateSeconds } from '../../src/scale/index.js';

const BASE: CostJob = Object.freeze({
  kind: 'mine', inputs: 5, weights: 1413, layers: 3, samples: 200_000, fidelitySamples: 100_000, checkSamples: 20_000,
  rules: 60, prove: true, proveBoxes: 20_000, proveSeconds: 20, jobs: 2,
});

/** The sizes the estimate must never fall in (jobs is the one it must never rise in). */
const GROWING = ['inputs', 'weights', 'layers', 'samples', 'fidelitySamples', 'checkSamples', 'rules', 'proveBoxes', 'proveSeconds'] as const;

const jobArb = fc.record({
  kind: fc.constantFrom('mine' as const, 'check' as const, 'prove' as const),
  inputs: fc.integer({ min: 1, max: 30 }),
  weights: fc.integer({ min: 10, max: 5_000_000 }),
  layers: fc.integer({ min: 1, max: 40 }),
  samples: fc.integer({ min: 0, max: 10_000_000 }),
  fidelitySamples: fc.integer({ min: 0, max: 10_000_000 }),
  checkSamples: fc.integer({ min: 0, max: 1_000_000 }),
  rules: fc.integer({ min: 0, max: 10_000 }),
  prove: fc.boolean(),
  proveBoxes: fc.integer({ min: 1, max: 10_000_000 }),
  proveSeconds: fc.double({ min: 0.01, max: 10_000, noNaN: true }),
  jobs: fc.integer({ min: 1, max: 64 }),
});

describe('estimateSeconds', () => {
  it('never falls when one size of the job grows', () => {
    fc.assert(
      fc.property(jobArb, fc.constantFrom(...GROWING), fc.double({ min: 1, max: 100, noNaN: true }), (job, field, factor) => {
        const bigger = { ...job, [field]: job[field] * factor + 1 };
        expect(estimateSeconds(bigger).seconds).toBeGreaterThanOrEqual(estimateSeconds(job).seconds);
        expect(estimateSeconds(bigger).worstSeconds).toBeGreaterThanOrEqual(estimateSeconds(job).worstSeconds);
      }),
    );
  });

  it('never rises when more worker threads prove', () => {
    fc.assert(
      fc.property(jobArb, fc.integer({ min: 1, max: 64 }), (job, more) => {
        expect(estimateSeconds({ ...job, jobs: job.jobs + more }).seconds).toBeLessThanOrEqual(estimateSeconds(job).seconds);
      }),
    );
  });

  it('adds the proving part only when proofs follow, and it halves with twice the workers', () => {
    const without = estimateSeconds({ ...BASE, prove: false });
    const one = estimateSeconds({ ...BASE, jobs: 1 });
    const two = estimateSeconds({ ...BASE, jobs: 2 });
    expect(without.provingSeconds).toBe(0);
    expect(one.provingSeconds).toBeGreaterThan(0);
    // proving is modelled as rules / jobs × per-rule seconds: exact halving up to rounding;
    // 1e-12 relative is a few float64 ulps of headroom
    expect(Math.abs(two.provingSeconds * 2 - one.provingSeconds)).toBeLessThanOrEqual(1e-12 * one.provingSeconds);
    expect(one.samplingSeconds).toBe(without.samplingSeconds);
  });

  it('puts each rule\'s proof under its seconds budget plus one piece, however many pieces it may bound', () => {
    const job: CostJob = { ...BASE, kind: 'prove', samples: 0, fidelitySamples: 0, checkSamples: 0, inputs: 30, proveBoxes: 1e9, jobs: 1 };
    const e = estimateSeconds(job);
    const piece = COST_MODEL.perPiece + COST_MODEL.perPieceWeightLayer * job.weights * job.layers;
    const setup = COST_MODEL.perRule + COST_MODEL.perRuleWeight * job.weights;
    // closed form of the cap: rules × (set-up + budget + one piece); 1e-9 relative is rounding headroom
    const cap = job.rules * (setup + job.proveSeconds + piece);
    expect(e.provingSeconds).toBeLessThanOrEqual(cap * (1 + 1e-9));
    expect(e.worstSeconds).toBeCloseTo(e.startSeconds + cap, 6);
  });

  it('does not change the job it is given', () => {
    const before = JSON.stringify(BASE);
    estimateSeconds(BASE);
    expect(JSON.stringify(BASE)).toBe(before);
  });

  it('rejects a negative size and fewer than one worker', () => {
    expect(() => estimateSeconds({ ...BASE, rules: -1 })).toThrowErrorMatchingInlineSnapshot(`[ToolError: estimateSeconds: rules -1, expected a number >= 0]`);
    expect(() => estimateSeconds({ ...BASE, jobs: 0 })).toThrowErrorMatchingInlineSnapshot(`[ToolError: estimateSeconds: jobs 0, expected a number >= 1]`);
  });
});
