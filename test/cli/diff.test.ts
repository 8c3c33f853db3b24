import { describe, expect, it } from 'vitest';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { main } from '../../src/cli/main.js';
import { boxNetwork3d } from '../fixtures/box-network.js';
import { writeThresholdPair } from '../diff/threshold-network.js';
import { capture } from './helpers/capture.js';

/** Small budgets: the networks are exact, a few thousand samples suffice. */
const SMALL = [
  '--check-samples', '1000', '--prove-boxes', '1000', '--jobs', '1',
  '--change-samples', '4000', '--change-budget', '8000', '--change-check-samples', '500',
];
/** Before (4, 6), after (5, 7): 15 % of the domain changes; R2 breaks (x1 in [4.1, 5) becomes A). */
const ACCEPTED = 'R1: when x1 <= 3.9 expect A\nR2: when x1 >= 4.1 and x2 <= 5.9 expect B\nR3: when x1 >= 5.1 and x2 >= 7.1 expect C\n';

function setup(): string {
  const { dir } = writeThresholdPair([4, 6], [5, 7]);
  writeFileSync(join(dir, 'accepted.rules'), ACCEPTED);
  return dir;
}

const diff = (extra: string[]) => ['diff', 'scenario.json', '--before', 'a.onnx', '--after', 'b.onnx', '--rules', 'accepted.rules', ...SMALL, ...extra];

describe('specula diff', () => {
  it('exits 1 by default when an accepted rule broke, and writes diff.json and diff.md', async () => {
    const dir = setup();
    const io = capture(dir);
    expect(await main(diff(['--out', 'd']), io)).toBe(1);
    expect(io.err()).toBe('');
    expect(io.out()).toContain('2 kept, 1 broken, 0 degraded, 0 no-longer-proven, 0 fixed, 0 still-refuted');
    expect(io.out()).toMatch(/R2 broken \(proven → refuted\): when x1 >= 4\.1 and x2 <= 5\.9 expect B\n {4}at x1 = [\d.]+, x2 = [\d.]+ the network gives A/);
    expect(io.out()).toContain('gate broken: TRIPPED (1 rule broken: R2)');
    expect(io.out().trimEnd().split('\n').at(-1)).toContain('not qualified');
    const doc = JSON.parse(readFileSync(join(dir, 'd', 'diff.json'), 'utf8'));
    expect([doc.format, doc.verdicts.broken, doc.gates[0].tripped]).toEqual(['specula-diff', 1, true]);
    expect(doc.cautions.length).toBeGreaterThan(4);
    expect(readFileSync(join(dir, 'd', 'diff.md'), 'utf8')).toContain('## Where the advisory changed');
  });

  it('gates on the changed share: exit 0 under the threshold, 1 over it; none turns gates off', async () => {
    const dir = setup();
    expect(await main(diff(['--out', 'g0', '--fail-on', 'none']), capture(dir))).toBe(0);
    // the true changed share is 15 %
    expect(await main(diff(['--out', 'g1', '--fail-on', 'changed>20%']), capture(dir))).toBe(0);
    const io = capture(dir);
    expect(await main(diff(['--out', 'g2', '--fail-on', 'changed>10%', '--json']), io)).toBe(1);
    const out = JSON.parse(io.out());
    expect(out.exitCode).toBe(1);
    expect(out.changed.lower).toBeLessThanOrEqual(0.15);
    expect(out.changed.upper).toBeGreaterThanOrEqual(0.15);
  });

  it('exits 0 for two identical models under every gate', async () => {
    const { dir } = writeThresholdPair([4, 6], [4, 6]);
    writeFileSync(join(dir, 'accepted.rules'), ACCEPTED);
    const io = capture(dir);
    expect(await main(diff(['--out', 'same', '--fail-on', 'broken,no-longer-proven,refuted,changed>0%']), io)).toBe(0);
    expect(io.out()).toContain('changed share of the domain: 0.000 %');
    expect(io.out()).toContain('where it changed: no change rules');
  });

  it('exits 2 when the after model has other widths than the before model', async () => {
    const dir = setup();
    writeFileSync(join(dir, 'wide.onnx'), boxNetwork3d().bytes);
    const io = capture(dir);
    expect(await main(['diff', 'scenario.json', '--before', 'a.onnx', '--after', 'wide.onnx', '--out', 'w'], io)).toBe(2);
    expect(io.err()).toBe(
      `specula: --after ${join(dir, 'wide.onnx')} takes 3 inputs, scenario lists 2; before and after must both take 2 inputs and give 3 scores (the scenario's widths)\n`,
    );
    expect(existsSync(join(dir, 'w'))).toBe(false);
  });

  it('exits 2 on a bad gate and on an unreadable accepted table', async () => {
    const dir = setup();
    const gate = capture(dir);
    expect(await main(diff(['--fail-on', 'brokn']), gate)).toBe(2);
    expect(gate.err()).toMatch(/--fail-on: expected one of: .*found 'brokn'/);
    writeFileSync(join(dir, 'accepted.rules'), 'R1: when x1 <= 3.9 expect Q\n');
    const rules = capture(dir);
    expect(await main(diff([]), rules)).toBe(2);
    expect(rules.err()).toMatch(/accepted\.rules line 1, col 27: unknown advisory 'Q'/);
  });

  it('reuses the evidence of a rules.json made on the before model, and notes it', async () => {
    const dir = setup();
    expect(await main(['check', 'scenario.json', 'accepted.rules', '--out', 'run', '--no-report', ...SMALL.slice(0, 6)], capture(dir))).toBe(0);
    const io = capture(dir);
    expect(await main(['diff', 'scenario.json', '--before', 'a.onnx', '--after', 'b.onnx', '--rules', join('run', 'rules.json'), '--out', 'd', ...SMALL], io)).toBe(1);
    expect(io.out()).toContain(`note: before: evidence taken from ${join(dir, 'run', 'rules.json')} (made on the same model and scenario files, by SHA-256)`);
  });
});
