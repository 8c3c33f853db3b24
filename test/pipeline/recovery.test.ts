import { describe, expect, it } from 'vitest';
import { boxNetwork2d, boxNetwork3d, writeBoxScenario, type BoxNetwork } from '../fixtures/box-network.js';
import { loadScenario } from '../../src/scenario/index.js';
import { loadModel } from '../../src/model/index.js';
import { mine } from '../../src/pipeline/mine.js';

/**
 * Recovery: on constructed networks whose argmax regions are known axis-aligned boxes (built
 * exactly from ReLUs, written as ONNX and run by onnxruntime), the mined rules must be those
 * boxes. The reference is the construction itself (closed-form regions), not our own miner.
 */
const SETTINGS = {
  seed: 7,
  budget: 40_000,
  boundaryShare: 0.3,
  maxRules: 60,
  minLeaf: 5,
  roundTolerance: 0.001,
  checkSamples: 4_000,
  fidelitySamples: 20_000,
  confidence: 0.95,
  prove: false,
  proveBoxes: 1,
  proveSeconds: 1,
  jobs: 1,
  repair: false,
};

/**
 * Box edges may differ from the true thresholds by at most 0.5 % of the input's range: the
 * samples near a boundary are refined until their spacing is far below that, and the readable
 * rounding lands exactly on the true (readable) thresholds 4, 6, 60, 2, 15.
 */
const EDGE_TOLERANCE_SHARE = 0.005;
/**
 * Counterexamples are only allowed where a face of the rule's closed box lies on the network's
 * decision boundary: there the scores tie in exact arithmetic and float32 rounding decides. The
 * winner may then lead by at most this much (scores are up to ~100 in size; float32 relative
 * precision 6e-8 times a few accumulated terms stays far below 1e-4).
 */
const TIE_NOISE = 1e-4;

const mined = new Map<BoxNetwork, ReturnType<typeof mineOnce>>();
/** Mines each network once for both tests of its group. */
function mineBoxes(net: BoxNetwork) {
  if (!mined.has(net)) mined.set(net, mineOnce(net));
  return mined.get(net)!;
}

async function mineOnce(net: BoxNetwork) {
  const { scenarioPath } = writeBoxScenario(net);
  const scenario = loadScenario(scenarioPath);
  const model = await loadModel(scenario);
  try {
    return await mine(scenario, model, SETTINGS);
  } finally {
    await model.close();
  }
}

describe.each([
  ['2 inputs, 3 boxes', boxNetwork2d()],
  ['3 inputs, 4 boxes', boxNetwork3d()],
])('mining a network with known box regions (%s)', (_name, net) => {
  it('recovers exactly one rule per region, each box within tolerance, with full fidelity', async () => {
    const table = await mineBoxes(net);
    expect(table.rules).toHaveLength(net.regions.length);
    for (const region of net.regions) {
      const match = table.rules.find((r) => r.rule.allowed.length === 1 && r.rule.allowed[0] === region.advisory);
      expect(match, `rule for ${net.advisories[region.advisory]}`).toBeDefined();
      region.box.forEach(([lo, hi], i) => {
        const tol = EDGE_TOLERANCE_SHARE * (net.inputs[i]!.max - net.inputs[i]!.min);
        expect(Math.abs(match!.rule.box[i]![0] - lo)).toBeLessThanOrEqual(tol);
        expect(Math.abs(match!.rule.box[i]![1] - hi)).toBeLessThanOrEqual(tol);
      });
    }
    // every fresh uniform sample labelled right: exact regions, no sample lands on a face
    expect(table.fidelity!.overall.value).toBe(1);
    expect(table.fidelity!.balanced).toBe(1);
  });

  it('checks every rule: sampled, or refuted only by float32 ties on a shared face', async () => {
    const table = await mineBoxes(net);
    for (const { rule, evidence } of table.rules) {
      expect(['sampled', 'refuted']).toContain(evidence.status);
      if (evidence.status === 'sampled') {
        expect(evidence.violations).toBe(0);
        continue;
      }
      const cx = evidence.counterexample!;
      expect(cx.margin).toBeLessThan(TIE_NOISE);
      const onFace = cx.x.some((v, i) => v === rule.box[i]![0] || v === rule.box[i]![1]);
      expect(onFace, `${rule.id} counterexample ${cx.x.join(', ')} lies on a face`).toBe(true);
    }
  });
});
