import { describe, expect, it } from 'vitest';
import { createRng, createRng32, fillFromRng, seedState, uniform32Rng, xoshiro128StarStar } from '../../src/sampling/rng.js';

/*
 * Check values: the reference C code of xoshiro128** 1.1 and splitmix64 (Blackman & Vigna,
 * ACM TOMS 2021, https://prng.di.unimi.it/), typed in by hand, compiled with gcc 12 here and run
 * (the program is reproduced in docs/sampling.md). Two of its outputs also match values known
 * from outside this project: splitmix64 from state 0 first gives 0xe220a8397b1dcdaf, and
 * xoshiro128** from state [1, 2, 3, 4] gives 11520, 0, 5927040, 70819200, … (the test vector of
 * the Rust rand_xoshiro crate) — both from memory, and both reproduced by the C program.
 */
describe('xoshiro128StarStar', () => {
  it('gives the reference outputs from state [1, 2, 3, 4]', () => {
    const next = xoshiro128StarStar(new Uint32Array([1, 2, 3, 4]));
    const got = Array.from({ length: 6 }, () => next());
    expect(got).toEqual([11520, 0, 5927040, 70819200, 2031721883, 1637235492]);
  });

  it('does not change the state it was given', () => {
    const state = new Uint32Array([1, 2, 3, 4]);
    const next = xoshiro128StarStar(state);
    next();
    next();
    expect(Array.from(state)).toEqual([1, 2, 3, 4]);
  });
});

describe('seedState', () => {
  it('fills the state from splitmix64 as the reference seeding does', () => {
    // splitmix64 from 0: first output 0xe220a8397b1dcdaf -> low word 0x7b1dcdaf, high 0xe220a839
    const s = seedState(0);
    expect(s[0]).toBe(0x7b1dcdaf);
    expect(s[1]).toBe(0xe220a839);
    // second output 0x6e789e6aa1b965f4
    expect(s[2]).toBe(0xa1b965f4);
    expect(s[3]).toBe(0x6e789e6a);
  });

  it('refuses seeds that are not safe integers', () => {
    expect(() => seedState(1.5)).toThrowErrorMatchingInlineSnapshot(`[ToolError: seed: expected an integer with |seed| <= 2^53, found 1.5]`);
    expect(() => seedState(Number.NaN)).toThrow('found NaN');
  });
});

describe('createRng', () => {
  it('gives the reference C program outputs for seeds 0, 42 and 20240601', () => {
    // raw 32-bit outputs of the C program after seeding
    const raw = (seed: number): number[] => {
      const next = xoshiro128StarStar(seedState(seed));
      return Array.from({ length: 6 }, () => next());
    };
    expect(raw(0)).toEqual([3737715805, 2584255861, 2876756834, 3286328325, 1553311962, 1625202774]);
    expect(raw(42)).toEqual([1776835114, 4165204688, 17111135, 2317295270, 2792088233, 2554630222]);
    expect(raw(20240601)).toEqual([3865763728, 2928583729, 2344800337, 1191762289, 3077710244, 979031933]);
    // doubles: the C program printed (a*2^26 + b) * 2^-53 with %.17g, which round-trips exactly
    const draw = (seed: number): number[] => {
      const rng = createRng(seed);
      return Array.from({ length: 4 }, () => rng());
    };
    expect(draw(0)).toEqual([0.87025477440427201, 0.66979715053109778, 0.36165862067339571, 0.75919063867070502]);
    expect(draw(42)).toEqual([0.41370166815658871, 0.0039839933778147429, 0.65008370276388672, 0.68460201861414161]);
    expect(draw(20240601)).toEqual([0.90006825835901516, 0.54594136981277741, 0.71658525785765514, 0.75292124614224243]);
  });

  it('stays in [0, 1) and has the mean and variance of a uniform variable', () => {
    const rng = createRng(7);
    const n = 200_000;
    let sum = 0;
    let sumSq = 0;
    let outside = 0;
    for (let i = 0; i < n; i++) {
      const u = rng();
      if (!(u >= 0 && u < 1)) outside++;
      sum += u;
      sumSq += u * u;
    }
    expect(outside).toBe(0);
    const mean = sum / n;
    const variance = sumSq / n - mean * mean;
    // U(0,1): mean 1/2, variance 1/12. Standard error of the mean is sqrt(1/12/n) = 6.5e-4;
    // 5 standard errors (3.2e-3) would be exceeded by chance with probability < 1e-6.
    const MEAN_TOL = 3.2e-3;
    expect(Math.abs(mean - 0.5)).toBeLessThan(MEAN_TOL);
    // sd of u^2 is sqrt(1/5 - 1/9) = 0.298, standard error 6.7e-4; 5 of them bound it likewise
    const VAR_TOL = 3.4e-3;
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(VAR_TOL);
  });

  it('gives different streams for neighbouring seeds', () => {
    const a = createRng(1);
    const b = createRng(2);
    let same = 0;
    for (let i = 0; i < 1000; i++) if (a() === b()) same++;
    expect(same).toBe(0);
  });
});

