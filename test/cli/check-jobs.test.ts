/**
 * `specula check` spreads its dense checks over model worker threads once the work outweighs
 * their start-up (WORKER_MIN_EVALUATIONS network evaluations); the evidence must not depend on
 * the number of threads, because every rule's samples come from the run's seed and the rule's id.
 */
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import { WORKER_MIN_EVALUATIONS } from '../../src/pipeline/model-jobs.js';
import { capture } from './helpers/capture.js';
import { withoutTiming } from './helpers/without-timing.js';

const DEMO = resolve('scenarios/survey-boat');
/** Expectation rules in the demo's rule file (the file's own count, read below). */
const RULE_FILE = join(DEMO, 'expectations.rules');

describe('specula check --jobs', () => {
  it('gives the same rules.json with 1 and 2 threads when the checks run on model workers', async () => {
    const rules = readFileSync(RULE_FILE, 'utf8').split('\n').filter((l) => /^\s*[A-Za-z][\w.-]*\s*:/.test(l)).length;
    // enough dense samples per rule that the whole check passes the threshold for workers
    const perRule = Math.ceil(WORKER_MIN_EVALUATIONS / rules);
    const dir = mkdtempSync(join(tmpdir(), 'specula-check-jobs-'));
    const docs = [];
    for (const jobs of [1, 2]) {
      const io = capture(dir);
      const code = await main(['check', join(DEMO, 'scenario.json'), RULE_FILE, '--out', `j${jobs}`, '--jobs', String(jobs), '--check-samples', String(perRule), '--no-prove', '--no-report', '--quiet'], io);
      expect([0, 1]).toContain(code);
      docs.push(JSON.parse(readFileSync(join(dir, `j${jobs}`, 'rules.json'), 'utf8')));
    }
    expect(docs[0].rules.length).toBe(rules);
    expect(docs[0].rules[0].evidence.samples).toBeGreaterThanOrEqual(perRule);
    expect(withoutTiming(docs[1])).toEqual(withoutTiming(docs[0]));
  });
});
