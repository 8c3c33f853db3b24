import { describe, expect, it } from 'vitest';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { main } from '../../src/cli/main.js';
import { writeThresholdPair } from '../diff/threshold-network.js';
import { gridTableCsv } from '../reference/grid-table.js';
import { capture } from './helpers/capture.js';

/**
 * The scenario's model (a.onnx) has thresholds (4, 6). On the grid of cell centres 0.5 … 9.5, a
 * table made from (4, 6) agrees at every point; one made from (5, 7) disagrees at 15 of 100, by
 * counting: x1 = 4.5 (table A, network B for 6 values of x2, C for 4) and x2 = 6.5 with
 * x1 in 5.5 … 9.5 (table B, network C; 5 points).
 */
function setup(): string {
  const { dir } = writeThresholdPair([4, 6], [5, 7]);
  writeFileSync(join(dir, 'same.csv'), gridTableCsv(4, 6));
  writeFileSync(join(dir, 'moved.csv'), gridTableCsv(5, 7));
  return dir;
}

describe('specula check --reference', () => {
  it('exits 0 when the network agrees with the table at every grid point, and writes reference.json and reference.md', async () => {
    const dir = setup();
    const io = capture(dir);
    expect(await main(['check', 'scenario.json', '--reference', 'same.csv', '--out', 'ref'], io)).toBe(0);
    expect(io.err()).toBe('');
    expect(io.out()).toContain('agreement at the grid points: 100.00 % (100 of 100)');
    expect(io.out()).toContain('not checked:');
    expect(io.out().trimEnd().split('\n').at(-1)).toContain('not qualified');
    const doc = JSON.parse(readFileSync(join(dir, 'ref', 'reference.json'), 'utf8'));
    expect([doc.format, doc.points, doc.agree, doc.disagreements]).toEqual(['specula-reference', 100, 100, []]);
    expect(readFileSync(join(dir, 'ref', 'reference.md'), 'utf8')).toContain('Not checked: any input between grid points');
  });

  it('exits 1 below --min-agreement (default: every grid point) and 0 at or above it', async () => {
    const dir = setup();
    const strict = capture(dir);
    expect(await main(['check', 'scenario.json', '--reference', 'moved.csv', '--out', 'r1'], strict)).toBe(1);
    expect(strict.out()).toContain('agreement at the grid points: 85.00 % (85 of 100)');
    expect(strict.out()).toContain('per table advisory: A 80.00 % (40/50), B 85.71 % (30/35), C 100.00 % (15/15)');
    expect(strict.out()).toContain('in 3 boxes');
    expect(await main(['check', 'scenario.json', '--reference', 'moved.csv', '--out', 'r2', '--min-agreement', '0.85'], capture(dir))).toBe(0);
    expect(await main(['check', 'scenario.json', '--reference', 'moved.csv', '--out', 'r3', '--min-agreement', '0.86'], capture(dir))).toBe(1);
  });

  it('checks rules and the table in one run, writing both into one folder', async () => {
    const dir = setup();
    writeFileSync(join(dir, 'e.rules'), 'R1: when x1 <= 3.9 expect A\n');
    const io = capture(dir);
    expect(await main(['check', 'scenario.json', 'e.rules', '--reference', 'same.csv', '--out', 'both', '--no-report', '--jobs', '1', '--check-samples', '500'], io)).toBe(0);
    for (const f of ['rules.json', 'rules.csv', 'rules.md', 'reference.json', 'reference.md']) expect(existsSync(join(dir, 'both', f))).toBe(true);
  });

  it('exits 2 on a bad table, naming file and line, before loading the model', async () => {
    const dir = setup();
    writeFileSync(join(dir, 'bad.csv'), 'x1,x2,advisory\n0.5,0.5,A\n0.5,1.5,Z\n');
    const io = capture(dir);
    expect(await main(['check', 'scenario.json', '--reference', 'bad.csv', '--model', 'missing.onnx'], io)).toBe(2);
    expect(io.err()).toBe(`specula: ${join(dir, 'bad.csv')} line 3, column advisory: unknown advisory 'Z', advisories are: A, B, C\n`);
  });
});
