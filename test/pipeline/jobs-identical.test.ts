import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { main } from '../../src/cli/main.js';
import type { CliIo } from '../../src/cli/io.js';
import { loadScenario } from '../../src/scenario/index.js';
import { loadModel } from '../../src/model/index.js';
import { mine } from '../../src/pipeline/mine.js';
import { writeRunFolder } from '../../src/report/index.js';

/**
 * Worker threads change the speed, never the result: the demo scenario with its trained
 * model, mined with a small budget on one thread and on two, gives the same rules.json byte for
 * byte apart from the date and the proof timings. The reference is the single-thread run itself.
 * Through the CLI a run this small keeps the model's work in the main thread (mine's
 * WORKER_MIN_EVALUATIONS) and proves on workers; the second test sends sampling, checks and
 * fidelity to model workers too (while they start, the main thread takes pieces itself, so the
 * run mixes both: test/pipeline/model-jobs.test.ts checks the workers' pieces alone).
 */
const SCENARIO = resolve('scenarios/survey-boat/scenario.json');
/** rules.json without the fields allowed to differ: the run's date and the proofs' timings. */
const read = (dir: string, f: string): string => readFileSync(join(dir, f, 'rules.json'), 'utf8').replace(/"date": "[^"]*"/, '').replace(/"seconds": [\d.e+-]+/g, '');
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
    const one = read(dir, 'j1');
    expect(read(dir, 'j2')).toBe(one);
    // the table is a real one: proofs ran, counterexamples and fidelity are there
    expect(one).toContain('"proof"');
    expect(JSON.parse(readFileSync(join(dir, 'j1', 'rules.json'), 'utf8')).fidelity.samples).toBe(40_000);
  });

  it('gives identical rules.json with sampling, checks and fidelity on two model workers', async () => {
    // a small run keeps the model's work in this thread (WORKER_MIN_EVALUATIONS); 0 sends it to the workers
    const scenario = loadScenario(SCENARIO);
    const model = await loadModel(scenario);
    const dir = mkdtempSync(join(tmpdir(), 'specula-jobs-'));
    const settings = {
      seed: 3, budget: 30_000, boundaryShare: 0.3, maxRules: 60, minLeaf: 5, roundTolerance: 0.001, checkSamples: 2_000,
      fidelitySamples: 40_000, confidence: 0.95, prove: true, proveBoxes: 1_000, proveSeconds: 20, repair: false, workerMinEvaluations: 0,
    };
    try {
      for (const jobs of [1, 2]) writeRunFolder(join(dir, `j${jobs}`), await mine(scenario, model, { ...settings, jobs }));
    } finally {
      await model.close();
    }
    expect(read(dir, 'j2')).toBe(read(dir, 'j1'));
    expect(read(dir, 'j1')).toContain('"proof"');
  });
});
