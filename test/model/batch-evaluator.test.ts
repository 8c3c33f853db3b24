import { describe, expect, it } from 'vitest';
import { ModelError } from '../../src/errors.js';
import { loadModel, writeMlpOnnx } from '../../src/model/index.js';
import type { Decision, Evaluation } from '../../src/types.js';
import { boxNetwork3d, writeBoxScenario } from '../fixtures/box-network.js';
import { loadScenario } from '../../src/scenario/index.js';
import { matMulGraph } from './graph-bytes.js';
import { scenarioOnDisk } from './scenario-on-disk.js';
import { weylPoints } from './weyl-points.js';

// scores = (x1, x2, 0.5): hand-computable, and every value below is a small dyadic rational,
// exact in float32, so scores and margins compare exactly.
const LINEAR = writeMlpOnnx([{ inSize: 2, outSize: 3, weights: [1, 0, 0, 1, 0, 0], bias: [0, 0, 0.5], activation: 'none' }]);
const INPUTS = [
  { name: 'x1', min: -10, max: 10 },
  { name: 'x2', min: -10, max: 10 },
];
const ROWS = [1, 2, 3, 3, 0.25, -1];

async function evaluateLinear(decision: Decision, rows = ROWS, normalize?: { offset: number[]; scale: number[] }): Promise<Evaluation> {
  const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: ['a', 'b', 'c'], decision, model: LINEAR, ...(normalize ? { normalize } : {}) });
  const model = await loadModel(scenario);
  const result = await model.evaluate(Float64Array.from(rows), rows.length / 2);
  await model.close();
  return result;
}

async function errorOf(promise: Promise<unknown>): Promise<ModelError> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof ModelError) return error;
    throw error;
  }
  throw new Error('expected a ModelError');
}

describe('Model.evaluate', () => {
  it('returns raw scores, the argmax with ties to the lowest index, and best − second margins', async () => {
    const r = await evaluateLinear('argmax');
    expect(Array.from(r.scores)).toEqual([1, 2, 0.5, 3, 3, 0.5, 0.25, -1, 0.5]);
    expect(Array.from(r.advisory)).toEqual([1, 0, 2]);
    expect(Array.from(r.margin)).toEqual([1, 0, 0.25]);
  });

  it('returns the argmin and second − best margins for an argmin scenario', async () => {
    const r = await evaluateLinear('argmin');
    expect(Array.from(r.advisory)).toEqual([2, 2, 1]);
    expect(Array.from(r.margin)).toEqual([0.5, 2.5, 1.25]);
  });

  it('applies the normalisation (x − offset) / scale before the network, so inputs stay in units', async () => {
    // (12, -3) → ((12 − 10)/2, (−3 + 4)/0.5) = (1, 2): the network sees the first row above
    const r = await evaluateLinear('argmax', [12, -3], { offset: [10, -4], scale: [2, 0.5] });
    expect(Array.from(r.scores)).toEqual([1, 2, 0.5]);
  });

  it('gives the same results in batches of 7 as in one call, including a partial last batch', async () => {
    const { scenarioPath } = writeBoxScenario(boxNetwork3d());
    const scenario = loadScenario(scenarioPath);
    const n = 1000; // 142 full batches of 7 and one of 6
    const x = weylPoints(scenario.inputs.map((i) => [i.min, i.max] as const), n);
    const whole = await loadModel(scenario);
    const small = await loadModel(scenario, { batchSize: 7 });
    const a = await whole.evaluate(x, n);
    const b = await small.evaluate(x, n);
    await whole.close();
    await small.close();
    expect(b.scores).toEqual(a.scores);
    expect(b.advisory).toEqual(a.advisory);
    expect(b.margin).toEqual(a.margin);
  });

  it('labels a range of rows in place with the decisions and margins evaluate gives, across batches', async () => {
    const { scenarioPath } = writeBoxScenario(boxNetwork3d());
    const scenario = loadScenario(scenarioPath);
    const n = 1000;
    const x = weylPoints(scenario.inputs.map((i) => [i.min, i.max] as const), n);
    const model = await loadModel(scenario, { batchSize: 7 });
    const whole = await model.evaluate(x, n);
    const advisory = new Int32Array(n).fill(-1);
    const margin = new Float32Array(n).fill(-1);
    // rows [100, 900): 114 full batches of 7 and one of 2, counted from row 100
    await model.labelInPlace(x, 100, 800, advisory, margin);
    await model.close();
    expect(Array.from(advisory.subarray(100, 900))).toEqual(Array.from(whole.advisory.subarray(100, 900)));
    expect(Array.from(margin.subarray(100, 900))).toEqual(Array.from(whole.margin.subarray(100, 900)));
    // rows outside the range are left as they were
    expect(advisory[99]).toBe(-1);
    expect(margin[900]).toBe(-1);
    await expect(model.labelInPlace(x, 990, 20, advisory, margin)).rejects.toThrow('labelInPlace: expected rows [990, 1010)');
  });

  it('returns results that later calls do not overwrite', async () => {
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: ['a', 'b', 'c'], model: LINEAR });
    const model = await loadModel(scenario);
    const first = await model.evaluate(Float64Array.from([1, 2]), 1);
    await model.evaluate(Float64Array.from([5, 6]), 1);
    await model.close();
    expect(Array.from(first.scores)).toEqual([1, 2, 0.5]);
  });

