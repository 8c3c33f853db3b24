import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { boxNetwork2d, boxNetwork3d } from '../fixtures/box-network.js';
import { type Box, proveBox } from '../../src/prove/index.js';
import { type RepairOptions, REPAIR_DEFAULTS, repairRule } from '../../src/repair/index.js';
import type { Rule } from '../../src/types.js';
import { type LoadedNet, type TestNet, countViolations, frozenClock, loadNet, pocketNetwork } from './helpers.js';

/**
 * Repair on constructed networks whose decision regions are known exactly (the reference is the
 * construction: boxes of ReLU minima, see test/fixtures/box-network.ts, and the pocket network
 * in helpers.ts), run through onnxruntime. The clock never advances: budgets are pieces only,
 * so the results do not depend on the machine's speed.
 */
const loaded = new Map<TestNet, Promise<LoadedNet>>();
const nets = { box2d: boxNetwork2d(), box3d: boxNetwork3d({ normalize: { offset: [50, 0, 0], scale: [50, 10, 90] } }), pocket: pocketNetwork() };
const load = (net: TestNet): Promise<LoadedNet> => {
  if (!loaded.has(net)) loaded.set(net, loadNet(net));
  return loaded.get(net)!;
};
beforeAll(async () => {
  await Promise.all(Object.values(nets).map(load));
});
afterAll(async () => {
  for (const p of loaded.values()) await (await p).model.close();
});

const options = (net: LoadedNet, extra: Partial<RepairOptions> = {}): RepairOptions => ({
  confirm: net.confirm,
  now: frozenClock,
  maxSeconds: 1e6,
  maxBoxesPerProof: 2000,
  ...extra,
});
const repair = async (net: TestNet, rule: Rule, extra: Partial<RepairOptions> = {}) => {
  const n = await load(net);
  return repairRule(n.network, rule, { ...n.scenario }, options(n, extra));
};
const rule = (id: string, box: Box, allowed: number[]): Rule => ({ id, box, allowed, origin: { kind: 'mined' } });
/** A value on the 1-2-5 grid at a step of at least `step` (0.1 → one decimal): what a reader sees. */
const onGrid = (v: number, step: number): boolean => Math.abs(v / step - Math.round(v / step)) < 1e-9;
/** Widest gap the readable cut may leave past the true boundary: the allowance share of the width. */
const allowance = (width: number): number => REPAIR_DEFAULTS.allowanceShare * width;
/** The closed boxes a and b share a point. */
const meets = (a: Box, b: Box): boolean => a.every(([lo, hi], i) => lo <= b[i]![1] && b[i]![0] <= hi);

