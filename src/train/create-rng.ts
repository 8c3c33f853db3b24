import { createRng32 } from '../sampling/index.js';

/**
 * A seeded uniform random source on [0, 1) for training: the xoshiro128** generator of the
 * sampling stage (Blackman & Vigna, "Scrambled linear pseudorandom number generators", ACM
 * TOMS 47(4), 2021), its state filled from the seed by SplitMix64 (Steele, Lea & Flood,
 * OOPSLA 2014), each call returning `output / 2^32`: 32 bits of resolution, plenty for
 * shuffling, initial weights and sampling a small box. One implementation serves both stages
 * (src/sampling/rng.ts `createRng32`).
 *
 * @param seed an integer with |seed| <= 2^53 (taken modulo 2^64; negative seeds are allowed)
 * @returns a function returning the next uniform number in [0, 1)
 */
export function createRng(seed: number): () => number {
  return createRng32(Math.trunc(seed));
}
