import { describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Papa from 'papaparse';
import { main } from '../../src/cli/main.js';
import { capture } from './helpers/capture.js';
import { boxNetwork2d, writeBoxScenario } from '../fixtures/box-network.js';

const SMALL = ['--samples', '20000', '--check-samples', '2000', '--fidelity-samples', '10000'];

describe('specula mine', () => {
  it('writes rules.json, rules.csv and rules.md and prints a summary ending with the cautions', async () => {
    const { dir, scenarioPath } = writeBoxScenario(boxNetwork2d());
    const io = capture(dir);
    const code = await main(['mine', scenarioPath, '--out', 'run', ...SMALL], io);
    expect(io.err()).toBe('');
    expect(code).toBe(0);
    for (const f of ['rules.json', 'rules.csv', 'rules.md']) expect(existsSync(join(dir, 'run', f))).toBe(true);
    const doc = JSON.parse(readFileSync(join(dir, 'run', 'rules.json'), 'utf8'));
    expect(doc.format).toBe('specula-rules');
    expect(doc.rules).toHaveLength(3);
    expect(doc.manifest.seed).toBe(1);
    expect(doc.manifest.model.sha256).toMatch(/^[0-9a-f]{64}$/);
    const csv = Papa.parse<string[]>(readFileSync(join(dir, 'run', 'rules.csv'), 'utf8').trim());
    expect(csv.data[0]).toEqual([
      'id', 'advisory', 'x1_min', 'x1_max', 'x2_min', 'x2_max',
      'status', 'samples', 'violations', 'bound', 'confidence', 'proven_fraction',
    ]);
    expect(csv.data).toHaveLength(1 + 3);
    expect(io.out()).toContain('3 rules');
    expect(io.out()).toContain('run/rules.json');
    expect(io.out().trimEnd().split('\n').at(-1)).toContain('not qualified');
  });

  it('prints one JSON document with --json', async () => {
    const { dir, scenarioPath } = writeBoxScenario(boxNetwork2d());
    const io = capture(dir);
    expect(await main(['mine', scenarioPath, '--out', 'run', '--json', ...SMALL], io)).toBe(0);
    const doc = JSON.parse(io.out());
    expect(doc.rules.map((r: { allowed: string[] }) => r.allowed[0]).sort()).toEqual(['A', 'B', 'C']);
  });

  it('gives identical rules.json for the same seed, apart from the date and proof timings', async () => {
    const { dir, scenarioPath } = writeBoxScenario(boxNetwork2d());
    const io = capture(dir);
    await main(['mine', scenarioPath, '--out', 'a', '--seed', '5', ...SMALL], io);
    await main(['mine', scenarioPath, '--out', 'b', '--seed', '5', ...SMALL], io);
    const read = (f: string) => readFileSync(join(dir, f, 'rules.json'), 'utf8').replace(/"date": "[^"]*"/, '').replace(/"seconds": [\d.e+-]+/g, '');
    expect(read('a')).toBe(read('b'));
  });

  it('gives identical rules.json with one proof worker and with two', async () => {
    const { dir, scenarioPath } = writeBoxScenario(boxNetwork2d());
    const io = capture(dir);
    expect(await main(['mine', scenarioPath, '--out', 'j1', '--jobs', '1', ...SMALL], io)).toBe(0);
    expect(await main(['mine', scenarioPath, '--out', 'j2', '--jobs', '2', ...SMALL], io)).toBe(0);
    expect(io.err()).toBe('');
    const read = (f: string) => readFileSync(join(dir, f, 'rules.json'), 'utf8').replace(/"date": "[^"]*"/, '').replace(/"seconds": [\d.e+-]+/g, '');
    expect(read('j1')).toBe(read('j2'));
    expect(read('j1')).toContain('"proof"');
  });

  it('refuses a bad scenario with exit 2, a one-line error, and leaves earlier outputs untouched', async () => {
    const { dir, scenarioPath } = writeBoxScenario(boxNetwork2d());
    const io = capture(dir);
    expect(await main(['mine', scenarioPath, '--out', 'run', ...SMALL], io)).toBe(0);
    const before = readFileSync(join(dir, 'run', 'rules.json'), 'utf8');
    const bad = JSON.parse(readFileSync(scenarioPath, 'utf8'));
    bad.inputs[0].min = 20; // min >= max
    writeFileSync(join(dir, 'bad.json'), JSON.stringify(bad));
    const io2 = capture(dir);
    expect(await main(['mine', 'bad.json', '--out', 'run', ...SMALL], io2)).toBe(2);
    expect(io2.err()).toMatch(/^specula: .*bad\.json.*inputs\[0\].*min 20.*max 10/);
    expect(io2.err()).not.toMatch(/\n\s+at /); // no stack trace
    expect(readFileSync(join(dir, 'run', 'rules.json'), 'utf8')).toBe(before);
  });

  it('refuses a missing model file with exit 2', async () => {
    const { dir, scenarioPath } = writeBoxScenario(boxNetwork2d());
    const io = capture(dir);
    expect(await main(['mine', scenarioPath, '--model', 'nope.onnx', ...SMALL], io)).toBe(2);
    expect(io.err()).toContain('nope.onnx');
  });

  it('refuses bad options with exit 2 and a usage hint', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'specula-cli-'));
    const io = capture(dir);
    expect(await main(['mine', 'x.json', '--max-rules', '0'], io)).toBe(2);
    expect(io.err()).toContain('--max-rules: expected a positive integer, found 0');
    const io2 = capture(dir);
    expect(await main(['frobnicate'], io2)).toBe(2);
    expect(io2.err()).toContain("run 'specula --help' for usage");
  });

  it('shows help with an example', async () => {
    const io = capture(tmpdir());
    expect(await main(['mine', '--help'], io)).toBe(0);
    expect(io.out()).toContain('specula mine scenarios/survey-boat/scenario.json');
  });
});
