import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import type { CliIo } from '../../src/cli/io.js';
import { writeMlpOnnx } from '../../src/model/index.js';
import { fixtureModelBytes, writeFixtureRun } from '../browser/report-fixture.js';

function capture(cwd: string): { io: CliIo; out: () => string; err: () => string } {
  let out = '';
  let err = '';
  return { io: { stdout: (t) => (out += t), stderr: (t) => (err += t), isTTY: false, cwd }, out: () => out, err: () => err };
}

describe('specula report', () => {
  it('writes report.html into the run folder from the run\'s own model', async () => {
    const run = writeFixtureRun();
    const c = capture(run.dir);
    expect(await main(['report', run.dir, '--grid', '12'], c.io)).toBe(0);
    expect(c.err()).toBe('');
    expect(c.out()).toMatch(/^wrote report\.html \(\d+ KiB\)\n$/);
    const html = readFileSync(join(run.dir, 'report.html'), 'utf8');
    // 3 pairs, one with 2 distinct planes: 8 figures; the scenario's title heads the page
    expect(html.match(/<figure class="slice"/g)).toHaveLength(8);
    expect(html).toContain('<h1>Rules of Fixture: three-input avoidance</h1>');
  });

  it('draws only the pairs named with --pair', async () => {
    const run = writeFixtureRun();
    const c = capture(run.dir);
    const out = join(run.dir, 'chosen.html');
    expect(await main(['report', run.dir, '--grid', '8', '--pair', 'lateral_m,range_m', '--out', out], c.io)).toBe(0);
    const html = readFileSync(out, 'utf8');
    expect([...html.matchAll(/<option value="(\d+)">([^<]+)<\/option>/g)].filter((m) => m[2]!.includes('×')).map((m) => m[2])).toEqual(['range_m × lateral_m']);
    expect(html.match(/<figure class="slice"/g)).toHaveLength(2);
  });

  it('refuses with exit code 2 when the model file is not the one the rules came from', async () => {
    const run = writeFixtureRun();
    const other = writeMlpOnnx([{ inSize: 3, outSize: 3, weights: [1, 0, 0, 0, 1, 0, 0, 0, 1], bias: [0, 0, 0], activation: 'none' }]);
    writeFileSync(run.modelPath, other);
    const c = capture(run.dir);
    expect(await main(['report', run.dir], c.io)).toBe(2);
    expect(c.err()).toContain(`specula: ${run.modelPath}: SHA-256 `);
    expect(c.err()).toContain(`differs from the run's ${run.table.manifest.model.sha256}`);
    expect(existsSync(join(run.dir, 'report.html'))).toBe(false);
  });

  it('accepts the same model bytes at another path with --model', async () => {
    const run = writeFixtureRun();
    const moved = join(run.dir, 'moved.onnx');
    writeFileSync(moved, fixtureModelBytes());
    writeFileSync(run.modelPath, new Uint8Array([1, 2, 3]));
    const c = capture(run.dir);
    expect(await main(['report', run.dir, '--grid', '4', '--model', 'moved.onnx', '--quiet'], c.io)).toBe(0);
    expect(c.out()).toBe('');
  });

  it('refuses a changed scenario file and an unknown --pair name with exit code 2', async () => {
    const run = writeFixtureRun();
    const c1 = capture(run.dir);
    expect(await main(['report', run.dir, '--pair', 'range_m,altitude_m'], c1.io)).toBe(2);
    expect(c1.err()).toContain('--pair range_m,altitude_m: expected two different input names as NAME,NAME, from range_m, lateral_m, climb_mps');
    writeFileSync(run.scenarioPath, readFileSync(run.scenarioPath, 'utf8').replace('Fixture', 'Changed'));
    const c2 = capture(run.dir);
    expect(await main(['report', run.dir], c2.io)).toBe(2);
    expect(c2.err()).toContain(`${run.scenarioPath}: SHA-256 `);
  });

  it('names the missing rules.json of a folder that is not a run', async () => {
    const run = writeFixtureRun();
    const c = capture(run.dir);
    expect(await main(['report', join(run.dir, 'nowhere')], c.io)).toBe(2);
    expect(c.err()).toBe(`specula: ${join(run.dir, 'nowhere', 'rules.json')}: cannot read the run's rule table (no such file)\n`);
  });
});