describe('repairRule', () => {
  it('cuts off a slab of the neighbouring region with one readable face (2 inputs)', async () => {
    // true region of A: x1 < 4 (construction); the rule reaches 0.5 past it
    const r = await repair(nets.box2d, rule('R1', [[0, 4.5], [0, 10]], [0]));
    expect(r.subRules).toHaveLength(1);
    const [x1, x2] = r.subRules[0]!.box;
    expect(x2).toEqual([0, 10]);
    expect(x1![0]).toBe(0);
    expect(x1![1]).toBeLessThan(4); // the tie on x1 = 4 cannot be proven
    expect(4 - x1![1]).toBeLessThanOrEqual(allowance(4.5));
    // peeled at a multiple of 0.1, then grown by the fill towards the tie in steps no finer than
    // the clearance (0.5 % of the width 4.5 ≈ 0.0225, so 0.05)
    expect(onGrid(x1![1], 0.05)).toBe(true);
    expect(r.subRules[0]).toMatchObject({ id: 'R1.1', allowed: [0], origin: { kind: 'repaired', from: 'R1' } });
    expect(r.proofs[0]!.status).toBe('proven');
    // one product of two width ratios: float64 error ~1e-16; toBeCloseTo(…, 12) allows 5e-13
    expect(r.provenVolumeFraction).toBeCloseTo(x1![1] / 4.5, 12);
  });

  it('cuts off a slab in scenario units under a normalisation (3 inputs, 4 regions)', async () => {
    // cruise where gap_m >= 60 (construction); the rule starts at 50
    const r = await repair(nets.box3d, rule('R7', [[50, 100], [-10, 10], [-90, 90]], [0]));
    expect(r.subRules).toHaveLength(1);
    const [gap, rate, angle] = r.subRules[0]!.box;
    expect([rate, angle]).toEqual([[-10, 10], [-90, 90]]);
    expect(gap![1]).toBe(100);
    expect(gap![0]).toBeGreaterThan(60);
    expect(gap![0] - 60).toBeLessThanOrEqual(allowance(50));
    // grown by the fill in steps no finer than the clearance (0.5 % of 50 = 0.25, so 0.5)
    expect(onGrid(gap![0], 0.5)).toBe(true);
  });

  it('keeps a rule that already holds as one sub-rule equal to it', async () => {
    const r = await repair(nets.box2d, rule('R2', [[4.5, 10], [0, 5]], [1]));
    expect(r.subRules.map((s) => s.box)).toEqual([[[4.5, 10], [0, 5]]]);
    expect(r.provenVolumeFraction).toBe(1);
  });

  it('covers an L-shaped allowed area with the optimum of 2 sub-rules', async () => {
    // A or B everywhere except C = [4, 10] × [6, 10]: allowed area 76 % of the box. A box holding
    // (3.9, 9) and (9, 5.9) also holds (9, 9) in C, so one sub-rule cannot cover both arms.
    const r = await repair(nets.box2d, rule('R3', [[0, 10], [0, 10]], [0, 1]));
    expect(r.subRules).toHaveLength(2);
    for (const s of r.subRules) expect(meets(s.box, [[4, 10], [6, 10]])).toBe(false);
    // each of the two cut faces may give up at most the allowance across its length
    expect(r.provenVolumeFraction).toBeGreaterThanOrEqual(0.76 - (allowance(10) * 10 + allowance(10) * 4) / 100);
  });

  it('goes around an interior pocket with the optimum of 4 sub-rules', async () => {
    // Points just left, right, below and above the pocket [4, 5]² need 4 different boxes: a box
    // holding two of them holds a point of the pocket (boxes are convex and axis-aligned).
    const r = await repair(nets.pocket, rule('R4', [[0, 10], [0, 10]], [0]));
    expect(r.subRules).toHaveLength(4);
    for (const s of r.subRules) expect(meets(s.box, [[4, 5], [4, 5]])).toBe(false);
    // the pocket is 1 % of the box; readable faces may stand off by the allowance on each side
    expect(r.provenVolumeFraction).toBeGreaterThanOrEqual(1 - (1 + 2 * allowance(10)) ** 2 / 100);
  });

  it('stops at maxSubRules and drops regions below minVolumeShare', async () => {
    const r = await repair(nets.pocket, rule('R5', [[0, 10], [0, 10]], [0]), { maxSubRules: 1 });
    expect(r.subRules).toHaveLength(1);
    // the L's arm above x2 = 6 is under 24 % of the box: dropped at a threshold of 30 %
    const big = await repair(nets.box2d, rule('R6', [[0, 10], [0, 10]], [0, 1]), { minVolumeShare: 0.3 });
    expect(big.subRules).toHaveLength(1);
    expect(big.provenVolumeFraction).toBeGreaterThanOrEqual(0.3);
  });

  it('stays within maxPieces and maxSteps, and reuses pieces proven before it started', async () => {
    const n = await load(nets.pocket);
    const parent = rule('R8', [[0, 10], [0, 10]], [0]);
    const none = await repair(nets.pocket, parent, { maxSteps: 0 });
    expect([none.subRules.length, none.steps, none.attempts, none.pieces]).toEqual([0, 0, 0, 0]);
    const capped = await repair(nets.pocket, parent, { maxPieces: 300 });
    expect(capped.pieces).toBeLessThanOrEqual(300);
    // the rule's own proof (as settleRule runs it) proves pieces away from the pocket; a repair
    // given them bounds fewer pieces for sub-rules that cover at least as much
    const own = await proveBox(n.network, parent.box, parent.allowed, n.scenario.decision, { maxBoxes: 2000, maxSeconds: 1e6, now: frozenClock, confirm: n.confirm });
    expect(own.status).not.toBe('proven');
    const alone = await repair(nets.pocket, parent);
    const seeded = await repair(nets.pocket, parent, { known: own.provenBoxes });
    expect(seeded.pieces).toBeLessThan(alone.pieces);
    expect(seeded.subRules.length).toBeGreaterThan(0);
    expect(seeded.proofs.every((p) => p.status === 'proven')).toBe(true);
  });

  it('returns only sub-rules that re-prove and that dense onnxruntime sampling does not refute', async () => {
    const cases: Array<[TestNet, Rule]> = [
      [nets.box2d, rule('S1', [[0, 10], [0, 10]], [0, 1])],
      [nets.box3d, rule('S2', [[0, 70], [-10, 10], [-90, 90]], [1])],
      [nets.pocket, rule('S3', [[0, 10], [0, 10]], [0])],
    ];
    for (const [net, parent] of cases) {
      const n = await load(net);
      const r = await repair(net, parent);
      expect(r.subRules.length).toBeGreaterThan(0);
      for (const [k, s] of r.subRules.entries()) {
        expect(r.proofs[k]!.provenBoxes.length).toBeGreaterThan(0);
        const again = await proveBox(n.network, s.box, s.allowed, n.scenario.decision, {
          maxBoxes: 20_000,
          maxSeconds: 1e6,
          now: frozenClock,
          confirm: n.confirm,
          ...(n.scenario.normalize ? { normalize: n.scenario.normalize } : {}),
        });
        expect(again.status).toBe('proven');
        expect(await countViolations(n.model, s.box, s.allowed, 20_000, 11 + k)).toBe(0);
        s.box.forEach(([lo, hi], i) => {
          expect(lo).toBeGreaterThanOrEqual(parent.box[i]![0]);
          expect(hi).toBeLessThanOrEqual(parent.box[i]![1]);
        });
      }
    }
  });
});
