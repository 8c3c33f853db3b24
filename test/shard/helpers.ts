import type { CheckedRule, Evidence, Rule, RuleTable } from '../../src/types.js';
import { itemsSha256, type PartialRun } from '../../src/shard/index.js';

/** One input x in [0, 10], two advisories: boxes on a line, volumes are lengths / 10. */
export function table(rules: CheckedRule[], command = 'check'): RuleTable {
  return {
    manifest: {
      tool: 'specula',
      toolVersion: '0.0.0',
      command,
      date: '2026-01-01T00:00:00.000Z',
      scenario: { path: '/s.json', sha256: 'a'.repeat(64), name: 'line' },
      model: { path: '/m.onnx', sha256: 'b'.repeat(64) },
      seed: 1,
      settings: { checkSamples: 100 },
      counts: { rules: rules.filter((r) => r.rule.origin.kind !== 'repaired').length },
    },
    inputs: [{ name: 'x', unit: 'm', min: 0, max: 10, description: '' }],
    advisories: ['A', 'B'],
    decision: 'argmax',
    rules,
  };
}

export function checked(id: string, lo: number, hi: number, status: Evidence['status'], from?: string): CheckedRule {
  const rule: Rule = { id, box: [[lo, hi]], allowed: [0], origin: from ? { kind: 'repaired', from } : { kind: 'mined' } };
  return { rule, evidence: { status, samples: 100, violations: status === 'refuted' ? 1 : 0, violationBound: 0.03, confidence: 0.95, volumeFraction: (hi - lo) / 10 } };
}

export function run(ids: readonly string[], shards: number, over: Partial<PartialRun> = {}): PartialRun {
  return {
    command: 'check',
    tool: 'specula',
    toolVersion: '0.0.0',
    scenarioSha256: 'a'.repeat(64),
    models: { model: 'b'.repeat(64) },
    inputSha256: 'c'.repeat(64),
    seed: 1,
    settings: { checkSamples: 100 },
    shards,
    items: ids.length,
    itemsSha256: itemsSha256(ids),
    report: false,
    ...over,
  };
}
