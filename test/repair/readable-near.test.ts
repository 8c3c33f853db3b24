import { describe, expect, it } from 'vitest';
import { readableSteps } from '../../src/rules/index.js';
import { readableAbove, readableBelow, type ReadableCutLimits } from '../../src/repair/index.js';

/**
 * Values worked out by hand on the 1-2-5 series (Heckbert, "Nice numbers for graph labels",
 * Graphics Gems, 1990): the coarsest step with a multiple in the window, the multiple nearest t.
 */
const limits = (clearance: number, range = 10): ReadableCutLimits => ({
  clearance,
  allowance: 0.3,
  finest: range * 1e-6,
  steps: readableSteps(range, range * 1e-6),
});

describe('readableBelow / readableAbove', () => {
  it('stops a growing upper face short of t at the coarsest step with a multiple in the window', () => {
    // window [3.99 − 0.3, 3.99] past 3.5: 1 and 0.5 have none above 3.5 (4 > 3.99); 0.2 has 3.8
    expect(readableBelow(3.99, 3.5, 0.3, limits(0.01))).toBe(3.8);
    // a whole number inside the window wins
    expect(readableBelow(4.2, 3.5, 0.3, limits(0.01))).toBe(4);
  });

  it('must pass the current face, and uses no step finer than the clearance', () => {
    // (3.9, 3.99]: 0.05 has 3.95; with a clearance of 0.06 only steps of 0.1 and up are allowed
    expect(readableBelow(3.99, 3.9, 0.3, limits(0.01))).toBe(3.95);
    expect(readableBelow(3.99, 3.9, 0.3, limits(0.06))).toBeUndefined();
  });

  it('mirrors for a lower face moving down', () => {
    // window [−3.99, −3.99 + 0.3] below −3.5: 0.2 has −3.8
    expect(readableAbove(-3.99, -3.5, 0.3, limits(0.01))).toBe(-3.8);
    expect(readableAbove(1.99, 2.5, 0.3, limits(0.01))).toBe(2);
    // zero is written +0, not −0
    expect(Object.is(readableAbove(-0.01, 0.5, 0.3, limits(0.01)), 0)).toBe(true);
  });
});
