import { describe, expect, it } from 'vitest';
import { createRng, heInit } from '../../src/train/index.js';

describe('heInit', () => {
  it('draws weights with mean 0 and variance 2 / fan_in, and zero biases', () => {
    const [layer] = heInit([200, 500], createRng(11));
    const w = layer!.weights;
    const n = w.length;
    let sum = 0;
    let sumSq = 0;
    for (const v of w) {
      sum += v;
      sumSq += v * v;
    }
    const variance = 2 / 200; // He et al. (ICCV 2015), eq. (10): Var[w] = 2 / n_l
    // Normal weights: SE of the mean is sqrt(var / n) and of the variance sqrt(2 / n)·var
    // (n = 100,000); 5 standard errors each keep false failures out.
    expect(Math.abs(sum / n)).toBeLessThan(5 * Math.sqrt(variance / n));
    expect(Math.abs(sumSq / n - variance)).toBeLessThan(5 * Math.sqrt(2 / n) * variance);
    expect(Array.from(layer!.bias).every((b) => b === 0)).toBe(true);
  });

  it('gives a fourth moment of 3·variance², as a normal distribution has', () => {
    // Guards the Box–Muller transform: uniform or other non-normal weights with the right
    // variance would show a kurtosis far from 3 (1.8 for a uniform).
    const [layer] = heInit([2, 100_000], createRng(12));
    const w = layer!.weights;
    let m2 = 0;
    let m4 = 0;
    for (const v of w) {
      m2 += v * v;
      m4 += v ** 4;
    }
    const kurtosis = (m4 / w.length) / (m2 / w.length) ** 2;
    // Sample kurtosis of a normal: SE ≈ sqrt(24 / n) ≈ 0.011 at n = 200,000; 0.06 is ~5 SE.
    const KURTOSIS_TOLERANCE = 0.06;
    expect(Math.abs(kurtosis - 3)).toBeLessThan(KURTOSIS_TOLERANCE);
  });
});
