/**
 * End to end on a network exported by PyTorch (test/fixtures/torch/make_fixture.py: torch 1.13,
 * opset 13) whose first module normalises the inputs itself, (x − offset) / scale as Sub and Div:
 * the scenario declares no normalisation, and rules stay in units. The reference is torch's own
 * output for six inputs, stored beside the model by the script.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { copyFileSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { main } from '../../src/cli/main.js';
import { capture } from '../cli/helpers/capture.js';

const FIXTURE = fileURLToPath(new URL('../fixtures/torch/', import.meta.url));
const reference = JSON.parse(readFileSync(join(FIXTURE, 'spacing-mlp.json'), 'utf8')) as {
  inputs: string[];
  advisories: string[];
  domain: [number[], number[]];
  reference: { x: number[]; scores: number[] }[];
};
const UNITS = ['m', 'm/s', 'm/s'];
let dir = '';

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'specula-torch-'));
  copyFileSync(join(FIXTURE, 'spacing-mlp.onnx'), join(dir, 'model.onnx'));
  const scenario = {
    name: 'torch-spacing',
    title: 'PyTorch-exported spacing network with its own input normalisation',
    model: 'model.onnx',
    decision: 'argmax',
    inputs: reference.inputs.map((name, j) => ({ name, unit: UNITS[j], min: reference.domain[0][j], max: reference.domain[1][j], description: name })),
    advisories: reference.advisories,
  };
  writeFileSync(join(dir, 'scenario.json'), JSON.stringify(scenario, null, 2));
});

/** torch's advisory at a reference input: the argmax of the scores torch computed. */
const torchAdvisory = (scores: number[]): string => reference.advisories[scores.indexOf(Math.max(...scores))]!;

describe('a PyTorch-exported network with input normalisation, end to end', () => {
  it('check: at every reference input the tool gives torch\'s advisory, proven on the one-point box', async () => {
    // Rule boxes of zero width: "at exactly this input, expect what torch computed". The smallest
    // winning margin among them is 0.06 in score units (input 0, 0, −10), far above the ~1e-7
    // float32 difference between torch and onnxruntime (TOOLCHAIN notes).
    const lines = reference.reference.map((p, i) => {
      const at = p.x.map((v, j) => `${reference.inputs[j]} in [${v}, ${v}]`).join(' and ');
      return `P${i + 1}: when ${at} expect ${torchAdvisory(p.scores)}`;
    });
    writeFileSync(join(dir, 'reference.rules'), lines.join('\n') + '\n');
    const io = capture(dir);
    const code = await main(['check', 'scenario.json', 'reference.rules', '--out', 'ref', '--json', '--check-samples', '200', '--no-report'], io);
    expect(io.err()).toBe('');
    expect(code).toBe(0);
    const doc = JSON.parse(io.out());
    expect(doc.rules).toHaveLength(reference.reference.length);
    for (const r of doc.rules) expect(r.evidence.status, r.id).toBe('proven');
  });

  it('check: refutes a wrong rule with a counterexample, exit 1', async () => {
    // gap ≤ 10 m closing at ≥ 5 m/s is TTC ≤ 2 s, where the fixture's policy brakes; "hold" is wrong there.
    writeFileSync(join(dir, 'wrong.rules'), 'W1: when gap_m <= 10 and own_speed_mps >= 10 and closing_speed_mps >= 5 expect hold\n');
    const io = capture(dir);
    expect(await main(['check', 'scenario.json', 'wrong.rules', '--out', 'wrong', '--json', '--check-samples', '500', '--no-report'], io)).toBe(1);
    const rule = JSON.parse(io.out()).rules[0];
    expect(rule.evidence.status).toBe('refuted');
    expect(rule.evidence.counterexample.advisory).not.toBe(reference.advisories.indexOf('hold'));
  });

  it('mine: a table of at most 60 rules in units, with fidelity >= 95 %', async () => {
    const io = capture(dir);
    const args = ['mine', 'scenario.json', '--out', 'run', '--json', '--samples', '20000', '--check-samples', '1000', '--fidelity-samples', '10000', '--prove-boxes', '2000', '--no-report'];
    expect(await main(args, io)).toBe(0);
    const doc = JSON.parse(io.out());
    expect(doc.rules.length).toBeLessThanOrEqual(60);
    // Rules are in units: every box lies inside the scenario's domain, not in [−1, 1].
    expect(doc.rules.some((r: { box: Record<string, [number, number]> }) => r.box.gap_m![1] > 10)).toBe(true);
    // Measured 97.96 % [97.66, 98.23] on 10,000 samples; the policy's boundaries are oblique
    // (time gap and TTC), so the table's steps cost a few points.
    expect(doc.fidelity.overall.value).toBeGreaterThanOrEqual(0.95);
  });
});
