import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ScenarioError } from '../../src/errors.js';
import { safeLoadScenario } from '../../src/scenario/safe-load-scenario.js';
import { validScenario } from './valid-scenario.js';

describe('safeLoadScenario', () => {
  it('returns the scenario for a valid file', () => {
    const path = join(mkdtempSync(join(tmpdir(), 'specula-scenario-')), 'scenario.json');
    writeFileSync(path, JSON.stringify(validScenario()));
    const r = safeLoadScenario(path);
    expect(r.ok && r.scenario.name).toBe('survey-boat');
  });

  it('returns the ScenarioError with every issue instead of throwing', () => {
    const path = join(mkdtempSync(join(tmpdir(), 'specula-scenario-')), 'scenario.json');
    writeFileSync(path, JSON.stringify({ ...validScenario(), decision: 'max', advisories: ['only_one'] }));
    const r = safeLoadScenario(path);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error).toBeInstanceOf(ScenarioError);
      expect(r.error.issues.map((i) => i.path)).toEqual(['decision', 'advisories']);
    }
  });

  it('returns SCENARIO_UNREADABLE for a missing file', () => {
    const r = safeLoadScenario(join(tmpdir(), 'specula-no-such-folder', 'x.json'));
    expect(!r.ok && r.error.code).toBe('SCENARIO_UNREADABLE');
  });
});
