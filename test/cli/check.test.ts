import { describe, expect, it } from 'vitest';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import * as ort from 'onnxruntime-node';
import { main } from '../../src/cli/main.js';
import { boxNetwork2d, writeBoxScenario } from '../fixtures/box-network.js';
import { capture } from './helpers/capture.js';

/** Small budgets keep the file fast; the box network's regions are exact (A: x1 < 4; B: x1 >= 4, x2 < 6; C: else). */
const SMALL = ['--check-samples', '2000', '--prove-boxes', '2000', '--jobs', '1', '--no-report'];

function scenarioWith(rules: string): { dir: string; net: ReturnType<typeof boxNetwork2d> } {
  const net = boxNetwork2d();
  const { dir } = writeBoxScenario(net);
  writeFileSync(join(dir, 'expect.rules'), rules);
  return { dir, net };
}

describe('specula check', () => {
  it('exits 0 when every rule holds, proving rules strictly inside the known regions, and writes the run-folder files', async () => {
    const { dir } = scenarioWith('# known regions\nR1: when x1 <= 3.9 expect A\nR2: when x1 >= 4.1 and x2 <= 5.9 expect B\nR3: when x1 >= 4.5 expect B or C\n');
    const io = capture(dir);
    expect(await main(['check', 'scenario.json', 'expect.rules', '--out', 'chk', ...SMALL], io)).toBe(0);
    expect(io.err()).toBe('');
    for (const f of ['rules.json', 'rules.csv', 'rules.md']) expect(existsSync(join(dir, 'chk', f))).toBe(true);
    const doc = JSON.parse(readFileSync(join(dir, 'chk', 'rules.json'), 'utf8'));
    expect(doc.manifest.command).toBe('check');
    expect(doc.rules.map((r: { id: string; evidence: { status: string } }) => [r.id, r.evidence.status])).toEqual([
      ['R1', 'proven'],
      ['R2', 'proven'],
      ['R3', 'proven'],
    ]);
    expect(doc.rules[0].origin).toEqual({ kind: 'expected', line: 2, file: join(dir, 'expect.rules') });
    expect(io.out()).toContain('3 proven');
    expect(io.out().trimEnd().split('\n').at(-1)).toContain('not qualified');
  });

  it('exits 1 when a rule is refuted, with a counterexample onnxruntime confirms, in units', async () => {
    const { dir, net } = scenarioWith('R1: when x1 <= 3.9 expect A\nR2: when x1 >= 3 and x2 <= 5.9 expect B\n');
    const io = capture(dir);
    expect(await main(['check', 'scenario.json', 'expect.rules', '--out', 'chk', '--json', ...SMALL], io)).toBe(1);
    const out = JSON.parse(io.out());
    expect(out.exitCode).toBe(1);
    expect(out.rules.map((r: { evidence: { status: string } }) => r.evidence.status)).toEqual(['proven', 'refuted']);
    const cx = out.rules[1].evidence.counterexample;
    expect(net.labelAt(cx.x)).toBe(0); // A by the region definitions
    const session = await ort.InferenceSession.create(net.bytes);
    const res = await session.run({ input: new ort.Tensor('float32', Float32Array.from(cx.x), [1, 2]) });
    const scores = Array.from(res['scores']!.data as Float32Array);
    expect(scores.indexOf(Math.max(...scores))).toBe(0);
    await session.release();
    const text = capture(dir);
    expect(await main(['check', 'scenario.json', 'expect.rules', '--out', 'chk2', ...SMALL], text)).toBe(1);
    expect(text.out()).toMatch(/R2 refuted: at x1 = [\d.]+, x2 = [\d.]+ the network gives A \(ahead by [\d.]+ in score\)/);
  });

  it('exits 2 on a rule-file error, naming file, line and column, and writes nothing', async () => {
    const { dir } = scenarioWith('R1: when x1 <= 3.9 expect A\nR2: when x1 >= 4.1 and x2 <= 5.9 expect B\nR3: when x3 < 2 expect D\nR4: when x1 << 2 expect A\n');
    const io = capture(dir);
    expect(await main(['check', 'scenario.json', 'expect.rules', '--out', 'chk', ...SMALL], io)).toBe(2);
    const file = join(dir, 'expect.rules');
    expect(io.err()).toBe(
      [
        `specula: ${file} line 3, col 10: unknown input 'x3' (did you mean 'x1'?), inputs are: x1, x2`,
        `${file} line 3, col 24: unknown advisory 'D' (did you mean 'A'?), advisories are: A, B, C`,
        `${file} line 4, col 14: expected a number after '<', found '<'`,
        '',
      ].join('\n'),
    );
    expect(io.out()).toBe('');
    expect(existsSync(join(dir, 'chk'))).toBe(false);
  });

  it('clips bounds past the domain with a warning on stderr and a note in the table', async () => {
    const { dir } = scenarioWith('R1: when x1 in [-5, 3.9] expect A\n');
    const io = capture(dir);
    expect(await main(['check', 'scenario.json', 'expect.rules', '--out', 'chk', '--json', ...SMALL], io)).toBe(0);
    const warning = `${join(dir, 'expect.rules')} line 1, col 17: x1 lower bound -5 is below the domain minimum 0, clipped to 0`;
    expect(io.err()).toBe(`specula: warning: ${warning}\n`);
    const out = JSON.parse(io.out());
    expect(out.notes).toEqual([warning]);
    expect(out.rules[0].box.x1).toEqual([0, 3.9]);
  });

  it('exits 2 for a box outside the domain', async () => {
    const { dir } = scenarioWith('R1: when x1 >= 12 expect A\n');
    const io = capture(dir);
    expect(await main(['check', 'scenario.json', 'expect.rules', ...SMALL], io)).toBe(2);
    expect(io.err()).toMatch(/expect\.rules line 1, col 16: x1 \[12, inf\] lies outside its domain \[0, 10\]/);
  });

  it('exits 2 without rules or a reference table, and for a missing rule file', async () => {
    const { dir } = scenarioWith('');
    const io = capture(dir);
    expect(await main(['check', 'scenario.json', ...SMALL], io)).toBe(2);
    expect(io.err()).toMatch(/name the rules to check/);
    const missing = capture(dir);
    expect(await main(['check', 'scenario.json', 'nope.rules', ...SMALL], missing)).toBe(2);
    expect(missing.err()).toMatch(/nope\.rules: cannot read the rule file \(no such file\)/);
  });

  it('writes report.html by default, as mine does', async () => {
    const { dir } = scenarioWith('R1: when x1 <= 3.9 expect A\n');
    const io = capture(dir);
    expect(await main(['check', 'scenario.json', 'expect.rules', '--out', 'chk', '--check-samples', '500', '--jobs', '1'], io)).toBe(0);
    expect(readFileSync(join(dir, 'chk', 'report.html'), 'utf8')).toContain('<html');
  });
});
