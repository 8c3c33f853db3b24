import { describe, expect, it } from 'vitest';
import { boxNetwork3d, writeBoxScenario } from '../fixtures/box-network.js';
import { loadScenario } from '../../src/scenario/index.js';
import { loadModel } from '../../src/model/index.js';
import { sampleDomain } from '../../src/sampling/index.js';
import { ModelError } from '../../src/errors.js';
import { modelJobs } from '../../src/pipeline/model-jobs.js';
import type { Rule } from '../../src/types.js';

/**
 * modelJobs on two worker threads against the same work in this thread, on a constructed
 * network run by onnxruntime: every figure must be the same bit for bit (the single-thread
 * functions are the reference; the workers run them on pieces cut independently of the
 * number of threads).
 */
async function setUp() {
  const { scenarioPath } = writeBoxScenario(boxNetwork3d());
  const scenario = loadScenario(scenarioPath);
  const model = await loadModel(scenario, { batchSize: 1000 });
  const box = scenario.inputs.map((i) => [i.min, i.max] as [number, number]);
  const half = box.map(([lo, hi], j) => (j === 0 ? ([lo, (lo + hi) / 2] as [number, number]) : [lo, hi] as [number, number]));
  const rules: Rule[] = [0, 1, 2].map((a) => ({ id: `R${a + 1}`, box: a === 0 ? half : box, allowed: [a], origin: { kind: 'mined' } }) as Rule);
  return { scenario, model, rules };
}

describe('modelJobs', () => {
  it('labels samples, checks rules and measures fidelity on two workers exactly as in one thread', async () => {
    const { scenario, model, rules } = await setUp();
    const one = modelJobs(scenario, model, 1);
    const two = modelJobs(scenario, model, 2);
    try {
      // both workers up first: every piece below then runs on a worker, none in this thread
      await two.ready();
      // 7,300 samples in batches of 500 (model batch 1,000): many batches in flight at once
      const opts = { seed: 3, budget: 7_300, batchSize: 500 };
      const a = await sampleDomain(scenario.inputs, one.labeller, opts);
      const b = await sampleDomain(scenario.inputs, two.labeller, opts);
      expect(b.x.buffer).toBeInstanceOf(SharedArrayBuffer);
      expect(Array.from(b.x)).toEqual(Array.from(a.x));
      expect(Array.from(b.advisory)).toEqual(Array.from(a.advisory));
      expect(Array.from(b.margin)).toEqual(Array.from(a.margin));
      expect(new Set(a.advisory).size).toBe(4); // the 3-D box network has four regions
      const check = { seed: 4, samplesPerRule: 2_500, confidence: 0.95, decision: scenario.decision };
      const done: number[] = [];
      const c1 = await one.checkRules(rules, check);
      const c2 = await two.checkRules(rules, { ...check, onProgress: (d) => done.push(d) });
      expect(c2).toEqual(c1);
      expect(done).toEqual([1, 2, 3]);
      expect(c1.some((c) => c.evidence.violations > 0)).toBe(true);
      const fid = { seed: 5, samples: 40_000, confidence: 0.95, advisories: 4 };
      const f1 = await one.measureFidelity(rules, fid);
      expect(await two.measureFidelity(rules, fid)).toEqual(f1);
      expect(f1.samples).toBe(40_000);
    } finally {
      await two.close();
      await one.close();
      await model.close();
    }
  });

  it('stops with the worker\'s ModelError when the model file is not the one the main thread loaded', async () => {
    const { scenario, model, rules } = await setUp();
    const jobs = modelJobs(scenario, { ...model, sha256: '0'.repeat(64) }, 2);
    try {
      const failure = await jobs.checkRules(rules, { seed: 1, samplesPerRule: 100, confidence: 0.95, decision: scenario.decision }).catch((e: unknown) => e);
      expect(failure).toBeInstanceOf(ModelError);
      expect((failure as ModelError).code).toBe('MODEL_CHANGED');
      expect((failure as ModelError).message).toContain('the file changed while the run was going');
    } finally {
      await jobs.close();
      await model.close();
    }
  });
});
