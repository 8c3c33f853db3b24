/**
 * Reproducibility: the same seed, model and scenario give byte-identical rules.json and
 * rules.csv, apart from the run's date and the proofs' timings ("seconds"); rules.md differs
 * only in its date line. Proving is on, with its worker threads, so their scheduling is covered.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { runCli } from './helpers/run-cli.js';

const SCENARIO = resolve('scenarios/survey-boat/scenario.json');
const BUDGET = ['--samples', '20000', '--check-samples', '1000', '--fidelity-samples', '10000', '--prove-boxes', '2000', '--no-report'];
/** The only fields of rules.json allowed to differ between two runs: when, and how long proofs took. */
const VOLATILE = /"(date|seconds)": ?("[^"]*"|[-+0-9.eE]+)/g;
const DATE = /\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d+Z/g;

async function mineInto(dir: string, out: string, seed: string): Promise<{ json: string; csv: string; md: string }> {
  const outcome = await runCli(['mine', SCENARIO, '--out', out, '--seed', seed, ...BUDGET], dir);
  expect(outcome.code, outcome.err).toBe(0);
  const read = (f: string): string => readFileSync(join(dir, out, f), 'utf8');
  return { json: read('rules.json'), csv: read('rules.csv'), md: read('rules.md') };
}

describe('the same seed', () => {
  it('gives byte-identical rules.json and rules.csv apart from the date and proof timings', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'specula-seed-'));
    const a = await mineInto(dir, 'a', '7');
    const b = await mineInto(dir, 'b', '7');
    expect(a.json.match(VOLATILE)!.length).toBeGreaterThan(1); // the date and at least one proof time were there
    expect(b.json.replace(VOLATILE, '"$1": _')).toBe(a.json.replace(VOLATILE, '"$1": _'));
    expect(b.csv).toBe(a.csv);
    expect(b.md.replace(DATE, '_')).toBe(a.md.replace(DATE, '_'));
    // and the comparison can tell runs apart: another seed gives another table
    const c = await mineInto(dir, 'c', '8');
    expect(c.json.replace(VOLATILE, '"$1": _')).not.toBe(a.json.replace(VOLATILE, '"$1": _'));
  });
});
