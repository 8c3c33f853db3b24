import * as ort from 'onnxruntime-node';
import { describe, expect, it } from 'vitest';
import { loadModel } from '../../src/model/index.js';
import { loadScenario } from '../../src/scenario/index.js';
import { boxNetwork2d, boxNetwork3d, writeBoxScenario, type BoxNetwork } from '../fixtures/box-network.js';
import { weylPoints } from './weyl-points.js';

/**
 * Grid of cell centres, `cells[j]` cells per input, chosen so that every threshold lies on a cell
 * edge: each grid point is then at least half a cell from every boundary.
 */
function grid(net: BoxNetwork, cells: number[]): number[][] {
  let points: number[][] = [[]];
  net.inputs.forEach((input, j) => {
    const step = (input.max - input.min) / cells[j]!;
    const next: number[][] = [];
    for (const p of points) for (let i = 0; i < cells[j]!; i++) next.push([...p, input.min + (i + 0.5) * step]);
    points = next;
  });
  return points;
}

/** Distance (scenario units) from a point to the nearest threshold of any region condition. */
function distanceToBoundary(net: BoxNetwork, x: number[]): number {
  let d = Infinity;
  for (const conds of net.conditions) for (const c of conds) d = Math.min(d, Math.abs(x[c.input]! - c.threshold));
  return d;
}

/**
 * Minimum distance from a boundary for the grid test. The network's score gap at distance δ is
 * ≥ 2δ (fixture doc); float32 rounding of inputs ≤ 100 and of 3-layer sums of a few terms ≤ 200
 * is below 1e-4 (2^-24 · 200 per operation, a handful of operations), so δ = 0.05 (the smallest
 * half cell used) leaves a factor > 500.
 */
const BOUNDARY_DISTANCE = 0.05;
/** Slack for the grid's own float64 arithmetic (min + (i + 0.5)·step), far below any half cell. */
const GRID_ROUNDING = 1e-9;

/** Float32 rounding of the 3-input network's scores in units (values ≤ 200): see its test. */
const UNIT_SCALE_FLOAT32_ERROR = 1e-4;

/** Float32 rounding of normalised values ≤ 1 through 3 layers: < 1e-6; 1e-4 leaves 100× headroom. */
const FLOAT32_SLACK = 1e-4;

async function onnxLabels(net: BoxNetwork, points: number[][]): Promise<Int32Array> {
  const session = await ort.InferenceSession.create(net.bytes);
  const d = net.inputs.length;
  const data = new Float32Array(points.length * d);
  points.forEach((p, i) => p.forEach((v, j) => (data[i * d + j] = v)));
  const out = await session.run({ input: new ort.Tensor('float32', data, [points.length, d]) });
  await session.release();
  const scores = out['scores']!.data as Float32Array;
  const k = net.advisories.length;
  const labels = new Int32Array(points.length);
  for (let i = 0; i < points.length; i++) {
    let best = 0;
    for (let j = 1; j < k; j++) if (scores[i * k + j]! > scores[i * k + best]!) best = j;
    labels[i] = best;
  }
  return labels;
}

describe('boxNetwork fixtures', () => {
  const cases: Array<[string, BoxNetwork, number[]]> = [
    ['2 inputs, 3 advisories', boxNetwork2d(), [100, 100]], // cells of 0.1: δ = 0.05
    ['3 inputs, 4 advisories', boxNetwork3d(), [40, 40, 36]], // cells 2.5 m, 0.5 m/s, 5 deg: δ = 0.25
  ];

  for (const [label, net, cells] of cases) {
    it(`${label}: onnxruntime's argmax equals labelAt on a dense grid away from boundaries`, async () => {
      const points = grid(net, cells);
      expect(points.reduce((m, p) => Math.min(m, distanceToBoundary(net, p)), Infinity)).toBeGreaterThanOrEqual(BOUNDARY_DISTANCE - GRID_ROUNDING);
      const labels = await onnxLabels(net, points);
      const mismatches = points.filter((p, i) => labels[i] !== net.labelAt(p));
      expect(mismatches).toEqual([]);
      // every advisory occurs: the grid really crosses all regions
      expect(new Set(labels).size).toBe(net.advisories.length);
    });

    it(`${label}: each region box holds exactly the points labelAt gives its advisory`, () => {
      const wrong = grid(net, cells).filter((p) => {
        const inside = net.regions.filter((r) => r.box.every(([lo, hi], j) => p[j]! >= lo && p[j]! <= hi));
        return inside.length !== 1 || inside[0]!.advisory !== net.labelAt(p);
      });
      expect(wrong).toEqual([]);
    });
  }

  it('computes each score as the smallest signed distance to its conditions (the construction)', async () => {
    const net = boxNetwork3d();
    const scenario = loadScenario(writeBoxScenario(net).scenarioPath);
    const model = await loadModel(scenario);
    const n = 500;
    const x = weylPoints(net.inputs.map((i) => [i.min, i.max] as const), n);
    const { scores } = await model.evaluate(x, n);
    await model.close();
    let worst = 0;
    for (let i = 0; i < n; i++) {
      const p = Array.from(x.subarray(3 * i, 3 * i + 3));
      net.conditions.forEach((conds, a) => {
        const expected = Math.min(...conds.map((c) => (c.op === '<' ? c.threshold - p[c.input]! : p[c.input]! - c.threshold)));
        worst = Math.max(worst, Math.abs(scores[4 * i + a]! - expected));
      });
    }
    // inputs ≤ 100 in magnitude, sums of ≤ 3 terms ≤ 200 per layer, 3 layers in float32
    // (2^-24 · 200 ≈ 1.2e-5 per operation): 1e-4 bounds the accumulated rounding
    expect(worst).toBeLessThan(UNIT_SCALE_FLOAT32_ERROR);
  });

  it('labels boundary points by the region definitions: x1 = 4 is B, x2 = 6 is C', () => {
    const net = boxNetwork2d();
    expect([net.labelAt([3.999, 0]), net.labelAt([4, 0]), net.labelAt([4, 5.999]), net.labelAt([4, 6])]).toEqual([0, 1, 1, 2]);
  });

  it('keeps its regions in units when built on normalised inputs, and under argmin when negated', async () => {
    const net = boxNetwork3d({ normalize: { offset: [50, 0, 0], scale: [50, 10, 90] }, negate: true });
    const model = await loadModel(loadScenario(writeBoxScenario(net).scenarioPath));
    const points = grid(net, [40, 40, 36]);
    const x = Float64Array.from(points.flat());
    const { advisory, margin } = await model.evaluate(x, points.length);
    await model.close();
    expect(points.filter((p, i) => advisory[i] !== net.labelAt(p))).toEqual([]);
    // margin ≥ 2δ/scale in network units: δ = 0.25 m/s on rate (scale 10), 1.25 m on gap
    // (scale 50), 2.5 deg on angle (scale 90) → smallest 2·0.25/10 = 0.05
    expect(margin.reduce((m, v) => Math.min(m, v), Infinity)).toBeGreaterThanOrEqual(0.05 - FLOAT32_SLACK);
  });
});
