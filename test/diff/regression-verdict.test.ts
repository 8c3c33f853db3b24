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
});
