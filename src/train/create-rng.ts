const MASK64 = (1n << 64n) - 1n;

/**
 * SplitMix64, used only to expand a seed into generator state, as its authors recommend.
 * G. L. Steele Jr., D. Lea & C. H. Flood, "Fast splittable pseudorandom number generators",
 * OOPSLA 2014. BigInt is fine here: it runs four times per generator, never per sample.
 */
function splitMix64(state: { s: bigint }): bigint {
  state.s = (state.s + 0x9e3779b97f4a7c15n) & MASK64;
  let z = state.s;
  z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
  z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
  return z ^ (z >> 31n);
}

/**
 * A seeded uniform random source on [0, 1): the xoshiro128** generator.
 *
 * D. Blackman & S. Vigna, "Scrambled linear pseudorandom number generators", ACM Transactions
 * on Mathematical Software 47(4), article 36, 2021 (https://prng.di.unimi.it/). 128-bit state,
 * period 2^128 − 1, 32-bit outputs, all in 32-bit integer arithmetic (Math.imul), so it is
 * fast in JavaScript. The state is filled from the seed by SplitMix64 (low word first), which
 * never yields the forbidden all-zero state in practice and decorrelates nearby seeds.
 *
 * Each call returns `output / 2^32`: 32 bits of resolution, which is plenty for shuffling,
 * initial weights and sampling a 5-input box.
 *
 * @param seed any integer (taken modulo 2^64; negative seeds are allowed)
 * @returns a function returning the next uniform number in [0, 1)
 */
export function createRng(seed: number): () => number {
  const init = { s: BigInt.asUintN(64, BigInt(Math.trunc(seed))) };
  const a = splitMix64(init);
  const b = splitMix64(init);
  let s0 = Number(a & 0xffffffffn) | 0;
  let s1 = Number(a >> 32n) | 0;
  let s2 = Number(b & 0xffffffffn) | 0;
  let s3 = Number(b >> 32n) | 0;
  return () => {
    const m = Math.imul(s1, 5);
    const result = Math.imul((m << 7) | (m >>> 25), 9);
    const t = s1 << 9;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = (s3 << 11) | (s3 >>> 21);
    return (result >>> 0) / 4294967296;
  };
}
