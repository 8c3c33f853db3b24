import { describe, expect, it } from 'vitest';
import { readableSteps } from '../../src/rules/index.js';
import { readableCut, readableMiddle, type ReadableCutLimits } from '../../src/repair/index.js';

const limits = (clearance: number, allowance: number, range = 10): ReadableCutLimits => ({
  clearance,
  allowance,
  finest: range * 1e-6,
  steps: readableSteps(range, range * 1e-6),
});

describe('readableCut', () => {
  it('moves a lower face just past the point, to a multiple of the coarsest 1-2-5 step that fits', () => {
    // window [4.03 + 0.05, 4.03 + 0.3] = [4.08, 4.33]: 0.5 and 0.2 have no multiple in it... 0.2 has 4.2
    expect(readableCut(4.03, 'lo', 0, 10, limits(0.05, 0.3))).toBe(4.2);
    // window [4.08, 4.13]: only steps of 0.05 and finer fit; 4.1 is a multiple of 0.1 (coarser)
    expect(readableCut(4.03, 'lo', 0, 10, limits(0.05, 0.1))).toBe(4.1);
  });

  it('moves an upper face down past the point, mirror-wise', () => {
    // window [3.97 − 0.3, 3.97 − 0.05] = [3.67, 3.92]: 0.5 has 3.5 (outside); 0.2 has 3.8
    expect(readableCut(3.97, 'hi', 0, 10, limits(0.05, 0.3))).toBe(3.8);
  });

  it('prefers a whole number when one lies in the window', () => {
    expect(readableCut(0.97, 'lo', 0, 10, limits(0.01, 0.1))).toBe(1);
    expect(readableCut(-0.97, 'hi', -10, 10, limits(0.01, 0.1))).toBe(-1);
  });

  it('never returns the point itself, nor a face that leaves no width', () => {
    expect(readableCut(9.95, 'lo', 0, 10, limits(0.1, 0.3))).toBeUndefined();
    expect(readableCut(0.05, 'hi', 0, 10, limits(0.1, 0.3))).toBeUndefined();
    const v = readableCut(2, 'lo', 0, 10, limits(1e-3, 2e-3))!;
    expect(v).toBeGreaterThan(2);
  });
});

describe('readableMiddle', () => {
  it('splits near the middle at the coarsest step with a multiple in the middle half', () => {
    expect(readableMiddle(0, 10, 0.01)).toBe(5);
    expect(readableMiddle(0.53, 1, 0.001)).toBe(0.8); // middle half [0.6475, 0.8825]: 0.5 no, 0.2 → 0.8
    expect(readableMiddle(-180, -30, 0.1)).toBe(-100);
  });

  it('refuses a split that would need a step finer than the minimum', () => {
    expect(readableMiddle(3.9, 3.95, 0.05)).toBeUndefined();
  });
});
