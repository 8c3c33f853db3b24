import { describe, expect, it } from 'vitest';
import { writeMlpOnnx } from '../../src/model/onnx-write.js';
import { decide, forward, readOnnxNetwork } from '../../src/prove/index.js';
import { mulberry32, randomMlp, runOrt, samplePoints } from './helpers.js';

/**
 * float64 forward pass over float32 weights against onnxruntime's float32 evaluation. The
 * difference is float32 rounding only: at most γ_n·Σ|w||x| per layer (Higham, Accuracy and
 * Stability of Numerical Algorithms, 2002, §3.1), i.e. about 50·6e-8 of the sum of |terms|
 * for 50-wide layers; measured differences on these networks are ~1e-8 for scores of order 1.
 * 1e-5 relative to the score scale is a generous bound for the runtime's summation order.
 */
const FORWARD_REL_TOL = 1e-5;

describe('forward', () => {
  for (const [seed, sizes] of [
    [11, [5, 50, 50, 50, 50, 50, 50, 5]],
    [12, [3, 8, 4]],
    [13, [2, 1, 1]],
    [14, [7, 30, 30, 9]],
  ] as const) {
    it(`agrees with onnxruntime on a ${sizes.join('-')} ReLU network`, async () => {
      const rng = mulberry32(seed);
      const bytes = writeMlpOnnx(randomMlp(rng, sizes));
      const r = readOnnxNetwork(bytes);
      if (!r.supported) throw new Error(r.reason);
      const d = sizes[0];
      const n = 500;
      const x = samplePoints(rng, new Array(d).fill(-2), new Array(d).fill(2), n);
      const ours = forward(r.network, x, n);
      const theirs = await runOrt(bytes, x, n, d);
      let scale = 0;
      for (const v of theirs) scale = Math.max(scale, Math.abs(v));
      let worst = 0;
      for (let i = 0; i < ours.length; i++) worst = Math.max(worst, Math.abs(ours[i]! - theirs[i]!));
      expect(worst).toBeLessThanOrEqual(FORWARD_REL_TOL * (1 + scale));
      // and it is not trivially zero: the network computes something that varies
      expect(scale).toBeGreaterThan(0);
    });
  }

  it('does not change its input', () => {
    const r = readOnnxNetwork(writeMlpOnnx(randomMlp(mulberry32(3), [2, 3, 2])));
    if (!r.supported) throw new Error(r.reason);
    const x = Float64Array.of(0.5, -0.25);
    const before = Array.from(x);
    forward(r.network, x, 1);
    expect(Array.from(x)).toEqual(before);
  });
});

describe('decide', () => {
  it('takes the largest (argmax) or smallest (argmin) score, the first on ties', () => {
    const scores = [1, 3, 3, 0, -2, 5, 5, -2];
    expect(Array.from(decide(scores, 2, 4, 'argmax'))).toEqual([1, 1]);
    expect(Array.from(decide(scores, 2, 4, 'argmin'))).toEqual([3, 0]);
  });
});
