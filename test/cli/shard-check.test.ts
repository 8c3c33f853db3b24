import { beforeAll, describe, expect, it } from 'vitest';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { runCli } from './helpers/capture.js';
import { withoutTiming } from './helpers/without-timing.js';

const DEMO = resolve('scenarios/survey-boat');
/** Small budgets keep the file quick; the rules below still end proven, unknown and refuted. */
const SMALL = ['--check-samples', '1000', '--prove-boxes', '1000', '--jobs', '1', '--no-report', '--quiet'];
/** Demo expectations (several refuted on the demo network) plus boxes deep inside one advisory (proven). */
const RULES = readFileSync(join(DEMO, 'expectations.rules'), 'utf8') + [
  'P1: when cpa_nm >= 1.2 expect keep_course',
  'P2: when cpa_nm >= 1.1 and tcpa_min >= 5 expect keep_course',
  'P3: when tcpa_min <= -1 expect keep_course',
  'P4: when cpa_nm <= 0.3 and tcpa_min in [2, 6] and bearing_deg in [40, 90] expect starboard_large',
  'P5: when tcpa_min >= 19 expect keep_course',
  '',
].join('\n');

let dir = '';
const run = (args: string[]) => runCli(dir, args);
const check = (...more: string[]) => run(['check', join(DEMO, 'scenario.json'), 'expect.rules', ...SMALL, ...more]);
const json = (p: string) => JSON.parse(readFileSync(join(dir, p), 'utf8'));

describe('specula check --shard and merge', () => {
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'specula-shard-check-'));
    writeFileSync(join(dir, 'expect.rules'), RULES);
    expect((await check('--out', 'single')).code).toBe(1);
    for (const k of [1, 2, 3]) expect(await check('--out', 'parts', '--shard', `${k}/3`)).toEqual({ code: 0, out: '', err: '' });
  });

  it('three shards merged give the rules.json, rules.csv, rules.md and atlas.json of one run (same seed)', async () => {
    expect(readdirSync(join(dir, 'parts')).sort()).toEqual(['shard-1-of-3.json', 'shard-2-of-3.json', 'shard-3-of-3.json']);
    const merged = await run(['merge', 'parts', '--out', 'merged', '--quiet']);
    expect(merged).toEqual({ code: 1, out: '', err: '' }); // as the single run: some rule refuted
    const single = json('single/rules.json');
    expect(withoutTiming(json('merged/rules.json'))).toEqual(withoutTiming(single));
    const statuses = new Set(single.rules.map((r: { evidence: { status: string } }) => r.evidence.status));
    expect([...statuses].sort()).toEqual(['proven', 'refuted', 'unknown']); // the comparison covers every kind of evidence
    expect(single.coverage.total).toBeGreaterThan(0);
    const text = (p: string) => readFileSync(join(dir, p), 'utf8');
    expect(text('merged/rules.csv')).toBe(text('single/rules.csv'));
    expect(text('merged/atlas.json')).toBe(text('single/atlas.json'));
    const undated = (s: string) => s.replace(/\d{4}-\d\d-\d\dT[\d:.]+Z/g, 'DATE');
    expect(undated(text('merged/rules.md'))).toBe(undated(text('single/rules.md')));
  });

  it('a part holds the whole run\'s identity and only its own rules, dealt round-robin', () => {
    const part = json('parts/shard-2-of-3.json');
    expect(part.format).toBe('specula-partial');
    expect(part.shard).toBe(2);
    expect(part.run).toMatchObject({ command: 'check', seed: 1, shards: 3, items: 15, report: false });
    expect(part.run.settings).toEqual({ checkSamples: 1000, confidence: 0.95, prove: true, proveBoxes: 1000, proveSeconds: 20, repair: false });
    expect(part.items.map((i: { index: number; id: string }) => `${i.index}:${i.id}`)).toEqual(['1:R2', '4:R5', '7:R8', '10:P1', '13:P4']);
  });

  it('merge refuses parts of another seed or model, the same part twice, and a missing part (exit 2, one line naming the file)', async () => {
    expect((await check('--out', 'seed2', '--shard', '2/3', '--seed', '2')).code).toBe(0);
    const mixedSeed = await run(['merge', 'parts/shard-1-of-3.json', 'seed2/shard-2-of-3.json', 'parts/shard-3-of-3.json', '--out', 'bad']);
    expect(mixedSeed.code).toBe(2);
    expect(mixedSeed.err).toBe('specula: seed2/shard-2-of-3.json: seed 2 differs from 1 in parts/shard-1-of-3.json; the parts are not from one run\n');
    expect((await check('--out', 'v2', '--shard', '3/3', '--model', join(DEMO, 'model-v2.onnx'))).code).toBe(0);
    const mixedModel = await run(['merge', 'parts/shard-1-of-3.json', 'parts/shard-2-of-3.json', 'v2/shard-3-of-3.json', '--out', 'bad']);
    expect(mixedModel.code).toBe(2);
    expect(mixedModel.err).toMatch(/^specula: v2\/shard-3-of-3\.json: model SHA-256 [0-9a-f]{12}… differs from [0-9a-f]{12}… in parts\/shard-1-of-3\.json; the parts are not from one run\n$/);
    copyFileSync(join(dir, 'parts/shard-1-of-3.json'), join(dir, 'copy.json'));
    const twice = await run(['merge', 'parts', 'copy.json', '--out', 'bad']);
    expect(twice).toEqual({ code: 2, out: '', err: 'specula: copy.json: shard 1/3 is also given as parts/shard-1-of-3.json\n' });
    const missing = await run(['merge', 'parts/shard-1-of-3.json', 'parts/shard-3-of-3.json', '--out', 'bad']);
    expect(missing).toEqual({
      code: 2,
      out: '',
      err: 'specula: missing 1 of 3 parts: shard-2-of-3.json (given: parts/shard-1-of-3.json, parts/shard-3-of-3.json)\n',
    });
    expect(existsSync(join(dir, 'bad'))).toBe(false);
  });

  it('check refuses a bad --shard, --shard without --out, and --shard with --reference (exit 2)', async () => {
    expect(await check('--shard', '4/3', '--out', 'p')).toEqual({ code: 2, out: '', err: 'specula: --shard 4/3: K must be in [1, 3], found 4\n' });
    expect(await check('--shard', '1/3')).toEqual({ code: 2, out: '', err: 'specula: --shard: name the folder for the partial result with --out\n' });
    const ref = await check('--shard', '1/3', '--out', 'p', '--reference', join(DEMO, 'reference-table.csv'));
    expect(ref.code).toBe(2);
    expect(ref.err).toMatch(/--shard: cannot be used with --reference/);
  });

  it('shows a shard example in --help', async () => {
    for (const cmd of ['check', 'prove', 'diff', 'merge']) {
      const help = await run([cmd, '--help']);
      expect(help.out).toMatch(/--shard \d\/\d|merge parts/);
    }
  });
});
