import { describe, expect, it } from 'vitest';
import { regressionVerdict } from '../../src/diff/index.js';
import type { Evidence, RuleStatus } from '../../src/types.js';

const evidence = (status: RuleStatus): Evidence =>
  Object.freeze({ status, samples: 100, violations: status === 'refuted' ? 1 : 0, violationBound: 0.03, confidence: 0.95, volumeFraction: 0.1 });

describe('regressionVerdict', () => {
  // The definitions of docs/checking.md: a rule holds when it is not refuted; proven is stronger
  // evidence than sampled or unknown. Every pair of statuses is listed.
  const cases: Array<[RuleStatus, RuleStatus, string]> = [
    ['proven', 'proven', 'kept'],
    ['proven', 'sampled', 'no-longer-proven'],
    ['proven', 'unknown', 'no-longer-proven'],
    ['proven', 'refuted', 'broken'],
    ['sampled', 'proven', 'kept'],
    ['sampled', 'sampled', 'kept'],
    ['sampled', 'unknown', 'kept'],
    ['sampled', 'refuted', 'broken'],
    ['unknown', 'proven', 'kept'],
    ['unknown', 'sampled', 'kept'],
    ['unknown', 'unknown', 'kept'],
    ['unknown', 'refuted', 'broken'],
    ['refuted', 'proven', 'fixed'],
    ['refuted', 'sampled', 'fixed'],
    ['refuted', 'unknown', 'fixed'],
    ['refuted', 'refuted', 'still-refuted'],
  ];
  it.each(cases)('%s before and %s after is %s', (before, after, verdict) => {
    expect(regressionVerdict(evidence(before), evidence(after))).toBe(verdict);
  });

  const refuted = (violations: number, samples: number): Evidence =>
    Object.freeze({ ...evidence('refuted'), violations, samples, violationBound: 0 });

  it('calls a rule refuted on both degraded when its violation rate clearly at least doubled', () => {
    // 10 / 10,000 has the exact 95 % interval [0.048 %, 0.184 %]; 200 / 10,000 has [1.73 %, 2.29 %]
    // (Clopper-Pearson; values from the project's implementation, itself checked against
    // published values in test/check/clopper-pearson.test.ts): 1.73 % > 2 × 0.184 %.
    expect(regressionVerdict(refuted(10, 10_000), refuted(200, 10_000))).toBe('degraded');
  });

  it('keeps still-refuted when the rate rose but not clearly twofold', () => {
    // 100 / 10,000: [0.81 %, 1.21 %]; 180 / 10,000: [1.55 %, 2.08 %]; 1.55 % < 2 × 1.21 %
    expect(regressionVerdict(refuted(100, 10_000), refuted(180, 10_000))).toBe('still-refuted');
    expect(regressionVerdict(refuted(200, 10_000), refuted(10, 10_000))).toBe('still-refuted');
  });
});
