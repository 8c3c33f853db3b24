import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { main } from '../../src/cli/main.js';
import type { CliIo } from '../../src/cli/io.js';

/**
 * Worker threads change the speed, never the result: the demo scenario with its trained
 * model, mined with a small budget on one thread and on two (sampling, checks, fidelity and
 * proofs all spread over workers), gives the same rules.json byte for byte apart from the date
 * and the proof timings. The reference is the single-thread run itself.
 */
const SCENARIO = resolve('scenarios/survey-boat/scenario.json');
const SMALL = ['--samples', '40000', '--check-samples', '3000', '--fidelity-samples', '40000', '--prove-boxes', '2000', '--no-report', '--quiet'];

function io(cwd: string): CliIo & { err: () => string } {
  let err = '';
  return { stdout: () => undefined, stderr: (t) => (err += t), isTTY: false, cwd, err: () => err };
}

describe('mine with worker threads', () => {
  it('gives identical rules.json on survey-boat with --jobs 1 and --jobs 2', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'specula-jobs-'));
    const out = io(dir);
    expect(await main(['mine', SCENARIO, '--out', 'j1', '--jobs', '1', ...SMALL], out)).toBe(0);
    expect(await main(['mine', SCENARIO, '--out', 'j2', '--jobs', '2', ...SMALL], out)).toBe(0);
    expect(out.err()).toBe('');
    const read = (f: string): string => readFileSync(join(dir, f, 'rules.json'), 'utf8').replace(/"date": "[^"]*"/, '').replace(/"seconds": [\d.e+-]+/g, '');
    const one = read('j1');
    expect(read('j2')).toBe(one);
    // the table is a real one: proofs ran, counterexamples and fidelity are there
    expect(one).toContain('"proof"');
    expect(JSON.parse(readFileSync(join(dir, 'j1', 'rules.json'), 'utf8')).fidelity.samples).toBe(40_000);
  });
});
