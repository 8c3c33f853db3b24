import { describe, expect, it } from 'vitest';
import { readableSteps } from '../../src/rules/index.js';
import type { Box } from '../../src/prove/index.js';
import { createRng } from '../../src/sampling/index.js';
import { unionVolume } from '../../src/repair/index.js';
import { PointKind, appendPointsInPlace, emptyGuidePoints } from '../../src/repair/guide-points.js';
import { planMainBox } from '../../src/repair/plan-main-box.js';

const limits = [0, 1].map(() => ({ clearance: 0.05, allowance: 0.3, finest: 1e-5, steps: readableSteps(10, 1e-5) }));
const region: Box = [[0, 10], [0, 10]];

/** 2000 uniform points on [0, 10]², labelled by `bad` (obstacle) or uniform allowed. */
function points(bad: (x: number, y: number) => boolean) {
  const rng = createRng(4);
  const p = emptyGuidePoints(2);
  for (let k = 0; k < 2000; k++) {
    const x = 10 * rng();
    const y = 10 * rng();
    appendPointsInPlace(p, [x, y], [bad(x, y) ? PointKind.violation : PointKind.uniform], 1);
  }
  return p;
}
const inside = (b: Box, x: number, y: number): boolean => b[0]![0] <= x && x <= b[0]![1] && b[1]![0] <= y && y <= b[1]![1];

describe('planMainBox', () => {
  it('peels a slab of violations with one face move, keeping the clearance from all of them', () => {
    const p = points((x) => x > 9.2);
    const plan = planMainBox(region, p, limits);
    expect(plan.slabs).toEqual([[[plan.main![0]![1], 10], [0, 10]]]);
    expect(plan.main![1]).toEqual([0, 10]);
    let nearest = Infinity;
    for (let r = 0; r < p.n; r++) if (p.kind[r] === PointKind.violation) nearest = Math.min(nearest, p.x[2 * r]!);
    // the face stands between clearance (0.05) and clearance + allowance (0.3) below the nearest violation
    expect(plan.main![0]![1]).toBeLessThanOrEqual(nearest - 0.05);
    expect(plan.main![0]![1]).toBeGreaterThanOrEqual(nearest - 0.35);
  });

  it('keeps the arm that loses least in an L and partitions the rest', () => {
    const bad = (x: number, y: number): boolean => x > 4 && y > 6;
    const p = points(bad);
    const plan = planMainBox(region, p, limits);
    // cutting y below 6 loses the allowed points of [0, 4] × [6, 10] (16 % of the area); cutting x
    // below 4 would lose those of [4, 10] × [0, 6] (36 %)
    expect(plan.main).toBeDefined();
    expect(plan.main![1]![1]).toBeLessThan(6);
    expect(plan.main![0]).toEqual([0, 10]);
    for (let r = 0; r < p.n; r++) if (p.kind[r] === PointKind.violation) expect(inside(plan.main!, p.x[2 * r]!, p.x[2 * r + 1]!)).toBe(false);
    // main and slabs tile the region: volumes add up and nothing overlaps
    const parts = [plan.main!, ...plan.slabs];
    const sum = parts.reduce((t, b) => t + (b[0]![1] - b[0]![0]) * (b[1]![1] - b[1]![0]), 0);
    // sums of a few products of decimals below 10: float64 error far under 1e-9
    expect(Math.abs(sum - 100)).toBeLessThan(1e-9);
    expect(Math.abs(unionVolume(parts, region) - 100)).toBeLessThan(1e-9);
  });

  it('returns the region itself, with no slab, when nothing is in the way', () => {
    expect(planMainBox(region, points(() => false), limits)).toEqual({ main: region, slabs: [] });
  });
});
