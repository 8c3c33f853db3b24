import { describe, expect, it } from 'vitest';
import type { Box } from '../../src/prove/index.js';
import { unionVolume, uncoveredBoxes } from '../../src/repair/index.js';
import { createRng } from '../../src/sampling/index.js';

/** Random closed boxes inside [0, 10]^d, seeded: widths up to `maxWidth` per input. */
function randomBoxes(seed: number, count: number, d: number, maxWidth: number): Box[] {
  const rng = createRng(seed);
  return Array.from({ length: count }, () =>
    Array.from({ length: d }, () => {
      const w = rng() * maxWidth;
      const lo = rng() * (10 - w);
      return [lo, lo + w] as const;
    }),
  );
}

/**
 * Reference: coordinate compression. The distinct box edges (and the region's) cut the region
 * into a grid of cells, each inside a box or outside all; the union is the sum of the covered
 * cells (textbook method for Klee's measure problem; from memory). Exponential in d: small d only.
 */
function gridUnion(boxes: readonly Box[], region: Box): number {
  const d = region.length;
  const cuts = region.map(([lo, hi], i) => {
    const set = new Set([lo, hi]);
    for (const b of boxes) for (const e of b[i]!) if (e > lo && e < hi) set.add(e);
    return [...set].sort((a, b) => a - b);
  });
  let total = 0;
  const index = new Array<number>(d).fill(0);
  for (;;) {
    const mid = index.map((k, i) => (cuts[i]![k]! + cuts[i]![k + 1]!) / 2);
    if (boxes.some((b) => b.every(([lo, hi], i) => lo <= mid[i]! && mid[i]! <= hi))) {
      total += index.reduce((v, k, i) => v * (cuts[i]![k + 1]! - cuts[i]![k]!), 1);
    }
    let i = 0;
    while (i < d && ++index[i]! >= cuts[i]!.length - 1) index[i++] = 0;
    if (i === d) return total;
  }
}

const cube = (d: number): Box => Array.from({ length: d }, () => [0, 10] as const);

describe('unionVolume', () => {
  it('counts an overlap once (inclusion–exclusion on two boxes)', () => {
    // |A ∪ B| = |A| + |B| − |A ∩ B| = 4·4 + 4·4 − 2·2 = 28
    const a: Box = [[0, 4], [0, 4]];
    const b: Box = [[2, 6], [2, 6]];
    expect(unionVolume([a, b], [[0, 10], [0, 10]])).toBe(28);
  });

  it('equals the grid of distinct edges on random overlapping boxes (2 and 3 inputs)', () => {
    for (const [d, count] of [[2, 40], [3, 25]] as const) {
      const boxes = randomBoxes(d, count, d, 5);
      const exact = gridUnion(boxes, cube(d));
      // both sum float64 products of differences of the same edges; rounding stays near 1e-15
      // relative, 1e-12 leaves a wide margin
      expect(Math.abs(unionVolume(boxes, cube(d)) - exact)).toBeLessThan(1e-12 * exact);
    }
  });

  it('agrees with a Monte Carlo estimate in 5 inputs (300 overlapping boxes)', () => {
    const d = 5;
    const boxes = randomBoxes(11, 300, d, 6);
    const share = unionVolume(boxes, cube(d)) / 1e5;
    const rng = createRng(12);
    const n = 200_000;
    let hits = 0;
    const p = new Array<number>(d);
    for (let k = 0; k < n; k++) {
      for (let i = 0; i < d; i++) p[i] = 10 * rng();
      if (boxes.some((b) => b.every(([lo, hi], i) => lo <= p[i]! && p[i]! <= hi))) hits++;
    }
    // binomial standard error sqrt(p(1 − p)/n) ≤ 0.0012 at n = 200,000; 4 standard errors
    // make a false failure rarer than 1 in 10,000 (normal approximation)
    const se = Math.sqrt((share * (1 - share)) / n);
    expect(Math.abs(hits / n - share)).toBeLessThan(4 * se);
  });

  it('measures only the region, and ignores inputs where the region has zero width', () => {
    expect(unionVolume([[[-5, 5], [0, 10]]], [[0, 10], [0, 10]])).toBe(50);
    // the region is the segment x2 = 3: boxes holding x2 = 3 count by their x1 length
    expect(unionVolume([[[0, 2], [0, 3]], [[1, 4], [3, 5]], [[6, 7], [4, 5]]], [[0, 10], [3, 3]])).toBe(4);
    expect(unionVolume([], cube(3))).toBe(0);
  });
});

describe('uncoveredBoxes', () => {
  it('leaves exactly the region minus the boxes, as disjoint boxes', () => {
    const boxes = randomBoxes(21, 30, 3, 5);
    const open = uncoveredBoxes(cube(3), boxes);
    const covered = unionVolume(boxes, cube(3));
    const free = open.reduce((t, b) => t + b.reduce((v, [lo, hi]) => v * (hi - lo), 1), 0);
    // disjoint pieces: their summed volume equals their union's; with the covered part they fill
    // the region (1000); float64 rounding over a few hundred products stays below 1e-9
    expect(Math.abs(unionVolume(open, cube(3)) - free)).toBeLessThan(1e-9);
    expect(Math.abs(free + covered - 1000)).toBeLessThan(1e-9);
    for (const b of open) expect(unionVolume(boxes, b)).toBeLessThan(1e-9);
  });
});
