import { describe, expect, it } from 'vitest';
import { sobol, sobolInPlace, sobolRangeInPlace, sobolShift, SOBOL_MAX_DIMENSION } from '../../src/sampling/sobol.js';
import { createRng } from '../../src/sampling/rng.js';

/*
 * Reference points: scipy 1.17.1, `scipy.stats.qmc.Sobol(d, scramble=False, bits=32)`, which
 * uses the new-joe-kuo-6.21201 direction numbers and the same Gray-code order; computed on this
 * machine and pasted here (integers are coordinates × 2^32, all exact in float64).
 */
const TWO_POW_32 = 4294967296;

function row(points: Float64Array, d: number, i: number): number[] {
  return Array.from(points.subarray(i * d, (i + 1) * d));
}

describe('sobol', () => {
  it('starts with the well-known first points of the 3-D sequence', () => {
    const p = sobol(8, 3);
    // scipy: [[0,0,0],[.5,.5,.5],[.75,.25,.25],[.25,.75,.75],[.375,.375,.625],[.875,.875,.125],
    //         [.625,.125,.875],[.125,.625,.375]]
    expect(Array.from(p)).toEqual([
      0, 0, 0, 0.5, 0.5, 0.5, 0.75, 0.25, 0.25, 0.25, 0.75, 0.75, 0.375, 0.375, 0.625, 0.875, 0.875, 0.125,
      0.625, 0.125, 0.875, 0.125, 0.625, 0.375,
    ]);
  });

  it('matches scipy in all 21 dimensions, including deep into the sequence', () => {
    expect(SOBOL_MAX_DIMENSION).toBe(21);
    const d = 21;
    const p = sobol(123457, d);
    // scipy points 100 and 1023 (coordinates are multiples of 2^-7 and 2^-10, exact)
    expect(row(p, d, 100)).toEqual([
      0.4140625, 0.2578125, 0.7734375, 0.7265625, 0.8828125, 0.7421875, 0.0234375, 0.4765625, 0.6328125, 0.6953125,
      0.4609375, 0.6796875, 0.4765625, 0.8515625, 0.3203125, 0.4921875, 0.6796875, 0.7421875, 0.8359375, 0.3359375,
      0.7578125,
    ]);
    expect(row(p, d, 1023)).toEqual([
      0.0009765625, 0.7529296875, 0.6123046875, 0.1455078125, 0.1865234375, 0.4384765625, 0.1396484375,
      0.6181640625, 0.3447265625, 0.8505859375, 0.6787109375, 0.0361328125, 0.1298828125, 0.6650390625,
      0.3623046875, 0.4638671875, 0.3134765625, 0.8759765625, 0.5849609375, 0.3193359375, 0.8662109375,
    ]);
    // scipy point 123456 (after fast_forward(123456)), × 2^32
    expect(row(p, d, 123456).map((v) => v * TWO_POW_32)).toEqual([
      113803264, 784891904, 1319665664, 1934065664, 726630400, 872972288, 3074457600, 1993113600, 3034218496,
      1069711360, 2143649792, 3355148288, 2370732032, 1204518912, 3278536704, 2840559616, 2453766144, 1596227584,
      3788210176, 674988032, 507215872,
    ]);
  });

  it('starts a range at scipy point 123456 (fast_forward) from its Gray code, not by stepping', () => {
    const d = 21;
    const out = new Float64Array(2 * d);
    sobolRangeInPlace(123456, 2, new Int32Array(d), out, 0);
    // scipy point 123456, × 2^32 (as above)
    expect(row(out, d, 0).map((v) => v * TWO_POW_32)).toEqual([
      113803264, 784891904, 1319665664, 1934065664, 726630400, 872972288, 3074457600, 1993113600, 3034218496,
      1069711360, 2143649792, 3355148288, 2370732032, 1204518912, 3278536704, 2840559616, 2453766144, 1596227584,
      3788210176, 674988032, 507215872,
    ]);
    expect(row(out, d, 1)).toEqual(row(sobol(123458, d), d, 123457));
  });

  it('gives the whole shifted sequence when made in ranges, from the same shift', () => {
    const d = 5;
    const whole = sobol(1000, d, createRng(8));
    const shift = sobolShift(d, createRng(8));
    const parts = new Float64Array(1000 * d);
    for (const [first, n] of [[0, 1], [1, 300], [301, 211], [512, 488]] as const) sobolRangeInPlace(first, n, shift, parts, first);
    expect(Array.from(parts)).toEqual(Array.from(whole));
  });

  it('maps a range to a box as it writes it: lo + u·width, bit for bit as mapping the unit-cube points afterwards', () => {
    const d = 3;
    const lo = Float64Array.from([-2, 0, 1e6]);
    const width = Float64Array.from([4, 0.3, 7e5]);
    const shift = sobolShift(d, createRng(9));
    const unit = new Float64Array(200 * d);
    sobolRangeInPlace(37, 200, shift, unit, 0);
    const boxed = new Float64Array(200 * d);
    sobolRangeInPlace(37, 200, shift, boxed, 0, lo, width);
    // the same double operations in the same order, so equality is exact (no tolerance)
    expect(Array.from(boxed)).toEqual(Array.from(unit, (u, i) => lo[i % d]! + u * width[i % d]!));
  });

  it('puts exactly one of the first 2^m shifted points in every elementary interval of the 2-D net', () => {
    // Sobol's first two dimensions form a (0, m, 2)-net in base 2 (Sobol 1967; Niederreiter,
    // "Random number generation and quasi-Monte Carlo methods", SIAM 1992, ch. 4); a digital shift keeps it.
    const m = 10;
    const n = 2 ** m;
    for (const seed of [1, 2]) {
      const p = sobol(n, 2, createRng(seed));
      for (let a = 0; a <= m; a++) {
        const counts = new Int32Array(n);
        for (let i = 0; i < n; i++) {
          const cx = Math.floor(p[2 * i]! * 2 ** a);
          const cy = Math.floor(p[2 * i + 1]! * 2 ** (m - a));
          counts[cx * 2 ** (m - a) + cy]!++;
        }
        expect(counts.every((c) => c === 1)).toBe(true);
      }
    }
  });

  it('stratifies every one of the 21 coordinates on its own', () => {
    // each coordinate of a Sobol sequence is a (0, m, 1)-net: one point per interval [j/2^m, (j+1)/2^m)
    const m = 9;
    const n = 2 ** m;
    const d = SOBOL_MAX_DIMENSION;
    const p = sobol(n, d, createRng(3));
    for (let j = 0; j < d; j++) {
      const counts = new Int32Array(n);
      for (let i = 0; i < n; i++) counts[Math.floor(p[i * d + j]! * n)]!++;
      expect(counts.every((c) => c === 1)).toBe(true);
    }
  });

  it('gives different point sets for different seeds and the same set for the same seed', () => {
    const a = sobol(64, 4, createRng(11));
    const b = sobol(64, 4, createRng(11));
    const c = sobol(64, 4, createRng(12));
    expect(Array.from(a)).toEqual(Array.from(b));
    expect(Array.from(a)).not.toEqual(Array.from(c));
    expect(a.every((v) => v >= 0 && v < 1)).toBe(true);
  });

  it('writes the same points in place from a given row', () => {
    const out = new Float64Array(3 * 20).fill(-1);
    sobolInPlace(16, 3, createRng(5), out, 4);
    expect(Array.from(out.subarray(0, 12))).toEqual(new Array<number>(12).fill(-1));
    expect(Array.from(out.subarray(12))).toEqual(Array.from(sobol(16, 3, createRng(5))));
    expect(() => sobolInPlace(17, 3, undefined, out, 4)).toThrow('expected room for 17 rows from row 4, found 20 rows');
  });

  it('refuses dimensions beyond the table', () => {
    expect(() => sobol(4, 22)).toThrowErrorMatchingInlineSnapshot(`[ToolError: sobol: expected 1 to 21 dimensions, found 22]`);
    expect(() => sobol(-1, 2)).toThrow('found -1');
  });
});