it('keeps concurrent calls apart although they share one input buffer', async () => {
    const { scenarioPath } = writeBoxScenario(boxNetwork3d());
    const scenario = loadScenario(scenarioPath);
    const model = await loadModel(scenario, { batchSize: 4 });
    const box = scenario.inputs.map((i) => [i.min, i.max] as const);
    const x1 = weylPoints(box, 50);
    const x2 = weylPoints(box, 90).subarray(50 * 3);
    const [c1, c2] = await Promise.all([model.evaluate(x1, 50), model.evaluate(x2, 40)]);
    const s1 = await model.evaluate(x1, 50);
    const s2 = await model.evaluate(x2, 40);
    await model.close();
    expect(c1.scores).toEqual(s1.scores);
    expect(c2.scores).toEqual(s2.scores);
  });

  it('returns empty arrays for 0 rows and does not change its input', async () => {
    const r = await evaluateLinear('argmax', []);
    expect([r.scores.length, r.advisory.length, r.margin.length]).toEqual([0, 0, 0]);
    const rows = Float64Array.from(ROWS);
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: ['a', 'b', 'c'], model: LINEAR, normalize: { offset: [1, 1], scale: [2, 2] } });
    const model = await loadModel(scenario);
    await model.evaluate(rows, 3);
    await model.close();
    expect(Array.from(rows)).toEqual(ROWS);
  });

  it('refuses NaN scores, naming the first row and its inputs in units (NaN weights)', async () => {
    const nanNet = writeMlpOnnx([{ inSize: 2, outSize: 3, weights: new Array(6).fill(NaN), bias: [0, 0, 0], activation: 'none' }]);
    const scenario = scenarioOnDisk({ inputs: INPUTS.map((i) => ({ ...i, unit: 'm' })), advisories: ['a', 'b', 'c'], model: nanNet });
    const model = await loadModel(scenario);
    const error = await errorOf(model.evaluate(Float64Array.from([0.5, -2]), 1));
    await model.close();
    expect(error.code).toBe('MODEL_NONFINITE_SCORE');
    expect(error.message).toBe(`${scenario.modelPath}: score NaN for "a" at input row 0 (x1 = 0.5 m, x2 = -2 m)`);
  });

  it('names the first row with an infinite score even when it is in a later batch', async () => {
    // s0 = 3e38 · relu(x − 5) overflows float32 (max ≈ 3.4e38) from x = 6.14 on; s1 = 0
    const overflow = writeMlpOnnx([
      { inSize: 1, outSize: 1, weights: [1], bias: [-5], activation: 'relu' },
      { inSize: 1, outSize: 2, weights: [3e38, 0], bias: [0, 0], activation: 'none' },
    ]);
    const scenario = scenarioOnDisk({ inputs: [{ name: 'x', min: 0, max: 10, unit: 'm' }], advisories: ['a', 'b'], model: overflow });
    const model = await loadModel(scenario, { batchSize: 2 });
    const error = await errorOf(model.evaluate(Float64Array.from([0, 6, 7, 8]), 4));
    await model.close();
    expect(error.message).toBe(`${scenario.modelPath}: score Infinity for "a" at input row 2 (x = 7 m)`);
  });

  it('runs a graph with a fixed batch of 1 and a [batch, 1, d] input, row by row', async () => {
    // y = x·W + b with W = [[1, 0, 0], [0, 1, 0]], b = (0, 0, 0.5): the same scores as LINEAR
    const bytes = matMulGraph({ d: 2, k: 3, w: [1, 0, 0, 0, 1, 0], b: [0, 0, 0.5], inputShape: [1, 1, 2], outputShape: [1, 1, 3] });
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: ['a', 'b', 'c'], model: bytes });
    const model = await loadModel(scenario);
    const r = await model.evaluate(Float64Array.from(ROWS), 3);
    await model.close();
    expect(Array.from(r.scores)).toEqual([1, 2, 0.5, 3, 3, 0.5, 0.25, -1, 0.5]);
    expect(Array.from(r.advisory)).toEqual([1, 0, 2]);
  });

  it('refuses to evaluate after close', async () => {
    const scenario = scenarioOnDisk({ inputs: INPUTS, advisories: ['a', 'b', 'c'], model: LINEAR });
    const model = await loadModel(scenario);
    await model.close();
    expect((await errorOf(model.evaluate(Float64Array.from([0, 0]), 1))).code).toBe('MODEL_CLOSED');
  });
});
