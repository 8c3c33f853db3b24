import { describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { main } from '../../src/cli/main.js';
import { capture } from '../cli/helpers/capture.js';

const SCENARIO = resolve('scenarios/cruise-spacing/scenario.json');
const EXPECTATIONS = resolve('scenarios/cruise-spacing/expectations.rules');

describe('specula mine and check on the cruise-spacing demo', () => {
  it('mines, checks and proves with a small budget: the run folder with at most 60 rules', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'specula-cruise-'));
    const io = capture(dir);
    const args = ['mine', SCENARIO, '--out', 'run', '--samples', '20000', '--check-samples', '1000', '--fidelity-samples', '10000', '--prove-boxes', '2000', '--no-report'];
    expect(await main(args, io)).toBe(0);
    expect(io.err()).toBe('');
    for (const f of ['rules.json', 'rules.csv', 'rules.md']) expect(existsSync(join(dir, 'run', f))).toBe(true);
    const doc = JSON.parse(readFileSync(join(dir, 'run', 'rules.json'), 'utf8'));
    expect(doc.inputs.map((i: { name: string }) => i.name)).toEqual(['gap_m', 'own_speed_mps', 'closing_speed_mps']);
    expect(doc.rules.length).toBeGreaterThan(5);
    expect(doc.rules.length).toBeLessThanOrEqual(60);
    // The prover ran: no rule is left merely `sampled`; each is proven, unknown with its proven
    // share, or refuted with a counterexample. (Measured: all refuted, since every box of the
    // table straddles an oblique boundary somewhere; the expectations below are all proven.)
    expect(doc.manifest.settings.prove).toBe(true);
    for (const r of doc.rules) {
      expect(['proven', 'unknown', 'refuted'], r.id).toContain(r.evidence.status);
      if (r.evidence.status === 'refuted') expect(r.evidence.counterexample, r.id).toBeDefined();
      else expect(r.evidence.proof.provenFraction, r.id).toBeGreaterThanOrEqual(0);
    }
  });

  it('reaches fidelity >= 92 % with the default settings, below the design target because the boundaries are oblique', async () => {
    // The policy's time-gap and TTC boundaries are planes gap = T·x through the origin; a table
    // of at most 60 axis-aligned boxes can only approximate them by steps. Measured at the
    // defaults: 95.70 % [95.57, 95.83] (100,000 fresh samples), balanced 91.3 %, 59 rules
    // (93.97 % before pruning by volume). The design's 99 % target is for axis-aligned policies
    // such as survey-boat's.
    const dir = mkdtempSync(join(tmpdir(), 'specula-cruise-'));
    const io = capture(dir);
    expect(await main(['mine', SCENARIO, '--out', 'run', '--json', '--no-prove', '--no-report'], io)).toBe(0);
    const doc = JSON.parse(io.out());
    expect(doc.rules.length).toBeLessThanOrEqual(60);
    expect(doc.fidelity.overall.value).toBeGreaterThanOrEqual(0.92);
    expect(doc.fidelity.balanced).toBeGreaterThanOrEqual(0.88);
  });

  it('check proves every expert expectation on the committed model and exits 0', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'specula-cruise-'));
    const io = capture(dir);
    expect(await main(['check', SCENARIO, EXPECTATIONS, '--out', 'checked', '--json', '--check-samples', '2000', '--no-report'], io)).toBe(0);
    const doc = JSON.parse(io.out());
    expect(doc.rules.map((r: { id: string }) => r.id)).toEqual(['E1', 'E2', 'E3', 'E4', 'E5', 'E6', 'E7', 'E8', 'E9']);
    // Measured: all nine proven by branch and bound (33 pieces for E1, under a second each).
    for (const r of doc.rules) expect(r.evidence.status, r.id).toBe('proven');
  });
});
