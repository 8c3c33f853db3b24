import { describe, expect, it } from 'vitest';
import { cellIndex, gridForRound } from '../../src/sampling/grid-for-round.js';
import {
  isSeed,
  keepCandidatesInPlace,
  markCellsInPlace,
  mixedMarginMedian,
  scatterAroundSeedsInPlace,
} from '../../src/sampling/refine-passes.js';
import { createRng, createRng32 } from '../../src/sampling/rng.js';
import { uniformInBox } from '../../src/sampling/uniform-in-box.js';

const box = Object.freeze([Object.freeze([0, 1] as const), Object.freeze([-2, 2] as const), Object.freeze([10, 20] as const)]);
const d = 3;

/** 600 uniform points, advisory = which side of a plane, margin = distance to it (normalised). */
function samples() {
  const n = 600;
  const x = uniformInBox(box, n, createRng(1));
  const advisory = new Int32Array(n);
  const margin = new Float32Array(n);
  for (let i = 0; i < n; i++) {
    const s = x[d * i]! + (x[d * i + 1]! + 2) / 4 - 1;
    advisory[i] = s > 0 ? 1 : 0;
    margin[i] = Math.abs(s);
  }
  return { x, advisory, margin, n };
}

describe('refine passes', () => {
  const { x, advisory, margin, n } = samples();
  const grid = gridForRound(box, n, 4, createRng(2));
  const active = { candidates: Int32Array.from([3, 10, 250]), from: 300, to: n };
  const positions = [3, 10, 250, ...Array.from({ length: n - 300 }, (_, k) => 300 + k)];

  it('marks each active sample in the cell cellIndex gives, and no other cell', () => {
    const held = new Uint8Array(grid.cells);
    const cellOf = new Int32Array(positions.length);
    markCellsInPlace(held, cellOf, x, advisory, d, grid, active);
    // brute force with the exported cellIndex
    const expected = new Uint8Array(grid.cells);
    positions.forEach((i, k) => {
      expect(cellOf[k]).toBe(cellIndex(x, i, d, grid));
      expected[cellIndex(x, i, d, grid)]! |= 1 << advisory[i]!;
    });
    expect(Array.from(held)).toEqual(Array.from(expected));
  });

  it('keeps exactly the samples in mixed cells and the near-ties, ascending, and counts the seeds', () => {
    const held = new Uint8Array(grid.cells);
    const cellOf = new Int32Array(positions.length);
    markCellsInPlace(held, cellOf, x, advisory, d, grid, active);
    const near = mixedMarginMedian(held, cellOf, margin, active, 4096);
    const tie = 0.01;
    const mixed = (i: number): boolean => {
      const h = held[cellIndex(x, i, d, grid)]!;
      return (h & (h - 1)) !== 0;
    };
    const expected = positions.filter((i) => mixed(i) || margin[i]! < tie);
    const seeds = positions.filter((i) => (mixed(i) && margin[i]! <= near) || margin[i]! < tie);
    const kept = keepCandidatesInPlace(cellOf, held, margin, active, near, tie);
    expect(Array.from(kept.candidates)).toEqual(expected);
    expect(kept.seeds).toBe(seeds.length);
    expect(Array.from(kept.candidates).filter((i) => isSeed(margin[i]!, near, tie))).toEqual(seeds);
    // the median of the mixed samples' margins: all 303 active positions are probed here
    const mixedMargins = positions.filter(mixed).map((i) => margin[i]!).sort((a, b) => a - b);
    const m = mixedMargins.length;
    expect(near).toBe(m % 2 === 1 ? mixedMargins[(m - 1) / 2] : 0.5 * (mixedMargins[m / 2 - 1]! + mixedMargins[m / 2]!));
  });

  it('gives each seed its share of the points, each in the box around it', () => {
    const candidates = Int32Array.from([4, 8, 15, 16, 23, 42]);
    const big = new Float32Array(n).fill(1);
    big[15] = 5; // not a seed: margin above near and tie
    const count = 17;
    const half = 0.05;
    const out = new Float64Array(count * d);
    scatterAroundSeedsInPlace(candidates, big, x, d, grid, { count, seeds: 5, near: 1, tie: 0, phase: 2, half }, createRng32(3), out, 0);
    // seed s of 5 gets ⌊((s + 1)·17 + 2)/5⌋ − ⌊(s·17 + 2)/5⌋ points: 3, 4, 3, 4, 3
    const shares = [3, 4, 3, 4, 3];
    const seeds = [4, 8, 16, 23, 42];
    let t = 0;
    seeds.forEach((seed, s) => {
      for (let e = 0; e < shares[s]!; e++, t++) {
        for (let j = 0; j < d; j++) {
          const [lo, hi] = box[j]!;
          const u = (out[d * t + j]! - lo) / (hi - lo);
          const c = (x[d * seed + j]! - lo) / (hi - lo);
          // the box is [c − half, c + half] clipped to [0, 1]; 1e-12 allows for the rounding of
          // the scale-and-shift round trip through scenario units (normalised units are ≤ 1)
          const ROUND_TRIP = 1e-12;
          expect(u).toBeGreaterThanOrEqual(Math.max(0, c - half) - ROUND_TRIP);
          expect(u).toBeLessThanOrEqual(Math.min(1, c + half) + ROUND_TRIP);
        }
      }
    });
    expect(t).toBe(count);
  });
});
