import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ACTIVATION_ABS_ERROR, float32Down, float32Up, gamma, ROUNDING_UNIT } from '../../src/prove/float-error.js';
import { networkBoxInPlace } from '../../src/prove/input-box.js';
import { graphModel, runOrt } from './helpers.js';

describe('float32 outward rounding', () => {
  it('brackets every double by adjacent float32 values (property, seeded)', () => {
    fc.assert(
      fc.property(fc.double({ min: -3e38, max: 3e38, noNaN: true }), (x) => {
        const lo = float32Down(x);
        const hi = float32Up(x);
        expect(Math.fround(lo)).toBe(lo);
        expect(Math.fround(hi)).toBe(hi);
        expect(lo <= x && x <= hi).toBe(true);
        // no float32 strictly between: rounding x to nearest lands on one of them
        expect([lo, hi]).toContain(Math.fround(x));
        if (lo !== hi) expect(float32Up(lo + (hi - lo) / 4)).toBe(hi);
      }),
      { seed: 12345, numRuns: 2000 },
    );
  });

  it('steps across zero and to the largest float32', () => {
    expect(float32Down(1e-50)).toBe(0);
    expect(float32Up(1e-50)).toBe(2 ** -149);
    expect(float32Down(-1e-50)).toBe(-(2 ** -149));
    expect(float32Down(1e39)).toBe(Math.fround(3.4028234663852886e38));
  });

  it('gives γ_n = n u / (1 − n u) (Higham 2002, eq. 3.8)', () => {
    expect(ROUNDING_UNIT).toBe(2 ** -23);
    expect(gamma(1)).toBeCloseTo(2 ** -23 / (1 - 2 ** -23), 30);
    expect(gamma(100)).toBeGreaterThan(100 * 2 ** -23);
  });

  it('maps a box in units to a float32 box containing every normalised input', () => {
    const outLo = new Float64Array(2);
    const outHi = new Float64Array(2);
    const normalize = { offset: [0.1, -7], scale: [0.3, -3] };
    networkBoxInPlace([0.7, 1], [0.9, 2], 0, 2, normalize, outLo, outHi, 0);
    for (const x of [
      [0.7, 1],
      [0.9, 2],
      [0.8, 1.5],
    ]) {
      for (let i = 0; i < 2; i++) {
        const t = Math.fround((x[i]! - normalize.offset[i]!) / normalize.scale[i]!);
        expect(t >= outLo[i]! && t <= outHi[i]!).toBe(true);
      }
    }
    // a negative scale swaps the ends: (1 + 7)/(−3) is the upper end
    expect(outHi[1]!).toBeGreaterThanOrEqual(-8 / 3);
    expect(outLo[1]!).toBeLessThanOrEqual(-3);
  });
});

describe('the runtime activation error assumption', () => {
  it('holds with a factor of four to spare on a dense float32 sweep of Sigmoid and Tanh', async () => {
    // ACTIVATION_ABS_ERROR is an assumption about onnxruntime's float32 kernels: re-measure it
    // against Math.tanh and 1 / (1 + e^-x) (float64, within ~1e-16) on 200,001 points in [-20, 20]
    const n = 200_001;
    const x = new Float32Array(n);
    for (let i = 0; i < n; i++) x[i] = -20 + (40 * i) / (n - 1);
    for (const op of ['Sigmoid', 'Tanh'] as const) {
      const bytes = graphModel([{ name: 'act', opType: op, input: ['x'], output: ['y'] }], [], 1, 1);
      const y = await runOrt(bytes, x, n, 1);
      let worst = 0;
      for (let i = 0; i < n; i++) {
        const exact = op === 'Tanh' ? Math.tanh(x[i]!) : 1 / (1 + Math.exp(-x[i]!));
        worst = Math.max(worst, Math.abs(y[i]! - exact));
      }
      expect(worst).toBeLessThan(ACTIVATION_ABS_ERROR / 4);
      // and the sweep saw the runtime's own rounding, so it measured something
      expect(worst).toBeGreaterThan(0);
    }
  });
});
