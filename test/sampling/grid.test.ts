import { describe, expect, it } from 'vitest';
import { grid, gridCellsPerAxis, gridInPlace, gridRangeInPlace } from '../../src/sampling/grid.js';
import { createRng } from '../../src/sampling/rng.js';

describe('gridCellsPerAxis', () => {
  it('is the largest c with c^d within the budget, exact at perfect powers', () => {
    // perfect powers are where a floating-point root can land just below the integer
    expect(gridCellsPerAxis(1000, 3)).toBe(10);
    expect(gridCellsPerAxis(999, 3)).toBe(9);
    expect(gridCellsPerAxis(1024, 10)).toBe(2);
    expect(gridCellsPerAxis(1023, 10)).toBe(1);
    expect(gridCellsPerAxis(243, 5)).toBe(3);
    expect(gridCellsPerAxis(0, 4)).toBe(0);
  });
});

describe('grid', () => {
  it('puts exactly one point in every cell of the c^d grid', () => {
    const box = Object.freeze([[0, 3], [-1, 1], [100, 200]] as const);
    const x = grid(box, 130, createRng(2)); // 5^3 = 125 cells
    const n = x.length / 3;
    expect(n).toBe(125);
    const seen = new Int32Array(n);
    for (let i = 0; i < n; i++) {
      let cell = 0;
      for (let j = 0; j < 3; j++) {
        const [lo, hi] = box[j]!;
        const c = Math.floor(((x[3 * i + j]! - lo) / (hi - lo)) * 5);
        expect(c >= 0 && c < 5).toBe(true);
        cell = cell * 5 + c;
      }
      seen[cell]!++;
    }
    expect(seen.every((c) => c === 1)).toBe(true);
  });

  it('writes the same points in place from a given row and says how many', () => {
    const out = new Float64Array(2 * 30);
    expect(gridInPlace([[0, 1], [5, 6]], 20, createRng(3), out, 5)).toBe(16);
    expect(Array.from(out.subarray(10, 42))).toEqual(Array.from(grid([[0, 1], [5, 6]], 20, createRng(3))));
    expect(() => gridInPlace([[0, 1], [5, 6]], 20, createRng(3), out, 15)).toThrow('expected room for 16 rows from row 15, found 30 rows');
  });

  it('gives the same grid when made in ranges of cells, in order, from one generator', () => {
    const box = [[0, 1], [5, 6], [-3, 3]] as const;
    const whole = grid(box, 200, createRng(4)); // 5^3 = 125 cells
    const parts = new Float64Array(whole.length);
    const rng = createRng(4);
    for (const [first, n] of [[0, 7], [7, 1], [8, 60], [68, 57]] as const) gridRangeInPlace(box, 5, first, n, rng, parts, first);
    expect(Array.from(parts)).toEqual(Array.from(whole));
  });

  it('jitters: two seeds give different points in the same cells', () => {
    const a = grid([[0, 1], [0, 1]], 16, createRng(1));
    const b = grid([[0, 1], [0, 1]], 16, createRng(2));
    expect(Array.from(a)).not.toEqual(Array.from(b));
  });
});
