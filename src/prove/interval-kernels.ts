import type { AffineLayer } from './network.js';
import { ACTIVATION_ABS_ERROR, MAX_SAFE_MAGNITUDE, NOISE_INFLATION, roundDown, roundUp } from './float-error.js';

/**
 * The inner loops of interval propagation (interval.ts), on n boxes stored as centre and
 * radius rows of `stride` doubles.
 */

/** Float64 rounding of Math.exp/Math.tanh, added to the runtime's activation error. */
export const ACTIVATION_GUARD = ACTIVATION_ABS_ERROR + 2 ** -40;

const absCache = new WeakMap<AffineLayer, Float64Array>();

/** |W| of a layer, computed once per layer. */
export function absWeights(layer: AffineLayer): Float64Array {
  let a = absCache.get(layer);
  if (!a) {
    a = layer.weights.map(Math.abs);
    absCache.set(layer, a);
  }
  return a;
}

/** Boxes per block: block q holds value k of its box l at q·stride·LANES + k·LANES + l. */
export const LANES = 8;
const activeIndex = new Int32Array(4096);

/**
 * c' = W c + b and r' = |W| r for blocks of LANES boxes stored interleaved, so each weight
 * load serves eight boxes from one cache line; inputs that are exactly zero (c = r = 0, an
 * inactive ReLU) in all eight boxes are skipped. (affine-wasm.ts computes the same sums, in
 * the same order, with WebAssembly SIMD.)
 */
export function affineProductBlocks(layer: AffineLayer, aw: Float64Array, cc: Float64Array, rr: Float64Array, nc: Float64Array, nr: Float64Array, blocks: number, stride: number): void {
  const { inSize, outSize, weights, bias } = layer;
  const idx = activeIndex;
  for (let q = 0; q < blocks; q++) {
    const base = q * stride * LANES;
    let na = 0;
    for (let k = 0; k < inSize; k++) {
      let any = 0;
      for (let l = 0; l < LANES; l++) any += Math.abs(cc[base + k * LANES + l]!) + rr[base + k * LANES + l]!;
      if (any !== 0) idx[na++] = k;
    }
    for (let j = 0; j < outSize; j++) {
      const row = j * inSize;
      const b = bias[j]!;
      let c0 = b, c1 = b, c2 = b, c3 = b, c4 = b, c5 = b, c6 = b, c7 = b;
      for (let t = 0; t < na; t++) {
        const k = idx[t]!;
        const p = base + k * LANES;
        const w = weights[row + k]!;
        c0 += w * cc[p]!;
        c1 += w * cc[p + 1]!;
        c2 += w * cc[p + 2]!;
        c3 += w * cc[p + 3]!;
        c4 += w * cc[p + 4]!;
        c5 += w * cc[p + 5]!;
        c6 += w * cc[p + 6]!;
        c7 += w * cc[p + 7]!;
      }
      let r0 = 0, r1 = 0, r2 = 0, r3 = 0, r4 = 0, r5 = 0, r6 = 0, r7 = 0;
      for (let t = 0; t < na; t++) {
        const k = idx[t]!;
        const p = base + k * LANES;
        const a = aw[row + k]!;
        r0 += a * rr[p]!;
        r1 += a * rr[p + 1]!;
        r2 += a * rr[p + 2]!;
        r3 += a * rr[p + 3]!;
        r4 += a * rr[p + 4]!;
        r5 += a * rr[p + 5]!;
        r6 += a * rr[p + 6]!;
        r7 += a * rr[p + 7]!;
      }
      const o = base + j * LANES;
      nc[o] = c0;
      nc[o + 1] = c1;
      nc[o + 2] = c2;
      nc[o + 3] = c3;
      nc[o + 4] = c4;
      nc[o + 5] = c5;
      nc[o + 6] = c6;
      nc[o + 7] = c7;
      nr[o] = r0;
      nr[o + 1] = r1;
      nr[o + 2] = r2;
      nr[o + 3] = r3;
      nr[o + 4] = r4;
      nr[o + 5] = r5;
      nr[o + 6] = r6;
      nr[o + 7] = r7;
    }
  }
}

/**
 * Adds each affine output's float32 error bound e = (s_j·M + c_j)·NOISE_INFLATION to its
 * radius, M = max_k |c_k| + r_k over the layer's input (cc, rr) per box, and marks boxes whose
 * bounds reach MAX_SAFE_MAGNITUDE in `over`.
 */
