import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadModel } from '../../src/model/index.js';
import { loadScenario } from '../../src/scenario/index.js';
import { thresholdLabel, writeThresholdPair } from './threshold-network.js';

describe('thresholdNetwork (test fixture)', () => {
  it('gives the advisory of its regions at every cell centre of a 50 × 50 grid (odd tenths; thresholds on even tenths) by onnxruntime', async () => {
    const { dir, scenarioPath } = writeThresholdPair([4, 6], [5.4, 2.6]);
    const scenario = loadScenario(scenarioPath);
    for (const [file, t] of [['a.onnx', [4, 6]], ['b.onnx', [5.4, 2.6]]] as const) {
      const model = await loadModel(scenario, { modelPath: join(dir, file) });
      const m = 50;
      const x = new Float64Array(m * m * 2);
      for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) x.set([(i + 0.5) / 5, (j + 0.5) / 5], 2 * (i * m + j));
      const ev = await model.evaluate(x, m * m);
      let wrong = 0;
      for (let p = 0; p < m * m; p++) if (ev.advisory[p] !== thresholdLabel(x[2 * p]!, x[2 * p + 1]!, t[0], t[1])) wrong++;
      expect(wrong).toBe(0);
      await model.close();
    }
  });

  it('ties its neighbours exactly on a shared face, so closed boxes ending there hold', async () => {
    const { scenarioPath } = writeThresholdPair([4, 6], [4, 6]);
    const model = await loadModel(loadScenario(scenarioPath));
    // on x2 = 6 with x1 > 4, B and C both score min(p, 0) = 0 computed from the same values
    const ev = await model.evaluate(Float64Array.from([7.3, 6, 9.1, 6, 4, 2.2]), 3);
    expect(ev.scores[1]).toBe(ev.scores[2]);
    expect(ev.scores[4]).toBe(ev.scores[5]);
    // on x1 = 4 with x2 < 6, A and B both score 0
    expect(ev.scores[6]).toBe(0);
    expect(ev.scores[7]).toBe(0);
    await model.close();
  });
});
