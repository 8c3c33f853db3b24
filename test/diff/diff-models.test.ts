import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { diffModels, readRuleSource, type DiffSettings } from '../../src/diff/index.js';
import { clopperPearsonInterval } from '../../src/check/index.js';
import { loadModel } from '../../src/model/index.js';
import { loadScenario } from '../../src/scenario/index.js';
import { tableLabel } from '../../src/rules/index.js';
import { writeFileSync } from 'node:fs';
import { thresholdLabel, writeThresholdPair } from './threshold-network.js';

/** Mining settings for the accepted table, without repair (sub-rules are not compared by diff). */
const MINE = {
  seed: 1, budget: 10_000, maxRules: 10, minLeaf: 5, roundTolerance: 0.001, boundaryShare: 0.3, checkSamples: 1000,
  fidelitySamples: 2000, confidence: 0.95, prove: true, proveBoxes: 2000, proveSeconds: 30, jobs: 1, repair: false,
};

/** Small budgets: a few thousand samples keep the file fast; the networks are exact. */
const SETTINGS: DiffSettings = {
  seed: 1,
  checkSamples: 1000,
  confidence: 0.95,
  prove: true,
  proveBoxes: 2000,
  proveSeconds: 30,
  jobs: 1,
  mine: MINE,
  changeSamples: 4000,
  changeBudget: 10_000,
  maxChangeRules: 10,
  minLeaf: 5,
  roundTolerance: 0.001,
  changeCheckSamples: 1000,
  changeMinShare: 0.001,
};

// Before: thresholds (4, 6); after: (5, 7). Closed form of the changed region, in [0, 10]²:
// x1 in [4, 5) changes (B or C → A), area 1 × 10; x1 >= 5 with x2 in [6, 7) changes (C → B),
// area 5 × 1. Changed share = 15 / 100.
const BEFORE = [4, 6] as const;
const AFTER = [5, 7] as const;
const TRUE_CHANGED = (1 * 10 + 5 * 1) / 100;
/** Closed-form share of each before → after pair (rows before, columns after; A, B, C). */
const TRUE_CONFUSION = [
  [0.4, 0, 0], // A stays A where x1 < 4
  [0.06, 0.3, 0], // B (x1 >= 4, x2 < 6): → A for x1 < 5 (1 × 6), stays B for x1 >= 5 (5 × 6)
  [0.04, 0.05, 0.15], // C (x1 >= 4, x2 >= 6): → A for x1 < 5 (1 × 4), → B for x2 < 7 (5 × 1), else C (5 × 3)
];

async function runDiff(rules?: string, settings: DiffSettings = SETTINGS) {
  const { dir, scenarioPath } = writeThresholdPair(BEFORE, AFTER);
  const scenario = loadScenario(scenarioPath);
  const before = await loadModel(scenario, { modelPath: join(dir, 'a.onnx') });
  const after = await loadModel(scenario, { modelPath: join(dir, 'b.onnx') });
  try {
    let source;
    if (rules !== undefined) {
      writeFileSync(join(dir, 'accepted.rules'), rules);
      source = readRuleSource(join(dir, 'accepted.rules'), scenario);
    }
    return await diffModels(scenario, before, after, source, settings);
  } finally {
    await before.close();
    await after.close();
  }
}

/** One diff with the table mined from the before model, shared by the tests that only read it. */
let minedDiff: ReturnType<typeof runDiff> | undefined;
const mined = (): ReturnType<typeof runDiff> => (minedDiff ??= runDiff());

