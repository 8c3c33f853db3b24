import type { Normalization } from '../types.js';

/**
 * Writes rows of inputs, in scenario units, into the network's float32 input buffer, applying
 * the scenario's normalisation `(x - offset) / scale` (docs/formats.md) in float64 first, so
 * each value is rounded to float32 exactly once.
 *
 * Writes `out[0 .. rows·d)` in place.
 * @param x row-major n × d matrix, float64, scenario units (read only)
 * @param firstRow first row of `x` to convert
 * @param rows number of rows
 * @param d inputs per row
 * @param normalize the scenario's normalisation, or undefined for none
 * @param out float32 buffer of at least rows × d values
 */
export function toNetworkInputInPlace(
  x: Float64Array,
  firstRow: number,
  rows: number,
  d: number,
  normalize: Normalization | undefined,
  out: Float32Array,
): void {
  const start = firstRow * d;
  const count = rows * d;
  if (normalize === undefined) {
    for (let i = 0; i < count; i++) out[i] = x[start + i]!;
    return;
  }
  const { offset, scale } = normalize;
  for (let r = 0; r < rows; r++) {
    const o = r * d;
    for (let j = 0; j < d; j++) out[o + j] = (x[start + o + j]! - offset[j]!) / scale[j]!;
  }
}
