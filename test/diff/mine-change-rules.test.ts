import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { mineChangeRules, type MineChangeOptions } from '../../src/diff/index.js';
import { formatRule } from '../../src/rules/index.js';
import { loadModel } from '../../src/model/index.js';
import { loadScenario } from '../../src/scenario/index.js';
import { writeThresholdPair } from './threshold-network.js';

const OPTIONS: MineChangeOptions = { seed: 1, budget: 10_000, maxRules: 10, minLeaf: 5, roundTolerance: 0.001, boundaryShare: 0.3 };

/**
 * Before (4, 6), after (5, 7): the changed region is x1 in [4, 5] (10 % of the domain) plus
 * x1 >= 5 with x2 in [6, 7] (5 %). Carving out the 5 % piece takes two more leaves, so it is worth
 * α = 5 % / 2 = 2.5 % of the domain per leaf; the 10 % piece, against the root, 5 % per leaf
 * (α = (R(root) − R(subtree)) / (leaves − 1), Breiman et al. 1984, §3.3).
 */
async function changeRules(minShare: number): Promise<string[]> {
  const { dir, scenarioPath } = writeThresholdPair([4, 6], [5, 7]);
  const scenario = loadScenario(scenarioPath);
  const before = await loadModel(scenario, { modelPath: join(dir, 'a.onnx') });
  const after = await loadModel(scenario, { modelPath: join(dir, 'b.onnx') });
  try {
    const rules = await mineChangeRules(scenario.inputs, before.evaluate, after.evaluate, { ...OPTIONS, minShare });
    return rules.map((r) => formatRule(r, scenario.inputs, ['same', 'changed']));
  } finally {
    await before.close();
    await after.close();
  }
}

describe('mineChangeRules', () => {
  it('finds both pieces of the changed region, with readable thresholds, when splits may explain little', async () => {
    expect(await changeRules(0.0001)).toEqual(['C1: when x1 in [4, 5] expect changed', 'C2: when x1 >= 5 and x2 in [6, 7] expect changed']);
  });

  it('drops the piece worth less than minShare per leaf and keeps the larger one', async () => {
    expect(await changeRules(0.03)).toEqual(['C1: when x1 in [4, 5] expect changed']);
  });

  it('gives no rules when no split is worth minShare', async () => {
    expect(await changeRules(0.06)).toEqual([]);
  });
});
