import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { compareReference, readReferenceTable, referenceScope, referenceSummaryText } from '../../src/reference/index.js';
import { loadModel } from '../../src/model/index.js';
import { loadScenario } from '../../src/scenario/index.js';
import { writeThresholdPair } from '../diff/threshold-network.js';
import { gridTableCsv, writeTemp } from './grid-table.js';

/**
 * The table is made from the regions with thresholds (4, 6); the network (b.onnx) has (5, 7).
 * On the grid of cell centres 0.5 … 9.5 the disagreements are known by counting:
 * x1 = 4.5 (4 <= x1 < 5): table B for x2 < 6 (6 points) or C (4 points), network A;
 * x1 in 5.5 … 9.5 with x2 = 6.5 (6 <= x2 < 7): table C, network B (5 points). 15 of 100.
 */
async function compared() {
  const { dir, scenarioPath } = writeThresholdPair([4, 6], [5, 7]);
  const scenario = loadScenario(scenarioPath);
  const model = await loadModel(scenario, { modelPath: join(dir, 'b.onnx') });
  try {
    const grid = readReferenceTable(writeTemp('table.csv', gridTableCsv(4, 6)), scenario);
    return { scenario, result: await compareReference(grid, model.evaluate, 3) };
  } finally {
    await model.close();
  }
}

describe('compareReference', () => {
  it('counts agreement overall and per table advisory at the grid points (onnxruntime)', async () => {
    const { result } = await compared();
    expect([result.points, result.agree]).toEqual([100, 85]);
    expect(result.perAdvisory).toEqual([
      { advisory: 0, points: 40, agree: 40 },
      { advisory: 1, points: 36, agree: 30 },
      { advisory: 2, points: 24, agree: 15 },
    ]);
    expect(result.confusion).toEqual([
      [40, 0, 0],
      [6, 30, 0],
      [4, 5, 15],
    ]);
  });

  it('groups the disagreeing grid points into the three known boxes, most points first', async () => {
    const { result } = await compared();
    expect(result.disagreements.map((g) => [g.rule.id, g.table, g.rule.allowed, g.rule.box, g.points])).toEqual([
      ['D1', 1, [0], [[4.5, 4.5], [0.5, 5.5]], 6],
      ['D2', 2, [1], [[5.5, 9.5], [6.5, 6.5]], 5],
      ['D3', 2, [0], [[4.5, 4.5], [6.5, 9.5]], 4],
    ]);
  });

  it('prints what is and is not checked between grid points', async () => {
    const { scenario, result } = await compared();
    const text = referenceSummaryText(result, scenario.inputs, scenario.advisories);
    expect(text).toContain('agreement at the grid points: 85.00 % (85 of 100)');
    expect(text).toContain('D1: when x1 in [4.5, 4.5] and x2 in [0.5, 5.5] expect A  [table: B; 6 grid points]');
    for (const line of [...referenceScope(100).checked, ...referenceScope(100).notChecked]) expect(text).toContain(line);
    expect(text).toMatch(/not checked:\n {2}- any input between grid points/);
  });
});
