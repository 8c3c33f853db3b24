import { describe, expect, it } from 'vitest';
import { provenCoverage } from '../../src/repair/index.js';
import { createRng } from '../../src/sampling/index.js';
import type { CheckedRule, Evidence, InputSpec, Rule } from '../../src/types.js';

const inputs: InputSpec[] = [
  { name: 'a', unit: 'm', min: 0, max: 100, description: '' },
  { name: 'b', unit: 's', min: -5, max: 5, description: '' },
  { name: 'c', unit: 'deg', min: -180, max: 180, description: '' },
];
const evidence = (status: Evidence['status']): Evidence => ({ status, samples: 0, violations: 0, violationBound: 0, confidence: 0.95, volumeFraction: 0 });
const checked = (box: Rule['box'], allowed: number[], status: Evidence['status']): CheckedRule => ({
  rule: { id: 'R', box, allowed, origin: { kind: 'expected', line: 1 } },
  evidence: evidence(status),
});

describe('provenCoverage', () => {
  const rules = [
    checked([[0, 50], [-5, 5], [-180, 180]], [0], 'proven'),
    checked([[25, 75], [-5, 0], [-180, 180]], [0], 'proven'), // overlaps the first
    checked([[60, 100], [0, 5], [0, 180]], [1], 'proven'),
    checked([[90, 100], [-5, 5], [-180, 180]], [0, 1], 'proven'), // two advisories: total only
    checked([[50, 100], [-5, 5], [-180, 180]], [2], 'refuted'), // not proven: ignored
  ];

  it('measures the union of proven boxes per advisory and in total, overlaps once', () => {
    const c = provenCoverage(rules, inputs, ['x', 'y', 'z']);
    // toBeCloseTo(…, 14) allows 5e-15: a few float64 products and sums of shares err ~1e-16
    // closed form, in shares of each input's range: advisory 0 = a<0.5 (0.5) ∪ a∈[0.25,0.75]×b<0.5,
    // which adds a∈[0.5,0.75]×b<0.5 (0.125); advisory 1 = 0.4·0.5·0.5 = 0.1
    expect(c.perAdvisory[0]).toBeCloseTo(0.625, 14);
    expect(c.perAdvisory[1]).toBeCloseTo(0.1, 14);
    expect(c.perAdvisory[2]).toBe(0);
    // total = 0.625 + 0.1 + a∈[0.9,1] (0.1) − its overlap with advisory 1's box (0.1·0.5·0.5)
    expect(c.total).toBeCloseTo(0.625 + 0.1 + 0.1 - 0.025, 14);
  });

  it('agrees with a Monte Carlo estimate', () => {
    const c = provenCoverage(rules, inputs, ['x', 'y', 'z']);
    const rng = createRng(3);
    const n = 100_000;
    let hits = 0;
    for (let k = 0; k < n; k++) {
      const p = inputs.map((i) => i.min + rng() * (i.max - i.min));
      if (rules.some((r) => r.evidence.status === 'proven' && r.rule.box.every(([lo, hi], i) => lo <= p[i]! && p[i]! <= hi))) hits++;
    }
    // 4 binomial standard errors (≤ 0.0016 at n = 100,000): a false failure is rarer than 1e-4
    expect(Math.abs(hits / n - c.total)).toBeLessThan(4 * Math.sqrt((c.total * (1 - c.total)) / n));
  });

  it('is zero without proven rules', () => {
    expect(provenCoverage([rules[4]!], inputs, ['x', 'y', 'z'])).toEqual({ total: 0, perAdvisory: [0, 0, 0] });
  });
});
