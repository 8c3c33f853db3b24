import { createRng } from '../../src/sampling/rng.js';
import { writeMlpOnnx } from '../../src/model/index.js';
import type { CheckedRule, InputSpec, RuleStatus } from '../../src/types.js';
import { writeFixtureRun, type FixtureRun } from './report-fixture.js';

/** Inputs, advisories and rules of the scale fixture: 10 inputs, 4 advisories, 500 rules. */
export const SCALE_INPUTS: readonly InputSpec[] = Array.from({ length: 10 }, (_, i) => ({
  name: `x${i}`,
  unit: i % 2 === 0 ? 'm' : 's',
  min: 0,
  max: 10 * (i + 1),
  description: `input ${i}`,
}));
export const SCALE_ADVISORIES = ['a0', 'a1', 'a2', 'a3'] as const;
const STATUSES: readonly RuleStatus[] = ['proven', 'sampled', 'sampled', 'unknown', 'refuted'];

/**
 * A run of 500 rules over 10 inputs: the boxes tile inputs x0 (5 pieces) × x1 (10) × x2 (10),
 * the other inputs unconstrained; the advisory and status of rule k are k mod 4 and a cycle
 * over the statuses (the table is for measuring the page, not for being true). The network
 * is a seeded random 10 → 16 → 4 ReLU network.
 */
export function writeScaleRun(): FixtureRun {
  const rng = createRng(2024);
  const w = (n: number): number[] => Array.from({ length: n }, () => 2 * rng() - 1);
  const model = writeMlpOnnx([
    { inSize: 10, outSize: 16, weights: w(160).map((v, j) => v / SCALE_INPUTS[j % 10]!.max), bias: w(16), activation: 'relu' },
    { inSize: 16, outSize: 4, weights: w(64), bias: w(4), activation: 'none' },
  ]);
  const rules: CheckedRule[] = [];
  for (let a = 0; a < 5; a++) {
    for (let b = 0; b < 10; b++) {
      for (let c = 0; c < 10; c++) {
        const k = rules.length;
        const box = SCALE_INPUTS.map((inp, i): [number, number] => {
          const parts = i === 0 ? 5 : i <= 2 ? 10 : 1;
          const j = i === 0 ? a : i === 1 ? b : i === 2 ? c : 0;
          const step = (inp.max - inp.min) / parts;
          return [inp.min + j * step, j === parts - 1 ? inp.max : inp.min + (j + 1) * step];
        });
        const status = STATUSES[k % STATUSES.length]!;
        rules.push({
          rule: { id: `R${k + 1}`, box, allowed: [k % 4], origin: { kind: 'mined' } },
          evidence: {
            status,
            samples: 20000,
            violations: status === 'refuted' ? 12 : 0,
            violationBound: status === 'refuted' ? 1e-3 : 1.5e-4,
            confidence: 0.95,
            volumeFraction: 1 / 500,
            ...(status === 'refuted'
              ? { counterexample: { x: box.map(([lo, hi]) => (lo + hi) / 2), scores: [0, 0, 0, 1], advisory: (k + 1) % 4, margin: 0.1 } }
              : {}),
          },
        });
      }
    }
  }
  return writeFixtureRun({ inputs: SCALE_INPUTS, advisories: [...SCALE_ADVISORIES], model, rules });
}
