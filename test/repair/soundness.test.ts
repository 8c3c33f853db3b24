import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { proveBox } from '../../src/prove/index.js';
import { type RepairOptions, repairRule, unionVolume } from '../../src/repair/index.js';
import { createRng } from '../../src/sampling/index.js';
import type { Rule } from '../../src/types.js';
import { type LoadedNet, countViolations, frozenClock, loadNet, randomNetwork } from './helpers.js';

/**
 * Soundness on networks with curved, slanted boundaries (seeded random ReLU networks run by
 * onnxruntime): whatever the repair returns must re-prove and must survive dense sampling; the
 * result must not depend on anything but the inputs.
 */
const SEEDS = [3, 8];
const nets = new Map<number, LoadedNet>();
beforeAll(async () => {
  for (const seed of SEEDS) nets.set(seed, await loadNet(randomNetwork(seed)));
});
afterAll(async () => {
  for (const n of nets.values()) await n.model.close();
});

const options = (n: LoadedNet, extra: Partial<RepairOptions> = {}): RepairOptions => ({
  confirm: n.confirm,
  now: frozenClock,
  maxSeconds: 1e6,
  maxBoxesPerProof: 1500,
  ...extra,
});

/** The advisory most common on a 64 × 64 grid: the rule "whole domain ⇒ it" is refuted elsewhere. */
async function majority(n: LoadedNet): Promise<number> {
  const x = new Float64Array(64 * 64 * 2);
  for (let k = 0; k < 64 * 64; k++) [x[2 * k], x[2 * k + 1]] = [((k % 64) + 0.5) * (10 / 64), (Math.floor(k / 64) + 0.5) * (10 / 64)];
  const { advisory } = await n.model.evaluate(x, 64 * 64);
  const counts = [0, 0, 0];
  for (const a of advisory) counts[a]!++;
  return counts.indexOf(Math.max(...counts));
}

describe('repairRule on random networks', () => {
  it.each(SEEDS)('returns disjoint sub-rules that re-prove and dense sampling cannot refute (seed %i)', async (seed) => {
    const n = nets.get(seed)!;
    const a = await majority(n);
    const parent: Rule = { id: `M${seed}`, box: [[0, 10], [0, 10]], allowed: [a], origin: { kind: 'mined' } };
    const r = await repairRule(n.network, parent, n.scenario, options(n, { minVolumeShare: 0.01 }));
    expect(r.subRules.length).toBeGreaterThan(0);
    for (const [k, s] of r.subRules.entries()) {
      expect(s.id).toBe(`M${seed}.${k + 1}`);
      const again = await proveBox(n.network, s.box, s.allowed, 'argmax', {
        maxBoxes: 20_000,
        maxSeconds: 1e6,
        now: frozenClock,
        confirm: n.confirm,
        normalize: n.scenario.normalize!,
      });
      expect(again.status).toBe('proven');
      expect(await countViolations(n.model, s.box, s.allowed, 20_000, 100 + k)).toBe(0);
    }
    // disjoint: the union's volume is the sum of the volumes, and matches the reported share
    const boxes = r.subRules.map((s) => s.box);
    const sum = boxes.reduce((t, b) => t + (b[0]![1] - b[0]![0]) * (b[1]![1] - b[1]![0]), 0);
    // float64 sums of a few products of values near 10: far below 1e-9 relative
    expect(Math.abs(unionVolume(boxes, parent.box) - sum)).toBeLessThan(1e-9 * sum);
    expect(Math.abs(r.provenVolumeFraction - sum / 100)).toBeLessThan(1e-12);
  });

  it('gives the same result twice and leaves its inputs unchanged', async () => {
    const n = nets.get(SEEDS[0]!)!;
    const a = await majority(n);
    const parent: Rule = Object.freeze({
      id: 'D1',
      box: Object.freeze([Object.freeze([0, 10] as const), Object.freeze([0, 10] as const)]),
      allowed: Object.freeze([a]),
      origin: Object.freeze({ kind: 'mined' as const }),
    });
    const first = await repairRule(n.network, parent, n.scenario, options(n));
    const second = await repairRule(n.network, parent, n.scenario, options(n));
    expect(second.subRules).toEqual(first.subRules);
    expect(second.pieces).toBe(first.pieces);
    expect(second.attempts).toBe(first.attempts);
    expect(parent.box).toEqual([[0, 10], [0, 10]]);
  });

  it('uses given labelled samples as violations to cut off', async () => {
    const n = nets.get(SEEDS[1]!)!;
    const a = await majority(n);
    const rng = createRng(5);
    const x = new Float64Array(4000 * 2);
    for (let k = 0; k < x.length; k++) x[k] = 10 * rng();
    const { advisory } = await n.model.evaluate(x, 4000);
    const parent: Rule = { id: 'G1', box: [[0, 10], [0, 10]], allowed: [a], origin: { kind: 'mined' } };
    const r = await repairRule(n.network, parent, n.scenario, options(n, { samples: { x, n: 4000, d: 2, advisory } }));
    // no sub-rule may hold a given sample with another advisory
    for (const s of r.subRules) {
      for (let k = 0; k < 4000; k++) {
        const inside = s.box.every(([lo, hi], i) => x[2 * k + i]! >= lo && x[2 * k + i]! <= hi);
        if (inside) expect(advisory[k]).toBe(a);
      }
    }
    expect(r.subRules.length).toBeGreaterThan(0);
  });
});
