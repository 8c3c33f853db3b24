import { describe, expect, it } from 'vitest';
import { type CostJob, DEFAULT_WARN_SECONDS, costWarning, estimateSeconds, formatDuration } from '../../src/scale/index.js';

const JOB: CostJob = Object.freeze({
  kind: 'mine', inputs: 5, weights: 1413, layers: 3, samples: 200_000, fidelitySamples: 100_000, checkSamples: 20_000,
  rules: 60, prove: true, proveBoxes: 20_000, proveSeconds: 20, jobs: 2,
});
/** 1 % either side of the estimate: far above float rounding, close enough to show the threshold is the estimate itself. */
const SIDE = 0.01;

describe('costWarning', () => {
  it('warns when the budget is just below the estimate and not when it is just above', () => {
    const e = estimateSeconds(JOB).seconds;
    expect(costWarning(JOB, e * (1 + SIDE))).toBeUndefined();
    const text = costWarning(JOB, e * (1 - SIDE));
    expect(text).toMatch(/^warning: this mine job is estimated to take about /);
    expect(text).toContain(`over the time budget of ${formatDuration(e * (1 - SIDE))}`);
    expect(text).toContain('it runs anyway');
  });

  it('warns past the default of one hour when no budget is given', () => {
    // a job sized so that its estimate passes the default: samples grown until it does
    let samples = 200_000;
    while (estimateSeconds({ ...JOB, samples }).seconds <= DEFAULT_WARN_SECONDS) samples *= 2;
    const big = { ...JOB, samples };
    expect(costWarning(big)).toContain('longer than 60 min');
    let small = samples;
    while (estimateSeconds({ ...JOB, samples: small }).seconds > DEFAULT_WARN_SECONDS) small = Math.floor(small / 2);
    expect(costWarning({ ...JOB, samples: small })).toBeUndefined();
  });

  it('names the proving part and the options that shorten each kind of job', () => {
    const prove: CostJob = { ...JOB, kind: 'prove', samples: 0, fidelitySamples: 0, checkSamples: 0, jobs: 1 };
    const text = costWarning(prove, 0.001)!;
    expect(text).toContain('proving');
    expect(text).toContain('on 1 worker thread)');
    expect(text).toContain('--prove-boxes or --prove-seconds');
    expect(costWarning({ ...JOB, kind: 'check' }, 0.001)).toContain('--check-samples');
  });
});

describe('formatDuration', () => {
  it('rounds to one unit for reading', () => {
    expect([formatDuration(40.4), formatDuration(840), formatDuration(8280)]).toEqual(['40 s', '14 min', '2.3 h']);
  });
});
