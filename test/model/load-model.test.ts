import { writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ModelError, UsageError } from '../../src/errors.js';
import { loadModel, writeMlpOnnx } from '../../src/model/index.js';
import { boxNetwork2d } from '../fixtures/box-network.js';
import { matMulGraph } from './graph-bytes.js';
import { scenarioOnDisk } from './scenario-on-disk.js';

const net = boxNetwork2d();
const INPUTS = net.inputs.map(({ name, min, max }) => ({ name, min, max }));

async function failure(promise: Promise<unknown>): Promise<{ name: string; code: string; message: string }> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof ModelError || error instanceof UsageError) return { name: error.name, code: error.code, message: error.message };
    throw error;
  }
  throw new Error('expected loadModel to fail');
}

/** Linear layer with all-zero weights: only the widths matter for these tests. */
function zeroNet(d: number, k: number): Uint8Array {
  return writeMlpOnnx([{ inSize: d, outSize: k, weights: new Array(d * k).fill(0), bias: new Array(k).fill(0), activation: 'none' }]);
}

describe('loadModel', () => {
  it('loads a model whose widths match and hashes the file bytes', async () => {
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: net.advisories, model: net.bytes });
    const model = await loadModel(scenario);
    expect({ inputs: model.inputCount, outputs: model.outputCount, path: model.path }).toEqual({ inputs: 2, outputs: 3, path: scenario.modelPath });
    expect(model.sha256).toMatch(/^[0-9a-f]{64}$/);
    await model.close();
  });

  it('gives MODEL_UNREADABLE for a missing model file, naming it', async () => {
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: net.advisories });
    expect(await failure(loadModel(scenario))).toEqual({
      name: 'ModelError',
      code: 'MODEL_UNREADABLE',
      message: `${scenario.modelPath}: cannot read the model file (no such file)`,
    });
  });

  it('gives MODEL_NOT_ONNX for a truncated model (the first half of valid bytes)', async () => {
    const half = net.bytes.subarray(0, net.bytes.length >> 1);
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: net.advisories, model: half });
    expect(await failure(loadModel(scenario))).toEqual({
      name: 'ModelError',
      code: 'MODEL_NOT_ONNX',
      message: `${scenario.modelPath}: not an ONNX model, or truncated (onnxruntime: Failed to load model because protobuf parsing failed.)`,
    });
  });

  it('gives MODEL_NOT_ONNX for a JSON file given as the model', async () => {
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: net.advisories, model: '{"name": "not a model"}\n' });
    expect(await failure(loadModel(scenario))).toMatchObject({ code: 'MODEL_NOT_ONNX' });
  });

  it('gives MODEL_EMPTY for an empty file', async () => {
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: net.advisories, model: new Uint8Array(0) });
    expect(await failure(loadModel(scenario))).toEqual({
      name: 'ModelError',
      code: 'MODEL_EMPTY',
      message: `${scenario.modelPath}: the file is empty (0 bytes); expected an ONNX model`,
    });
  });

  it('refuses a model with more inputs than the scenario lists', async () => {
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: net.advisories, model: zeroNet(7, 3) });
    expect(await failure(loadModel(scenario))).toEqual({
      name: 'ModelError',
      code: 'MODEL_WIDTH_MISMATCH',
      message: `${scenario.modelPath} takes 7 inputs, scenario lists 2`,
    });
  });

  it('refuses a model with fewer scores than the scenario has advisories', async () => {
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: ['a', 'b', 'c', 'd', 'e'], model: zeroNet(2, 4) });
    expect(await failure(loadModel(scenario))).toMatchObject({
      code: 'MODEL_WIDTH_MISMATCH',
      message: `${scenario.modelPath} gives 4 scores, scenario lists 5 advisories`,
    });
  });

  it('finds the output width by a probe row when the graph leaves it symbolic', async () => {
    const bytes = matMulGraph({ d: 2, k: 4, w: new Array(8).fill(0), b: [0, 0, 0, 0], inputShape: ['n', 2], outputShape: ['n', 'k'] });
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: ['a', 'b', 'c'], model: bytes });
    expect(await failure(loadModel(scenario))).toMatchObject({
      code: 'MODEL_WIDTH_MISMATCH',
      message: `${scenario.modelPath} gives 4 scores, scenario lists 3 advisories`,
    });
  });

  it('refuses a graph with two inputs, naming them', async () => {
    const bytes = matMulGraph({ d: 2, k: 3, w: new Array(6).fill(0), b: [0, 0, 0], inputShape: ['n', 2], outputShape: ['n', 3], twoInputs: true });
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: net.advisories, model: bytes });
    expect(await failure(loadModel(scenario))).toEqual({
      name: 'ModelError',
      code: 'MODEL_GRAPH',
      message: `${scenario.modelPath}: the graph has 2 inputs (x, extra); expected one float32 tensor [batch, 2]`,
    });
  });

  it('uses options.modelPath instead of the scenario model', async () => {
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: net.advisories });
    const other = `${scenario.modelPath}.other.onnx`;
    writeFileSync(other, net.bytes);
    const model = await loadModel(scenario, { modelPath: other });
    expect(model.path).toBe(other);
    await model.close();
  });

  it('refuses a thread count or batch size that is not a whole number >= 1', async () => {
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: net.advisories, model: net.bytes });
    expect(await failure(loadModel(scenario, { threads: 0 }))).toEqual({
      name: 'UsageError',
      code: 'USAGE',
      message: 'threads: expected a whole number >= 1, found 0',
    });
    expect(await failure(loadModel(scenario, { batchSize: 2.5 }))).toMatchObject({ code: 'USAGE' });
  });
});