describe('uniform32Rng', () => {
  /** 2^-32, exact in float64: the doubles are the 32-bit outputs scaled, with no rounding. */
  const TWO_POW_MINUS_32 = 1 / 4294967296;

  it('gives the reference outputs from state [1, 2, 3, 4], scaled by 2^-32', () => {
    // the Rust rand_xoshiro test vector (from memory; reproduced by the reference C program)
    const rng = uniform32Rng(new Uint32Array([1, 2, 3, 4]));
    const got = Array.from({ length: 6 }, () => rng() / TWO_POW_MINUS_32);
    expect(got).toEqual([11520, 0, 5927040, 70819200, 2031721883, 1637235492]);
  });

  it('gives the reference C program outputs after seeding, one at a time and in bulk alike', () => {
    // the raw outputs checked in createRng's test above, from the same C program
    const single = createRng32(42);
    expect(Array.from({ length: 3 }, () => single() / TWO_POW_MINUS_32)).toEqual([1776835114, 4165204688, 17111135]);
    const bulk = createRng32(42);
    const out = new Float64Array(8);
    bulk.fill(out, 2, 3);
    expect(Array.from(out.subarray(2, 5), (u) => u / TWO_POW_MINUS_32)).toEqual([1776835114, 4165204688, 17111135]);
    expect([out[0], out[1], out[5]]).toEqual([0, 0, 0]);
    // the stream continues where the bulk draw stopped
    expect(bulk() / TWO_POW_MINUS_32).toBe(2317295270);
  });

  it('keeps one stream whatever mix of single and bulk draws reads it', () => {
    const reference = xoshiro128StarStar(seedState(20240601));
    const rng = createRng32(20240601);
    const out = new Float64Array(700);
    let mismatches = 0;
    for (let round = 0; round < 20; round++) {
      if (round % 3 === 0) {
        rng.fill(out, 0, 35 * round);
        for (let i = 0; i < 35 * round; i++) if (out[i] !== reference() * TWO_POW_MINUS_32) mismatches++;
      } else if (rng() !== reference() * TWO_POW_MINUS_32) mismatches++;
    }
    expect(mismatches).toBe(0);
  });

  it('does not change the state it was given', () => {
    const state = new Uint32Array([1, 2, 3, 4]);
    const rng = uniform32Rng(state);
    rng();
    rng.fill(new Float64Array(10), 0, 10);
    expect(Array.from(state)).toEqual([1, 2, 3, 4]);
  });
});

describe('fillFromRng', () => {
  it('writes the values single draws would give, with or without a bulk fill', () => {
    const plain = createRng(3);
    const expected = Array.from({ length: 5 }, () => plain());
    const out = new Float64Array(6);
    fillFromRng(createRng(3), out, 1, 5);
    expect(Array.from(out.subarray(1))).toEqual(expected);
    const bulk = new Float64Array(5);
    fillFromRng(createRng32(3), bulk, 0, 5);
    const single = createRng32(3);
    expect(Array.from(bulk)).toEqual(Array.from({ length: 5 }, () => single()));
  });
});
