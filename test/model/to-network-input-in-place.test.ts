import { describe, expect, it } from 'vitest';
import { toNetworkInputInPlace } from '../../src/model/to-network-input-in-place.js';

describe('toNetworkInputInPlace', () => {
  it('copies the requested rows to float32 when there is no normalisation', () => {
    const x = Float64Array.from([1, 2, 3, 4, 5, 6]);
    const out = new Float32Array(4).fill(-1);
    toNetworkInputInPlace(x, 1, 2, 2, undefined, Float64Array.of(1, 1), out);
    expect(Array.from(out)).toEqual([3, 4, 5, 6]);
  });

  it('computes (x − offset) / scale per input', () => {
    const out = new Float32Array(2);
    toNetworkInputInPlace(Float64Array.from([12, -3]), 0, 1, 2, Float64Array.of(10, -4), Float64Array.of(2, 0.5), out);
    expect(Array.from(out)).toEqual([1, 2]);
  });

  it('rounds to float32 once, after the float64 arithmetic', () => {
    // 0.1 and 0.7 are not float32 values; rounding the operands first would give a different float32
    const x = 0.7;
    const out = new Float32Array(1);
    toNetworkInputInPlace(Float64Array.from([x]), 0, 1, 1, Float64Array.of(0.1), Float64Array.of(3), out);
    expect(out[0]).toBe(Math.fround((x - 0.1) / 3));
  });
});
