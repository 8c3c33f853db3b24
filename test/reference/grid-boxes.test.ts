import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gridBoxes } from '../../src/reference/index.js';

/** Flat indices of every point inside an index box, for the checks below (odometer order). */
function pointsOf(lo: readonly number[], hi: readonly number[], shape: readonly number[]): number[] {
  const out: number[] = [];
  const rec = (f: number, base: number): void => {
    if (f === shape.length) return void out.push(base);
    for (let i = lo[f]!; i <= hi[f]!; i++) rec(f + 1, base * shape[f]! + i);
  };
  rec(0, 0);
  return out;
}

describe('gridBoxes', () => {
  it('covers an L-shape of a 4 × 4 grid with two exact boxes', () => {
    // rows are the first axis:  X . . .   X marked
    //                           X . . .
    //                           X X X X
    //                           . . . .
    const marked = Uint8Array.from([1, 0, 0, 0, 1, 0, 0, 0, 1, 1, 1, 1, 0, 0, 0, 0]);
    const copy = marked.slice();
    const boxes = gridBoxes(marked, [4, 4]);
    expect(marked).toEqual(copy); // typed arrays cannot be frozen: compare with a copy instead
    expect(boxes).toEqual([
      { lo: [0, 0], hi: [2, 0], points: 3 },
      { lo: [2, 0], hi: [2, 3], points: 4 },
    ]);
  });

  it('gives one box for a full grid and none for an empty one', () => {
    expect(gridBoxes(new Uint8Array(24).fill(1), [2, 3, 4])).toEqual([{ lo: [0, 0, 0], hi: [1, 2, 3], points: 24 }]);
    expect(gridBoxes(new Uint8Array(24), [2, 3, 4])).toEqual([]);
  });

  it('covers every marked point and no unmarked one, on random grids of up to 4 axes', () => {
    const grid = fc
      .array(fc.integer({ min: 1, max: 4 }), { minLength: 1, maxLength: 4 })
      .chain((shape) => fc.tuple(fc.constant(shape), fc.array(fc.boolean(), { minLength: shape.reduce((a, b) => a * b, 1), maxLength: shape.reduce((a, b) => a * b, 1) })));
    fc.assert(
      fc.property(grid, ([shape, flags]) => {
        const marked = Uint8Array.from(flags, (b) => (b ? 1 : 0));
        const covered = new Uint8Array(marked.length);
        for (const box of gridBoxes(marked, shape)) {
          const pts = pointsOf(box.lo, box.hi, shape);
          if (pts.length !== box.points) return false;
          for (const p of pts) {
            if (marked[p] !== 1) return false;
            covered[p] = 1;
          }
        }
        return covered.every((c, p) => c === marked[p]);
      }),
      { seed: 7, numRuns: 300 },
    );
  });
});
