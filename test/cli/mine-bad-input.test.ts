import { beforeEach, describe, expect, it } from 'vitest';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { main } from '../../src/cli/main.js';
import { writeMlpOnnx } from '../../src/model/onnx-write.js';
import { boxNetwork2d, writeBoxScenario } from '../fixtures/box-network.js';
import { capture } from './helpers/capture.js';

/**
 * Every kind of bad input ends with exit code 2, one line on stderr naming the file (and the
 * field where there is one), no stack trace, and the earlier run folder left byte for byte.
 */
const SMALL = ['--samples', '5000', '--check-samples', '500', '--fidelity-samples', '2000'];
let dir = '';
let before = '';

beforeEach(async () => {
  dir = writeBoxScenario(boxNetwork2d()).dir;
  expect(await main(['mine', 'scenario.json', '--out', 'run', ...SMALL], capture(dir))).toBe(0);
  before = readFileSync(join(dir, 'run', 'rules.json'), 'utf8');
});

async function expectRefused(args: string[], pattern: RegExp): Promise<void> {
  const io = capture(dir);
  expect(await main([...args, '--out', 'run', ...SMALL], io)).toBe(2);
  const lines = io.err().trimEnd().split('\n');
  expect(lines).toHaveLength(1);
  expect(lines[0]).toMatch(pattern);
  expect(readFileSync(join(dir, 'run', 'rules.json'), 'utf8')).toBe(before);
}

function editScenario(edit: (s: Record<string, any>) => void): string {
  const s = JSON.parse(readFileSync(join(dir, 'scenario.json'), 'utf8'));
  edit(s);
  writeFileSync(join(dir, 'edited.json'), JSON.stringify(s, null, 2));
  return 'edited.json';
}

describe('specula mine refuses bad input', () => {
  it('a missing model file', async () => {
    await expectRefused(['mine', 'scenario.json', '--model', 'missing.onnx'], /missing\.onnx/);
  });

  it('a truncated model file', async () => {
    const bytes = readFileSync(join(dir, 'model.onnx'));
    writeFileSync(join(dir, 'half.onnx'), bytes.subarray(0, bytes.length >> 1));
    await expectRefused(['mine', 'scenario.json', '--model', 'half.onnx'], /half\.onnx.*(not an ONNX model|truncated)/);
  });

  it('a file that is not ONNX', async () => {
    await expectRefused(['mine', 'scenario.json', '--model', 'scenario.json'], /scenario\.json.*not an ONNX model/);
  });

  it('a scenario with min >= max', async () => {
    const f = editScenario((s) => (s.inputs[1].min = s.inputs[1].max));
    await expectRefused(['mine', f], /edited\.json.*inputs\[1\].*min 10.*max 10/);
  });

  it('a scenario with non-finite bounds', async () => {
    writeFileSync(join(dir, 'inf.json'), readFileSync(join(dir, 'scenario.json'), 'utf8').replace('"max": 10', '"max": 1e999'));
    await expectRefused(['mine', 'inf.json'], /inf\.json.*inputs\[0\]\.max/);
  });

  it('duplicate input names', async () => {
    const f = editScenario((s) => (s.inputs[1].name = s.inputs[0].name));
    await expectRefused(['mine', f], /edited\.json.*inputs\[1\]\.name.*duplicate.*x1/);
  });

  it('an advisory count that does not match the model outputs', async () => {
    const f = editScenario((s) => s.advisories.push('D'));
    await expectRefused(['mine', f], /model\.onnx.*3 scores.*4 advisories/);
  });

  it('an input count that does not match the model', async () => {
    const f = editScenario((s) => s.inputs.push({ name: 'x3', unit: '', min: 0, max: 1, description: '' }));
    await expectRefused(['mine', f], /model\.onnx.*takes 2 inputs.*lists 3/);
  });

  it('a model whose scores are NaN', async () => {
    const nan = writeMlpOnnx([{ inSize: 2, outSize: 3, weights: [NaN, 0, 0, 1, 1, 0], bias: [0, 0, 0], activation: 'none' }]);
    writeFileSync(join(dir, 'nan.onnx'), nan);
    await expectRefused(['mine', 'scenario.json', '--model', 'nan.onnx'], /nan\.onnx.*(NaN|non-finite)/i);
  });
});
