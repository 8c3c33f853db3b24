import type { AffineLayer, Network } from './network.js';
import { layerOutSize, maxWidth } from './network.js';
import { ACTIVATION_GUARD, type IntervalTrace } from './interval.js';
import type { Relaxation } from './relax.js';
import { roundDown } from './float-error.js';

/**
 * The back-substitution pass of the linear method (linear.ts): linear objectives on a layer's
 * output are rewritten in terms of each earlier layer down to the input (H. Zhang et al.,
 * NeurIPS 2018, §3; G. Singh et al., POPL 2019, §4–5), then minimised over the box.
 */

/** Relative allowance for float64 rounding in the summed constant and corner terms (≤ 2^22 additions). */
const SUM_GUARD = 2 ** -30;

export interface Pass {
  readonly lower: Float64Array;
  readonly coefficients: Float64Array;
  readonly minimiser: Float64Array;
  readonly slack: Float64Array;
}

const transposeCache = new WeakMap<AffineLayer, Float64Array>();
const activeRows = new Int32Array(4096);
const zeroRow = new Float64Array(4096);

function transposed(layer: AffineLayer): Float64Array {
  let t = transposeCache.get(layer);
  if (!t) {
    const { inSize, outSize, weights } = layer;
    t = new Float64Array(inSize * outSize);
    for (let j = 0; j < outSize; j++) for (let i = 0; i < inSize; i++) t[i * outSize + j] = weights[j * inSize + i]!;
    transposeCache.set(layer, t);
  }
  return t;
}

/**
 * One affine layer of back-substitution, four objectives at a time: next = λ·W as dot
 * products over the transposed weights, skipping outputs whose λ is zero in all four rows
 * (inactive ReLUs); the constant gains λ·b, the penalty |λ|·e.
 */
function affineBackInPlace(layer: AffineLayer, e: Float64Array, a: Float64Array, next: Float64Array, rows: number, stride: number, cst: Float64Array, mag: Float64Array, pen: Float64Array): void {
  const { inSize, outSize, bias } = layer;
  const wt = transposed(layer);
  const idx = activeRows;
  for (let r = 0; r < rows; r += 4) {
    const n = Math.min(4, rows - r);
    const a0 = a.subarray(r * stride, r * stride + outSize);
    const a1 = n > 1 ? a.subarray((r + 1) * stride, (r + 1) * stride + outSize) : zeroRow;
    const a2 = n > 2 ? a.subarray((r + 2) * stride, (r + 2) * stride + outSize) : zeroRow;
    const a3 = n > 3 ? a.subarray((r + 3) * stride, (r + 3) * stride + outSize) : zeroRow;
    let m = 0;
    for (let j = 0; j < outSize; j++) {
      if (a0[j] === 0 && a1[j] === 0 && a2[j] === 0 && a3[j] === 0) continue;
      idx[m++] = j;
    }
    for (let q = 0; q < n; q++) {
      const row = a.subarray((r + q) * stride, (r + q) * stride + outSize);
      let c = 0;
      let g = 0;
      let p = 0;
      for (let t = 0; t < m; t++) {
        const j = idx[t]!;
        const l = row[j]!;
        c += l * bias[j]!;
        g += Math.abs(l * bias[j]!);
        p += Math.abs(l) * e[j]!;
      }
      cst[r + q]! += c;
      mag[r + q]! += g;
      pen[r + q]! += p;
    }
    for (let i = 0; i < inSize; i++) {
      const col = i * outSize;
      let s0 = 0;
      let s1 = 0;
      let s2 = 0;
      let s3 = 0;
      for (let t = 0; t < m; t++) {
        const j = idx[t]!;
        const w = wt[col + j]!;
        s0 += a0[j]! * w;
        s1 += a1[j]! * w;
        s2 += a2[j]! * w;
        s3 += a3[j]! * w;
      }
      next[r * stride + i] = s0;
      if (n > 1) next[(r + 1) * stride + i] = s1;
      if (n > 2) next[(r + 2) * stride + i] = s2;
      if (n > 3) next[(r + 3) * stride + i] = s3;
    }
  }
}

/**
 * Back-substitutes `rows` linear objectives `lam` (rows × width of layer `upto`'s output)
 * down to the input and minimises them over the box.
 */
export function backSubstitute(net: Network, upto: number, lam: Float64Array, rows: number, relax: (Relaxation | undefined)[], trace: IntervalTrace, lo: ArrayLike<number>, hi: ArrayLike<number>): Pass {
  const stride = maxWidth(net);
  let a = new Float64Array(rows * stride);
  let b = new Float64Array(rows * stride);
  const w0 = layerOutSize(net.layers[upto]!);
  for (let r = 0; r < rows; r++) for (let j = 0; j < w0; j++) a[r * stride + j] = lam[r * w0 + j]!;
  const cst = new Float64Array(rows);
  const mag = new Float64Array(rows);
  const pen = new Float64Array(rows);
  for (let q = upto; q >= 0; q--) {
    const layer = net.layers[q]!;
    if (layer.kind === 'affine') {
      affineBackInPlace(layer, trace.noise[q]!, a, b, rows, stride, cst, mag, pen);
      const t = a;
      a = b;
      b = t;
    } else {
      const rel = relax[q]!;
      const smooth = layer.kind !== 'relu';
      for (let r = 0; r < rows; r++) {
        const base = r * stride;
        for (let j = 0; j < layer.size; j++) {
          const l = a[base + j]!;
          if (l === 0) continue;
          const t = l >= 0 ? l * rel.lowerIntercept[j]! : l * rel.upperIntercept[j]!;
          a[base + j] = l >= 0 ? l * rel.lowerSlope[j]! : l * rel.upperSlope[j]!;
          cst[r]! += t;
          mag[r]! += Math.abs(t);
          if (smooth) pen[r]! += Math.abs(l) * ACTIVATION_GUARD;
        }
      }
    }
  }
  const d = net.inputSize;
  const lower = new Float64Array(rows);
  const coefficients = new Float64Array(rows * d);
  const minimiser = new Float64Array(rows * d);
  for (let r = 0; r < rows; r++) {
    let s = cst[r]!;
    let m = mag[r]! + pen[r]!;
    for (let i = 0; i < d; i++) {
      const c = a[r * stride + i]!;
      const x = c >= 0 ? lo[i]! : hi[i]!;
      coefficients[r * d + i] = c;
      minimiser[r * d + i] = x;
      s += c * x;
      m += Math.abs(c * x);
    }
    lower[r] = roundDown(s - pen[r]! - SUM_GUARD * m);
  }
  return { lower, coefficients, minimiser, slack: pen };
}

/**
 * Linear lower bounds of every output of `net` over the box [lo, hi] (network-input
 * coordinates), with the corner minimising each bound as a counterexample candidate.
 *
 * @param options see LinearOptions; refinement off keeps the interval bounds of inner
 *   activations, which is faster and looser
 */