describe('diffModels', () => {
  it('states a changed share whose exact interval covers the closed-form changed volume', async () => {
    const result = await mined();
    expect(result.changed.n).toBe(4000);
    expect(result.changed.lower).toBeLessThanOrEqual(TRUE_CHANGED);
    expect(result.changed.upper).toBeGreaterThanOrEqual(TRUE_CHANGED);
    // Each confusion cell is binomial with its closed-form share as rate; its exact two-sided
    // 99.9 % interval (Clopper & Pearson 1934, checked against published values in
    // test/check/clopper-pearson.test.ts) must cover that share. 99.9 % per cell keeps the chance
    // of any of the nine missing by luck below 1 %.
    const n = result.changed.n;
    result.confusion.forEach((row, a) =>
      row.forEach((c, b) => {
        const { lower, upper } = clopperPearsonInterval(c, n, 0.999);
        expect([a, b, lower <= TRUE_CONFUSION[a]![b]! && TRUE_CONFUSION[a]![b]! <= upper]).toEqual([a, b, true]);
      }),
    );
  });

  it('describes the changed region by change rules that recover it to within 0.5 % of the domain', async () => {
    const result = await mined();
    // Area of (union of change boxes) Δ (true changed region), by the midpoint rule on a
    // 1000 × 1000 grid. The true region's edges (4, 5, 6, 7) lie on cell edges, so the rule
    // itself adds no error when the boxes are exact; the tolerance, 0.5 % of the domain, is a
    // threshold off by 0.05 along a whole 10-long edge: the learner places thresholds between
    // samples and rounds them to readable values (project's choice of bound, no source).
    const RECOVERY_TOLERANCE = 0.005;
    const m = 1000;
    const x = new Float64Array(m * m * 2);
    for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) x.set([(i + 0.5) / 100, (j + 0.5) / 100], 2 * (i * m + j));
    const inside = tableLabel(result.changeRules.map((c) => c.rule), x, m * m, 2);
    let wrong = 0;
    for (let p = 0; p < m * m; p++) {
      const x1 = x[2 * p]!;
      const x2 = x[2 * p + 1]!;
      const changed = thresholdLabel(x1, x2, ...BEFORE) !== thresholdLabel(x1, x2, ...AFTER);
      if (changed !== (inside[p] !== -1)) wrong++;
    }
    expect(wrong / (m * m)).toBeLessThanOrEqual(RECOVERY_TOLERANCE);
    expect(result.changeRules.length).toBeGreaterThan(0);
    // Each change rule was checked on its own dense samples. With boxes within the recovery
    // tolerance of the truth, at most RECOVERY_TOLERANCE / 15 % ≈ 3 % of the changed region (and
    // of the rules' volume) can be missed or wrongly included, so recall and precision on the
    // uniform sample must be above 96 %, less sampling noise (4,000 samples, ~600 changed: a few
    // tenths of a percent); 0.95 leaves room for that noise.
    const CAPTURE_MIN = 0.95;
    for (const c of result.changeRules) expect(c.changed.n).toBe(1000);
    expect(result.capture.recall.value).toBeGreaterThan(CAPTURE_MIN);
    expect(result.capture.precision.value).toBeGreaterThan(CAPTURE_MIN);
  });

  it('classifies the accepted rules by their evidence on both models', async () => {
    const result = await runDiff(
      [
        'R1: when x1 <= 3.9 expect A', // A on both: kept
        'R2: when x1 >= 4.1 and x2 <= 5.9 expect B', // x1 in [4.1, 5) becomes A: broken
        'R3: when x1 >= 5.1 and x2 >= 7.1 expect C', // C on both: kept
        'R4: when x1 in [4.5, 4.9] expect A', // B/C before, A after: fixed
        'R5: when x2 <= 5 expect A', // B where x1 is large, on both: still refuted
      ].join('\n'),
    );
    expect(Object.fromEntries(result.rules.map((r) => [r.rule.id, [r.before.status, r.after.status, r.verdict]]))).toEqual({
      R1: ['proven', 'proven', 'kept'],
      R2: ['proven', 'refuted', 'broken'],
      R3: ['proven', 'proven', 'kept'],
      R4: ['refuted', 'proven', 'fixed'],
      R5: ['refuted', 'refuted', 'still-refuted'],
    });
    const cx = result.rules[1]!.after.counterexample!;
    expect(cx.x[0]).toBeGreaterThanOrEqual(4.1);
    expect(thresholdLabel(cx.x[0]!, cx.x[1]!, ...AFTER)).toBe(0); // A, by the region definitions
  });

  it('mines the accepted table from the before model when none is given, and every mined rule is kept or broken', async () => {
    const result = await mined();
    expect(result.rulesSource).toBe('mined from the before model');
    expect(result.rules.length).toBeGreaterThan(0);
    for (const r of result.rules) expect(['kept', 'broken', 'no-longer-proven']).toContain(r.verdict);
    expect(result.rules.some((r) => r.verdict === 'broken')).toBe(true);
  });
});
