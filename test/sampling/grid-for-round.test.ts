import { describe, expect, it } from 'vitest';
import { cellIndex, gridForRound, normalisedAt } from '../../src/sampling/grid-for-round.js';
import { createRng } from '../../src/sampling/rng.js';

describe('gridForRound', () => {
  const box = Object.freeze([[0, 2], [-1, 1], [3, 3]] as const);

  it('picks g with about perCell samples per cell and a (g + 1)^d index range', () => {
    const grid = gridForRound(box, 8000, 8, createRng(1)); // (8000/8)^(1/3) = 10
    expect(grid.perAxis).toBe(10);
    expect(grid.cells).toBe(11 ** 3);
    expect(Array.from(grid.scale)).toEqual([0.5, 0.5, 0]);
    expect(grid.offset.every((o) => o >= 0 && o < 1)).toBe(true);
  });

  it('maps every point of the box, corners included, to a cell in range', () => {
    const grid = gridForRound(box, 1000, 8, createRng(2));
    const corners = new Float64Array([0, -1, 3, 2, 1, 3, 0, 1, 3, 2, -1, 3, 1, 0, 3]);
    for (let i = 0; i < 5; i++) {
      const c = cellIndex(corners, i, 3, grid);
      expect(Number.isInteger(c) && c >= 0 && c < grid.cells).toBe(true);
      for (let j = 0; j < 3; j++) {
        const u = normalisedAt(corners, i, j, 3, grid);
        expect(u >= 0 && u <= 1).toBe(true);
      }
    }
    // the zero-width axis normalises to 0; the others linearly
    expect(normalisedAt(corners, 4, 0, 3, grid)).toBe(0.5);
    expect(normalisedAt(corners, 4, 2, 3, grid)).toBe(0);
  });

  it('puts points one cell apart on an axis into different cells', () => {
    const grid = gridForRound([[0, 1]], 100, 10, createRng(3)); // g = 10
    const x = new Float64Array([0.05, 0.15, 0.25]);
    const cells = [0, 1, 2].map((i) => cellIndex(x, i, 1, grid));
    expect(new Set(cells).size).toBe(3);
  });
});
