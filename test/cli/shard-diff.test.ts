import { beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { runCli } from './helpers/capture.js';

const DEMO = resolve('scenarios/survey-boat');
/** Small budgets keep the file quick; the demo's two models still differ on about 5 % of the domain. */
const DIFF = [
  'diff', join(DEMO, 'scenario.json'), '--before', join(DEMO, 'model.onnx'), '--after', join(DEMO, 'model-v2.onnx'),
  '--rules', join(DEMO, 'expectations.rules'), '--check-samples', '1000', '--prove-boxes', '500', '--jobs', '1',
  '--change-samples', '20000', '--change-budget', '20000', '--change-check-samples', '1000', '--quiet',
];

let dir = '';
const run = (args: string[]) => runCli(dir, args);
const json = (p: string) => JSON.parse(readFileSync(join(dir, p), 'utf8'));

/** diff.json without the run's date and the proofs' seconds (the only fields that may differ). */
function withoutTiming(doc: { manifest: { date?: string }; rules: Array<Record<'before' | 'after', { proof?: { seconds?: number } }>> }): unknown {
  const copy = structuredClone(doc);
  delete copy.manifest.date;
  for (const r of copy.rules) for (const side of ['before', 'after'] as const) if (r[side].proof) delete r[side].proof.seconds;
  return copy;
}

describe('specula diff --shard and merge', () => {
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'specula-shard-diff-'));
    expect((await run([...DIFF, '--out', 'single'])).code).toBe(1);
    for (const k of [1, 2, 3]) expect(await run([...DIFF, '--out', 'parts', '--shard', `${k}/3`])).toEqual({ code: 0, out: '', err: '' });
  });

  it('three shards merged give the diff.json and diff.md of one run, with its exit code', async () => {
    expect(readdirSync(join(dir, 'parts')).sort()).toEqual(['shard-1-of-3.json', 'shard-2-of-3.json', 'shard-3-of-3.json']);
    expect(await run(['merge', 'parts', '--out', 'merged', '--quiet'])).toEqual({ code: 1, out: '', err: '' });
    const single = json('single/diff.json');
    expect(withoutTiming(json('merged/diff.json'))).toEqual(withoutTiming(single));
    expect(single.changed.value).toBeGreaterThan(0); // the comparison covers the change figures
    expect(single.changeRules.length).toBeGreaterThan(0);
    const undated = (p: string) => readFileSync(join(dir, p), 'utf8').replace(/\d{4}-\d\d-\d\dT[\d:.]+Z/g, 'DATE');
    expect(undated('merged/diff.md')).toBe(undated('single/diff.md'));
  });

  it('deals the ten rules and the change item round-robin; only one part holds the change figures', () => {
    const parts = [1, 2, 3].map((k) => json(`parts/shard-${k}-of-3.json`));
    expect(parts.map((p) => p.items.map((i: { id: string }) => i.id))).toEqual([
      ['R1', 'R4', 'R7', 'R10'],
      ['R2', 'R5', 'R8', '*change'],
      ['R3', 'R6', 'R9'],
    ]);
    expect(parts.map((p) => p.diff.change !== undefined)).toEqual([false, true, false]);
    expect(parts[0].run.models).toEqual({ before: expect.stringMatching(/^[0-9a-f]{64}$/), after: expect.stringMatching(/^[0-9a-f]{64}$/) });
    expect(parts[0].run.settings.failOn).toBe('broken,degraded');
  });

  it('refuses --shard without --rules, and merge refuses a diff part among check parts (exit 2)', async () => {
    const noRules = DIFF.filter((a, i) => a !== '--rules' && DIFF[i - 1] !== '--rules');
    expect(await run([...noRules, '--shard', '1/2', '--out', 'p'])).toEqual({
      code: 2,
      out: '',
      err: 'specula: --shard: diff needs the accepted table with --rules (mining it from --before is one step that is not split)\n',
    });
    const rules = join(DEMO, 'expectations.rules');
    expect((await run(['check', join(DEMO, 'scenario.json'), rules, '--out', 'chk', '--shard', '1/3', '--no-prove', '--check-samples', '500', '--quiet'])).code).toBe(0);
    const mixed = await run(['merge', 'chk/shard-1-of-3.json', 'parts/shard-2-of-3.json', 'parts/shard-3-of-3.json', '--out', 'bad']);
    expect(mixed).toEqual({ code: 2, out: '', err: 'specula: parts/shard-2-of-3.json: command "diff" differs from "check" in chk/shard-1-of-3.json; the parts are not from one run\n' });
  });
});
