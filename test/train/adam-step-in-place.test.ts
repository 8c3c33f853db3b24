import { describe, expect, it } from 'vitest';
import { adamStepInPlace } from '../../src/train/adam-step-in-place.js';

describe('adamStepInPlace', () => {
  it('moves each parameter by about the step size against the gradient sign on the first step', () => {
    // Kingma & Ba (ICLR 2015), Sec. 2.1: after bias correction, step 1 is
    // θ − α g / (|g| + ε), i.e. a move of (almost exactly) α whatever the gradient's scale.
    const params = new Float64Array([1, -2, 0.5]);
    const grad = new Float64Array([3, -0.001, 250]);
    const m = new Float64Array(3);
    const v = new Float64Array(3);
    adamStepInPlace(params, grad, m, v, 1, { learningRate: 0.1 });
    const expected = [1 - (0.1 * 3) / (3 + 1e-8), -2 + (0.1 * 0.001) / (0.001 + 1e-8), 0.5 - (0.1 * 250) / (250 + 1e-8)];
    // float64 rounding of a handful of operations: relative error ~1e-16; 1e-12 leaves headroom.
    const ROUNDING = 1e-12;
    params.forEach((p, i) => expect(Math.abs(p - expected[i]!)).toBeLessThan(ROUNDING));
    // The moments hold the paper's (uncorrected) running averages.
    expect(Array.from(m)).toEqual(Array.from(grad).map((g) => (1 - 0.9) * g));
    expect(Array.from(v)).toEqual(Array.from(grad).map((g) => (1 - 0.999) * g * g));
  });

  it('leaves the gradient unchanged', () => {
    const grad = new Float64Array([1, 2]);
    adamStepInPlace(new Float64Array(2), grad, new Float64Array(2), new Float64Array(2), 1, { learningRate: 1 });
    expect(Array.from(grad)).toEqual([1, 2]);
  });
});
