import { describe, expect, it } from 'vitest';
import { evaluateGates, parseFailOn, type DiffResult, type RuleRegression } from '../../src/diff/index.js';
import { UsageError } from '../../src/errors.js';
import type { Evidence, RuleStatus } from '../../src/types.js';

function message(values: string[]): string {
  try {
    parseFailOn(values);
  } catch (e) {
    if (e instanceof UsageError) return e.message;
    throw e;
  }
  return 'no error';
}

const evidence = (status: RuleStatus): Evidence => ({ status, samples: 10, violations: status === 'refuted' ? 1 : 0, violationBound: 0.3, confidence: 0.95, volumeFraction: 0.5 });
const regression = (id: string, before: RuleStatus, after: RuleStatus, verdict: RuleRegression['verdict']): RuleRegression => ({
  rule: { id, box: [[0, 1]], allowed: [0], origin: { kind: 'mined' } },
  before: evidence(before),
  after: evidence(after),
  verdict,
});

/** A diff with only the fields the gates read. */
function diff(changed: number, rules: RuleRegression[]): DiffResult {
  return { changed: { value: changed, lower: changed / 2, upper: changed * 2, n: 1000 }, rules } as unknown as DiffResult;
}

describe('parseFailOn', () => {
  it('reads verdict gates, changed-share gates in percent or as a fraction, commas and repeats', () => {
    expect(parseFailOn(['broken', 'changed>0.5%', 'no-longer-proven,refuted', 'changed>0.02', 'degraded'])).toEqual([
      { kind: 'verdict', spec: 'broken', verdict: 'broken' },
      { kind: 'changed', spec: 'changed>0.5%', threshold: 0.005 },
      { kind: 'verdict', spec: 'no-longer-proven', verdict: 'no-longer-proven' },
      { kind: 'refuted', spec: 'refuted' },
      { kind: 'changed', spec: 'changed>0.02', threshold: 0.02 },
      { kind: 'verdict', spec: 'degraded', verdict: 'degraded' },
    ]);
  });

  it('turns every gate off with none', () => {
    expect(parseFailOn(['none'])).toEqual([]);
  });

  it('refuses unknown gates, thresholds past 100 % and none mixed with gates, naming the value', () => {
    expect(message(['borken'])).toMatchInlineSnapshot(`"--fail-on: expected one of: broken, degraded, no-longer-proven, refuted, changed>P% (P a percentage) or changed>F (F a fraction in [0, 1]), none; found 'borken'"`);
    expect(message(['changed>150%'])).toContain("found 'changed>150%'");
    expect(message(['changed<1%'])).toContain("found 'changed<1%'");
    expect(message(['none,broken'])).toMatchInlineSnapshot(`"--fail-on: 'none' cannot be combined with other gates, found 'none,broken'"`);
  });
});

describe('evaluateGates', () => {
  const rules = [regression('R1', 'proven', 'proven', 'kept'), regression('R2', 'sampled', 'refuted', 'broken'), regression('R3', 'refuted', 'refuted', 'still-refuted')];

  it('trips broken for a rule that held before and is refuted after, naming it', () => {
    expect(evaluateGates(diff(0, rules), parseFailOn(['broken']))).toEqual([{ gate: 'broken', tripped: true, reason: '1 rule broken: R2' }]);
  });

  it('trips refuted for every rule refuted on the new model, also those refuted before', () => {
    expect(evaluateGates(diff(0, rules), parseFailOn(['refuted']))[0]).toEqual({ gate: 'refuted', tripped: true, reason: '2 rules refuted on the new model: R2, R3' });
  });

  it('passes no-longer-proven when no proven rule lost its proof', () => {
    expect(evaluateGates(diff(0, rules), parseFailOn(['no-longer-proven']))[0]!.tripped).toBe(false);
  });

  it('compares the estimated changed share with the threshold: strictly above trips', () => {
    expect(evaluateGates(diff(0.006, []), parseFailOn(['changed>0.5%']))[0]!.tripped).toBe(true);
    expect(evaluateGates(diff(0.005, []), parseFailOn(['changed>0.5%']))[0]!.tripped).toBe(false);
  });
});
