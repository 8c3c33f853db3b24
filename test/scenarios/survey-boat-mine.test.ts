import { describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { main } from '../../src/cli/main.js';
import { capture } from '../cli/helpers/capture.js';

const SCENARIO = resolve('scenarios/survey-boat/scenario.json');

describe('specula mine on the survey-boat demo', () => {
  it('writes the run folder with a small budget and exits 0', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'specula-demo-'));
    const io = capture(dir);
    const code = await main(['mine', SCENARIO, '--out', 'run', '--samples', '20000', '--check-samples', '1000', '--fidelity-samples', '10000'], io);
    expect(io.err()).toBe('');
    expect(code).toBe(0);
    for (const f of ['rules.json', 'rules.csv', 'rules.md']) expect(existsSync(join(dir, 'run', f))).toBe(true);
    const doc = JSON.parse(readFileSync(join(dir, 'run', 'rules.json'), 'utf8'));
    expect(doc.inputs.map((i: { name: string }) => i.name)).toEqual(['cpa_nm', 'tcpa_min', 'bearing_deg', 'rel_course_deg', 'own_speed_kn']);
    expect(doc.rules.length).toBeGreaterThan(5);
    expect(doc.rules.length).toBeLessThanOrEqual(60);
    expect(readFileSync(join(dir, 'run', 'rules.md'), 'utf8')).toContain('not qualified');
  });

  it('meets the quality targets with the default settings: fidelity >= 99 %, balanced >= 97 %, <= 60 rules', async () => {
    // Targets from the design (quality row of the performance table); fidelity is measured on
    // 100,000 fresh uniform samples, so its 95 % interval is about ±0.05 points wide.
    const dir = mkdtempSync(join(tmpdir(), 'specula-demo-'));
    const io = capture(dir);
    expect(await main(['mine', SCENARIO, '--out', 'run', '--json'], io)).toBe(0);
    const doc = JSON.parse(io.out());
    expect(doc.rules.length).toBeLessThanOrEqual(60);
    expect(doc.fidelity.overall.value).toBeGreaterThanOrEqual(0.99);
    expect(doc.fidelity.balanced).toBeGreaterThanOrEqual(0.97);
  });
});
