import { describe, expect, it } from 'vitest';
import { spaceFillingRows } from '../../src/sampling/space-filling.js';
import { grid } from '../../src/sampling/grid.js';
import { sobol } from '../../src/sampling/sobol.js';
import { createRng32 } from '../../src/sampling/rng.js';

const box = [[0, 2], [-1, 1], [10, 20]] as const;

/** The rows made at once, as sampleDomain made them before batches: the grid, then the shifted Sobol points mapped to the box. */
function atOnce(initial: number, seed: number): Float64Array {
  const rng = createRng32(seed);
  const g = grid(box, Math.floor(initial / 2), rng);
  const s = sobol(initial - g.length / 3, 3, rng);
  const out = new Float64Array(initial * 3);
  out.set(g);
  for (let i = 0; i < s.length; i++) out[g.length + i] = box[i % 3]![0] + s[i]! * (box[i % 3]![1] - box[i % 3]![0]);
  return out;
}

describe('spaceFillingRows', () => {
  it('writes the same rows in batches of any size as the grid and Sobol points made at once', () => {
    for (const cuts of [[1000], [7, 500, 493], [1, 1, 998], [343, 657]]) {
      const x = new Float64Array(1000 * 3);
      const write = spaceFillingRows(box, 1000, createRng32(5), x);
      let at = 0;
      for (const c of cuts) {
        write(at, c);
        at += c;
      }
      // 7^3 = 343 grid cells within the 500 of the grid's half
      expect(Array.from(x)).toEqual(Array.from(atOnce(1000, 5)));
    }
  });

  it('refuses rows out of order', () => {
    const write = spaceFillingRows(box, 100, createRng32(5), new Float64Array(300));
    write(0, 10);
    expect(() => write(20, 10)).toThrow('expected rows from 10 up to 100, asked for [20, 30)');
  });
});
