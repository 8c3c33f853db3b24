import type { Normalization } from '../types.js';
import { float32Down, float32Up, roundDown, roundUp } from './float-error.js';

/**
 * From scenario units to what the network receives. The model stage computes the network
 * input as fl32((x − offset) / scale): the normalisation in float64, then one rounding to
 * float32 (src/types.ts, "model/ applies the optional normalisation and converts to float32
 * at the ONNX boundary"). Both maps below rely on exactly that.
 */

/**
 * The smallest box of float32 values containing every network input the model can receive
 * for scenario inputs in the closed box: each bound is mapped in float64, rounded outward
 * for the two float64 operations, then rounded outward to float32. Round-to-nearest is
 * monotone, so fl32 of any value in the interval lies between the outward-rounded ends.
 *
 * @param lo lower corner in scenario units (d values, from `offset`)
 * @param hi upper corner
 * @param outLo receives the network-input lower corner at `outOffset`
 */
export function networkBoxInPlace(
  lo: ArrayLike<number>,
  hi: ArrayLike<number>,
  offset: number,
  d: number,
  normalize: Normalization | undefined,
  outLo: Float64Array,
  outHi: Float64Array,
  outOffset: number,
): void {
  for (let i = 0; i < d; i++) {
    let a = lo[offset + i]!;
    let b = hi[offset + i]!;
    if (normalize) {
      const off = normalize.offset[i]!;
      const sc = normalize.scale[i]!;
      const ta = (a - off) / sc;
      const tb = (b - off) / sc;
      a = roundDown(Math.min(ta, tb));
      b = roundUp(Math.max(ta, tb));
    }
    outLo[outOffset + i] = float32Down(a);
    outHi[outOffset + i] = float32Up(b);
  }
}

/**
 * The network inputs the model computes for points in scenario units: fl32((x − offset)/scale).
 * @param x n × d scenario-unit points (not changed)
 */
export function toNetworkInput(x: Float64Array, n: number, d: number, normalize: Normalization | undefined): Float64Array {
  const out = new Float64Array(n * d);
  for (let r = 0; r < n; r++) {
    for (let i = 0; i < d; i++) {
      const v = x[r * d + i]!;
      out[r * d + i] = Math.fround(normalize ? (v - normalize.offset[i]!) / normalize.scale[i]! : v);
    }
  }
  return out;
}

/** A network-input point back in scenario units (t·scale + offset), clamped into [lo, hi]. */
export function toScenarioUnits(t: number, i: number, normalize: Normalization | undefined, lo: number, hi: number): number {
  const v = normalize ? t * normalize.scale[i]! + normalize.offset[i]! : t;
  return Math.min(hi, Math.max(lo, v));
}
