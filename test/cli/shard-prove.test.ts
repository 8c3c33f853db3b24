import { beforeAll, describe, expect, it } from 'vitest';
import { cpSync, existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { runCli } from './helpers/capture.js';
import { withoutTiming } from './helpers/without-timing.js';

const DEMO = resolve('scenarios/survey-boat');
/** Boxes on the demo network that end proven, unknown and refuted at the small proof budget below. */
const RULES = [
  'R1: when cpa_nm >= 1 expect keep_course',
  'P1: when cpa_nm >= 1.2 expect keep_course',
  'P2: when cpa_nm >= 1.1 and tcpa_min >= 5 expect keep_course',
  'R2: when tcpa_min <= 0 expect keep_course',
  'P3: when tcpa_min <= -1 expect keep_course',
  'P4: when cpa_nm <= 0.3 and tcpa_min in [2, 6] and bearing_deg in [40, 90] expect starboard_large',
  'P5: when tcpa_min >= 19 expect keep_course',
  '',
].join('\n');
const PROVE = ['--prove-boxes', '1000', '--jobs', '1', '--quiet'];

let dir = '';
const run = (args: string[]) => runCli(dir, args);
const json = (p: string) => JSON.parse(readFileSync(join(dir, p), 'utf8'));

describe('specula prove --shard and merge', () => {
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'specula-shard-prove-'));
    writeFileSync(join(dir, 'expect.rules'), RULES);
    // a run folder whose rules are checked but not proved yet, with report.html
    const made = await run(['check', join(DEMO, 'scenario.json'), 'expect.rules', '--out', 'run', '--check-samples', '1000', '--no-prove', '--quiet']);
    expect(made.code).toBe(1);
    cpSync(join(dir, 'run'), join(dir, 'single'), { recursive: true });
  });

  it('four shards merged into the run folder give the files proving it in one run gives', async () => {
    expect(await run(['prove', 'single', ...PROVE])).toEqual({ code: 0, out: '', err: '' });
    for (const k of [1, 2, 3, 4]) expect(await run(['prove', 'run', '--shard', `${k}/4`, '--out', 'run/parts', ...PROVE])).toEqual({ code: 0, out: '', err: '' });
    // the shards leave the run folder itself alone: it still holds the unproved table
    expect(json('run/rules.json').rules.every((r: { evidence: { proof?: unknown } }) => r.evidence.proof === undefined)).toBe(true);
    expect(await run(['merge', 'run/parts', '--out', 'run', '--quiet'])).toEqual({ code: 0, out: '', err: '' });
    const single = json('single/rules.json');
    expect(withoutTiming(json('run/rules.json'))).toEqual(withoutTiming(single));
    expect(new Set(single.rules.map((r: { evidence: { status: string } }) => r.evidence.status))).toEqual(new Set(['proven', 'refuted', 'unknown']));
    expect(single.coverage.total).toBeGreaterThan(0);
    const text = (p: string) => readFileSync(join(dir, p), 'utf8');
    expect(text('run/rules.csv')).toBe(text('single/rules.csv'));
    expect(text('run/atlas.json')).toBe(text('single/atlas.json'));
    // the run had report.html, so the single run rewrote it and so does merge
    expect(existsSync(join(dir, 'run/report.html'))).toBe(true);
    expect(text('run/report.html')).toContain('P4');
  });

  it('a prove part names the run\'s rules.json by SHA-256 and its prove settings', () => {
    const part = json('run/parts/shard-1-of-4.json');
    expect(part.run).toMatchObject({ command: 'prove', shards: 4, items: 7, report: true, settings: { proveBoxes: 1000, proveSeconds: 20, repair: false, checkSamples: 1000, confidence: 0.95 } });
    expect(part.run.inputSha256).toMatch(/^[0-9a-f]{64}$/);
    expect(part.items.map((i: { id: string }) => i.id)).toEqual(['R1', 'P3']); // items 0 and 4 of 7
  });

  it('refuses --shard without --out (exit 2)', async () => {
    expect(await run(['prove', 'single', '--shard', '1/2'])).toEqual({ code: 2, out: '', err: 'specula: --shard: name the folder for the partial result with --out\n' });
  });
});
