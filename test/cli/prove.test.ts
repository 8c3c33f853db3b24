import { describe, expect, it } from 'vitest';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import * as ort from 'onnxruntime-node';
import { main } from '../../src/cli/main.js';
import { boxNetwork2d, writeBoxScenario } from '../fixtures/box-network.js';
import { capture } from './helpers/capture.js';

const SMALL = ['--samples', '20000', '--check-samples', '2000', '--fidelity-samples', '10000', '--no-report'];

describe('specula prove', () => {
  it('proves rules lying strictly inside the known regions and refutes one crossing a boundary', async () => {
    const net = boxNetwork2d();
    const { dir } = writeBoxScenario(net);
    expect(await main(['mine', 'scenario.json', '--out', 'run', '--no-prove', ...SMALL], capture(dir))).toBe(0);
    // Replace the mined rules by hand-made ones whose truth is known from the construction:
    // A holds where x1 < 4; B where x1 >= 4 and x2 < 6; C where x1 >= 4 and x2 >= 6.
    const path = join(dir, 'run', 'rules.json');
    const doc = JSON.parse(readFileSync(path, 'utf8'));
    const template = doc.rules[0];
    const rule = (id: string, allowed: string, x1: [number, number], x2: [number, number]) => ({
      ...template,
      id,
      text: '',
      allowed: [allowed],
      box: { x1, x2 },
      origin: { kind: 'mined' },
      evidence: { ...template.evidence, status: 'sampled', violations: 0, counterexample: undefined },
    });
    doc.rules = [
      rule('R1', 'A', [0, 3.9], [0, 10]),
      rule('R2', 'B', [4.1, 10], [0, 5.9]),
      rule('R3', 'C', [4.1, 10], [6.1, 10]),
      rule('R4', 'B', [3, 10], [0, 5.9]), // crosses into A's region
    ];
    writeFileSync(path, JSON.stringify(doc));
    const io = capture(dir);
    const code = await main(['prove', 'run', '--json', '--verbose'], io);
    expect(io.err()).toBe('');
    expect(code).toBe(0);
    const out = JSON.parse(io.out());
    const status = Object.fromEntries(out.rules.map((r: { id: string; evidence: { status: string } }) => [r.id, r.evidence.status]));
    expect(status).toEqual({ R1: 'proven', R2: 'proven', R3: 'proven', R4: 'refuted' });
    // The counterexample must be confirmed by onnxruntime itself, run here independently.
    const cx = out.rules[3].evidence.counterexample;
    expect(cx.x[0]).toBeGreaterThanOrEqual(3);
    const session = await ort.InferenceSession.create(net.bytes);
    const res = await session.run({ input: new ort.Tensor('float32', Float32Array.from(cx.x), [1, 2]) });
    const scores = Array.from(res['scores']!.data as Float32Array);
    expect(scores.indexOf(Math.max(...scores))).toBe(0); // advisory A wins there
    await session.release();
    expect(readFileSync(join(dir, 'run', 'rules.md'), 'utf8')).toContain('| proven |');
  });

  it('with --repair, splits a rule crossing a boundary into proven sub-rules inside the true region', async () => {
    const { dir } = writeBoxScenario(boxNetwork2d());
    expect(await main(['mine', 'scenario.json', '--out', 'run', '--no-prove', ...SMALL], capture(dir))).toBe(0);
    const path = join(dir, 'run', 'rules.json');
    const doc = JSON.parse(readFileSync(path, 'utf8'));
    doc.rules = [{ ...doc.rules[0], id: 'R1', allowed: ['B'], box: { x1: [3, 10], x2: [0, 5.9] }, origin: { kind: 'mined' } }];
    writeFileSync(path, JSON.stringify(doc));
    const io = capture(dir);
    expect(await main(['prove', 'run', '--repair', '--jobs', '1', '--json'], io)).toBe(0);
    const out = JSON.parse(io.out());
    expect(out.rules[0].evidence.status).toBe('refuted');
    const subs = out.rules.slice(1);
    expect(subs.length).toBeGreaterThan(0);
    for (const sub of subs) {
      expect(sub.origin).toEqual({ kind: 'repaired', from: 'R1' });
      expect(sub.evidence.status).toBe('proven');
      // B holds where x1 >= 4 (construction): every proven sub-box must lie there
      expect(sub.box.x1[0]).toBeGreaterThanOrEqual(4);
    }
    expect(out.coverage.total).toBeGreaterThan(0);
    const atlas = JSON.parse(readFileSync(join(dir, 'run', 'atlas.json'), 'utf8'));
    expect(atlas.boxes.map((b: { rule: string }) => b.rule)).toEqual(subs.map((r: { id: string }) => r.id));
  });

  it('refuses a run whose model file changed, with exit 2', async () => {
    const { dir } = writeBoxScenario(boxNetwork2d());
    expect(await main(['mine', 'scenario.json', '--out', 'run', '--no-prove', ...SMALL], capture(dir))).toBe(0);
    writeFileSync(join(dir, 'model.onnx'), boxNetwork2d({ negate: true }).bytes);
    const io = capture(dir);
    expect(await main(['prove', 'run'], io)).toBe(2);
    expect(io.err()).toMatch(/model\.onnx/);
  });
});
