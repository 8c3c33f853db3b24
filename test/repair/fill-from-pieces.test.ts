import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeMlpOnnx } from '../../src/model/index.js';
import { type Box, proveBox } from '../../src/prove/index.js';
import { repairRule } from '../../src/repair/index.js';
import { type LoadedNet, type TestNet, countViolations, frozenClock, loadNet } from './helpers.js';

/**
 * The fill after peeling (src/repair/fill-from-pieces.ts) on a slanted boundary, whose exact
 * region is known in closed form: scores s_below = 5 − x1/2 − x2/2 and s_above = −s_below on
 * [0, 10]², so `below` wins exactly where x1 + x2 < 10, half of the square (the triangle's area,
 * 50 of 100). A staircase of boxes can only approach that half from inside.
 */
const slanted: TestNet = {
  // writeMlpOnnx takes weights output by output: s_below = −x1/2 − x2/2 + 5, s_above = x1/2 + x2/2 − 5
  bytes: writeMlpOnnx([{ inSize: 2, outSize: 2, weights: [-0.5, -0.5, 0.5, 0.5], bias: [5, -5], activation: 'none' }]),
  inputs: [
    { name: 'x1', unit: '', min: 0, max: 10, description: 'first input' },
    { name: 'x2', unit: '', min: 0, max: 10, description: 'second input' },
  ],
  advisories: ['below', 'above'],
  decision: 'argmax',
};
let net: LoadedNet;
beforeAll(async () => {
  net = await loadNet(slanted);
});
afterAll(async () => {
  await net.model.close();
});

const repair = (fillPieces: number) =>
  repairRule(net.network, { id: 'R1', box: [[0, 10], [0, 10]], allowed: [0], origin: { kind: 'mined' } }, { ...net.scenario }, {
    confirm: net.confirm,
    now: frozenClock,
    maxSeconds: 1e6,
    maxBoxesPerProof: 2000,
    maxPieces: 40_000,
    maxSubRules: 40,
    fillPieces,
  });

/** Positive overlap of two closed boxes (sharing a face is not overlap). */
const overlaps = (a: Box, b: Box): boolean => a.every(([lo, hi], i) => Math.min(hi, b[i]![1]) > Math.max(lo, b[i]![0]));
/**
 * A multiple of 0.05: the clearance is 0.5 % of the width 10, and faces are never written finer
 * than the coarsest 1-2-5 step at or above it. Quotients of such values are within 1e-9 of an
 * integer; anything finer would be off by at least 0.2.
 */
const readable = (v: number): boolean => Math.abs(v / 0.05 - Math.round(v / 0.05)) < 1e-9;

describe('fillFromPieces (through repairRule)', () => {
  it('covers more of a slanted region with the map than without, within the closed-form half, with proven, disjoint, readable boxes', async () => {
    // fillPieces 0: the fill only grows and cuts from the pieces the peeling's proofs proved
    const peeled = await repair(0);
    const filled = await repair(20_000);
    // the exact region is half the square: no proven box may reach past it
    expect(filled.provenVolumeFraction).toBeLessThanOrEqual(0.5);
    // the map lets the staircase go further towards the boundary (measured: 0.388 of the
    // square without it, 0.437 with it); 0.42 is a floor with room
    expect(peeled.provenVolumeFraction).toBeLessThan(filled.provenVolumeFraction);
    expect(filled.provenVolumeFraction).toBeGreaterThan(0.42);
    for (const [k, sub] of filled.subRules.entries()) {
      const [x1, x2] = sub.box;
      // inside the closed triangle x1 + x2 <= 10 (its far corner too)
      expect(x1![1] + x2![1]).toBeLessThanOrEqual(10);
      for (const [lo, hi] of sub.box) expect(readable(lo) && readable(hi)).toBe(true);
      for (const other of filled.subRules.slice(k + 1)) expect(overlaps(sub.box, other.box)).toBe(false);
      const again = await proveBox(net.network, sub.box, [0], 'argmax', { maxBoxes: 5000, maxSeconds: 1e6, now: frozenClock, confirm: net.confirm });
      expect(again.status).toBe('proven');
      expect(await countViolations(net.model, sub.box, [0], 500, 11 + k)).toBe(0);
    }
  });
});
