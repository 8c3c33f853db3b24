/**
 * A seeded linear congruential generator for test data, returning values in [0, 1).
 * Constants a = 1664525, c = 1013904223, modulus 2^32 from Press et al., Numerical Recipes in C,
 * 2nd ed., Cambridge University Press, 1992, §7.1 ("quick and dirty" generator). Test data only.
 */
export function lcg(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 4294967296;
  };
}