export function addNoiseBlocksInPlace(layer: AffineLayer, cc: Float64Array, rr: Float64Array, nc: Float64Array, nr: Float64Array, blocks: number, stride: number, over: Uint8Array): void {
  const { inSize, outSize, errorScale, errorConst } = layer;
  const m = new Float64Array(LANES);
  for (let q = 0; q < blocks; q++) {
    const base = q * stride * LANES;
    m.fill(0);
    for (let k = 0; k < inSize; k++) {
      for (let l = 0; l < LANES; l++) {
        const v = Math.abs(cc[base + k * LANES + l]!) + rr[base + k * LANES + l]!;
        if (v > m[l]!) m[l] = v;
      }
    }
    for (let j = 0; j < outSize; j++) {
      const o = base + j * LANES;
      const s = errorScale[j]!;
      const e0 = errorConst[j]!;
      for (let l = 0; l < LANES; l++) {
        nr[o + l]! += (s * m[l]! + e0) * NOISE_INFLATION;
        if (Math.abs(nc[o + l]!) + nr[o + l]! > MAX_SAFE_MAGNITUDE) over[q * LANES + l] = 1;
      }
    }
  }
}

/**
 * The same step for one box stored plainly (used for per-layer traces), with the per-input
 * error bound e_j = (Σ_k E_jk (|c_k| + r_k) + c_j)·NOISE_INFLATION written to `noise`.
 */
export function affineStepSingle(layer: AffineLayer, aw: Float64Array, cc: Float64Array, rr: Float64Array, nc: Float64Array, nr: Float64Array, noise: Float64Array): boolean {
  const { inSize, outSize, weights, bias, errorWeights, errorConst } = layer;
  let overflow = false;
  for (let j = 0; j < outSize; j++) {
    const row = j * inSize;
    let c = bias[j]!;
    let r = 0;
    let err = errorConst[j]!;
    for (let k = 0; k < inSize; k++) {
      c += weights[row + k]! * cc[k]!;
      r += aw[row + k]! * rr[k]!;
      err += errorWeights[row + k]! * (Math.abs(cc[k]!) + rr[k]!);
    }
    const e = err * NOISE_INFLATION;
    noise[j] = e;
    nc[j] = c;
    nr[j] = r + e;
    if (Math.abs(c) + r + e > MAX_SAFE_MAGNITUDE) overflow = true;
  }
  return overflow;
}

/** ReLU on intervals [c − r, c + r], rounded outward: `count` values at the start of each of `n` rows of `stride`. */
export function reluStepInPlace(cc: Float64Array, rr: Float64Array, n: number, stride: number, count: number): void {
  for (let b = 0; b < n; b++) {
    const base = b * stride;
    for (let j = base; j < base + count; j++) {
      const c = cc[j]!;
      const r = rr[j]!;
      const hi = roundUp(c + r);
      if (hi <= 0) {
        cc[j] = 0;
        rr[j] = 0;
      } else if (roundDown(c - r) < 0) {
        // unstable: [0, hi]; when c − r ≥ 0 the interval already encloses relu's output
        const h = roundUp(hi * 0.5);
        cc[j] = h;
        rr[j] = h;
      }
    }
  }
}

/** Sigmoid or tanh on intervals: monotone, so [f(lo), f(hi)] widened by ACTIVATION_GUARD. */
export function smoothStepInPlace(kind: 'sigmoid' | 'tanh', cc: Float64Array, rr: Float64Array, n: number, stride: number, count: number): void {
  for (let b = 0; b < n; b++) {
    const base = b * stride;
    for (let j = base; j < base + count; j++) {
      const lo = roundDown(cc[j]! - rr[j]!);
      const hi = roundUp(cc[j]! + rr[j]!);
      const flo = kind === 'tanh' ? Math.tanh(lo) : 1 / (1 + Math.exp(-lo));
      const fhi = kind === 'tanh' ? Math.tanh(hi) : 1 / (1 + Math.exp(-hi));
      setCentreRadius(cc, rr, j, flo - ACTIVATION_GUARD, fhi + ACTIVATION_GUARD);
    }
  }
}

/** Writes a centre and radius whose interval encloses [lo, hi]. */
export function setCentreRadius(c: Float64Array, r: Float64Array, i: number, lo: number, hi: number): void {
  const mid = 0.5 * lo + 0.5 * hi;
  c[i] = mid;
  r[i] = roundUp(Math.max(hi - mid, mid - lo));
}

