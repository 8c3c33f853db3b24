import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { main } from '../../src/cli/main.js';
import { boxNetwork3d, writeBoxScenario } from '../fixtures/box-network.js';
import { capture } from './helpers/capture.js';

/** Budgets shared by mine and check, so that both draw the same dense samples (seeded by rule id). */
const SHARED = ['--seed', '3', '--check-samples', '1000', '--prove-boxes', '1000', '--jobs', '1', '--no-report'];

type Row = { id: string; evidence: { status: string; samples: number; violations: number } };
const statuses = (rows: Row[]) => rows.map((r) => [r.id, r.evidence.status, r.evidence.samples, r.evidence.violations]);

describe('mine → check round trip', () => {
  it('gives the same statuses, sample counts and violations from rules.json and from rules.csv', async () => {
    const { dir } = writeBoxScenario(boxNetwork3d());
    // A budget of 3 rules for 4 regions forces impure rules, so the table mixes statuses.
    expect(await main(['mine', 'scenario.json', '--out', 'run', '--samples', '8000', '--fidelity-samples', '1000', '--max-rules', '3', ...SHARED], capture(dir))).toBe(0);
    const mined = JSON.parse(readFileSync(join(dir, 'run', 'rules.json'), 'utf8')).rules as Row[];
    expect(new Set(mined.map((r) => r.evidence.status)).has('refuted')).toBe(true);
    for (const file of ['rules.json', 'rules.csv']) {
      const io = capture(dir);
      const code = await main(['check', 'scenario.json', join('run', file), '--out', `check-${file}`, '--json', ...SHARED], io);
      expect(code).toBe(1); // some mined rule is refuted
      const checked = JSON.parse(io.out()).rules as Row[];
      expect([file, statuses(checked)]).toEqual([file, statuses(mined)]);
    }
  });
});
