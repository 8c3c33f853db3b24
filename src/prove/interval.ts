import type { AffineLayer, Network } from './network.js';
import { maxWidth } from './network.js';
import { ACTIVATION_ABS_ERROR, MAX_SAFE_MAGNITUDE, NOISE_INFLATION, roundDown, roundUp } from './float-error.js';

/**
 * Interval bound propagation: interval arithmetic (R. E. Moore, Interval Analysis,
 * Prentice-Hall, 1966) pushed through the layers, in the centre/radius form used for
 * networks by S. Gowal et al., "On the Effectiveness of Interval Bound Propagation for
 * Training Verifiably Robust Models", arXiv:1810.12715, 2018: c' = W c + b, r' = |W| r.
 * Each affine layer's radius also grows by its float32 error bound e_j = s_j·M + c_j
 * (M = max |input|), so the bounds enclose what onnxruntime computes, not only the exact map.
 * Activations are monotone: [f(c − r), f(c + r)], rounded outward.
 */

/** Bounds of every layer's output for one box (used by the linear method). */
export interface IntervalTrace {
  /** Per layer: lower and upper bounds of its output as the runtime computes it. */
  readonly lower: Float64Array[];
  readonly upper: Float64Array[];
  /** Per layer: float32 error bound per output of an affine layer (empty for activations). */
  readonly noise: Float64Array[];
  /** Some bound exceeded MAX_SAFE_MAGNITUDE: float32 overflow is not excluded. */
  readonly overflow: boolean;
}

const absCache = new WeakMap<AffineLayer, Float64Array>();

function absWeights(layer: AffineLayer): Float64Array {
  let a = absCache.get(layer);
  if (!a) {
    a = layer.weights.map(Math.abs);
    absCache.set(layer, a);
  }
  return a;
}

function activate(kind: 'sigmoid' | 'tanh', z: number): number {
  return kind === 'tanh' ? Math.tanh(z) : 1 / (1 + Math.exp(-z));
}

/** Float64 rounding of Math.exp/Math.tanh, added to the runtime's activation error. */
export const ACTIVATION_GUARD = ACTIVATION_ABS_ERROR + 2 ** -40;

/** Columns skipped when zero in all boxes of a block: inactive ReLUs cost nothing. */
const BLOCK = 4;
const activeIndex = new Int32Array(4096);

/**
 * c' = W c + b and r' = |W| r + e for n boxes, four boxes at a time so that each weight load
 * serves four boxes, skipping inputs that are exactly zero (c = r = 0) in all four.
 */
function affineStep(layer: AffineLayer, aw: Float64Array, cc: Float64Array, rr: Float64Array, nc: Float64Array, nr: Float64Array, n: number, stride: number, over: Uint8Array, noise: Float64Array | undefined): void {
  const { inSize, outSize, weights, bias, errorScale, errorConst } = layer;
  const idx = activeIndex;
  for (let b = 0; b < n; b += BLOCK) {
    const nb = Math.min(BLOCK, n - b);
    // rows beyond n repeat the last box so the unrolled loop stays branch-free
    const b0 = b * stride;
    const b1 = (b + Math.min(1, nb - 1)) * stride;
    const b2 = (b + Math.min(2, nb - 1)) * stride;
    const b3 = (b + Math.min(3, nb - 1)) * stride;
    let m = 0;
    let m0 = 0;
    let m1 = 0;
    let m2 = 0;
    let m3 = 0;
    for (let k = 0; k < inSize; k++) {
      const v0 = Math.abs(cc[b0 + k]!) + rr[b0 + k]!;
      const v1 = Math.abs(cc[b1 + k]!) + rr[b1 + k]!;
      const v2 = Math.abs(cc[b2 + k]!) + rr[b2 + k]!;
      const v3 = Math.abs(cc[b3 + k]!) + rr[b3 + k]!;
      if (v0 > m0) m0 = v0;
      if (v1 > m1) m1 = v1;
      if (v2 > m2) m2 = v2;
      if (v3 > m3) m3 = v3;
      if (v0 + v1 + v2 + v3 !== 0) idx[m++] = k;
    }
    for (let j = 0; j < outSize; j++) {
      const row = j * inSize;
      let c0 = bias[j]!;
      let c1 = c0;
      let c2 = c0;
      let c3 = c0;
      let r0 = 0;
      let r1 = 0;
      let r2 = 0;
      let r3 = 0;
      for (let t = 0; t < m; t++) {
        const k = idx[t]!;
        const w = weights[row + k]!;
        const a = aw[row + k]!;
        c0 += w * cc[b0 + k]!;
        c1 += w * cc[b1 + k]!;
        c2 += w * cc[b2 + k]!;
        c3 += w * cc[b3 + k]!;
        r0 += a * rr[b0 + k]!;
        r1 += a * rr[b1 + k]!;
        r2 += a * rr[b2 + k]!;
        r3 += a * rr[b3 + k]!;
      }
      const s = errorScale[j]!;
      const e0 = (s * m0 + errorConst[j]!) * NOISE_INFLATION;
      nc[b0 + j] = c0;
      nr[b0 + j] = r0 + e0;
      if (noise) noise[j] = e0;
      if (Math.abs(c0) + r0 > MAX_SAFE_MAGNITUDE) over[b] = 1;
      if (nb > 1) {
        nc[b1 + j] = c1;
        nr[b1 + j] = r1 + (s * m1 + errorConst[j]!) * NOISE_INFLATION;
        if (Math.abs(c1) + r1 > MAX_SAFE_MAGNITUDE) over[b + 1] = 1;
      }
      if (nb > 2) {
        nc[b2 + j] = c2;
        nr[b2 + j] = r2 + (s * m2 + errorConst[j]!) * NOISE_INFLATION;
        if (Math.abs(c2) + r2 > MAX_SAFE_MAGNITUDE) over[b + 2] = 1;
      }
      if (nb > 3) {
        nc[b3 + j] = c3;
        nr[b3 + j] = r3 + (s * m3 + errorConst[j]!) * NOISE_INFLATION;
        if (Math.abs(c3) + r3 > MAX_SAFE_MAGNITUDE) over[b + 3] = 1;
      }
    }
  }
}

/**
 * Propagates n boxes (centre c, radius r, row stride `stride`) through the layers in place.
 * `over[b]` is set to 1 when box b risks float32 overflow. With `trace`, n must be 1.
 */
function propagateInPlace(net: Network, c: Float64Array, r: Float64Array, tc: Float64Array, tr: Float64Array, n: number, stride: number, over: Uint8Array, trace?: IntervalTrace): void {
  let cc = c;
  let rr = r;
  let nc = tc;
  let nr = tr;
  for (const layer of net.layers) {
    if (layer.kind === 'affine') {
      const noise = trace ? new Float64Array(layer.outSize) : undefined;
      affineStep(layer, absWeights(layer), cc, rr, nc, nr, n, stride, over, noise);
      [cc, nc] = [nc, cc];
      [rr, nr] = [nr, rr];
      if (noise) trace!.noise.push(noise);
    } else {
      const size = layer.size;
      const kind = layer.kind;
      for (let b = 0; b < n; b++) {
        const base = b * stride;
        for (let j = 0; j < size; j++) {
          const hi = roundUp(cc[base + j]! + rr[base + j]!);
          if (kind === 'relu') {
            if (hi <= 0) {
              cc[base + j] = 0;
              rr[base + j] = 0;
            } else if (roundDown(cc[base + j]! - rr[base + j]!) < 0) {
              // [c − r, c + r] with c − r ≥ 0 already encloses relu's output: keep it then
              const h = roundUp(hi * 0.5);
              cc[base + j] = h;
              rr[base + j] = h;
            }
          } else {
            const lo = roundDown(cc[base + j]! - rr[base + j]!);
            setCentreRadius(cc, rr, base + j, activate(kind, lo) - ACTIVATION_GUARD, activate(kind, hi) + ACTIVATION_GUARD);
          }
        }
      }
      if (trace) trace.noise.push(new Float64Array(0));
    }
    if (trace) {
      const size = layer.kind === 'affine' ? layer.outSize : layer.size;
      const lo = new Float64Array(size);
      const up = new Float64Array(size);
      for (let j = 0; j < size; j++) {
        lo[j] = roundDown(cc[j]! - rr[j]!);
        up[j] = roundUp(cc[j]! + rr[j]!);
      }
      trace.lower.push(lo);
      trace.upper.push(up);
    }
  }
  if (cc !== c) {
    c.set(cc.subarray(0, n * stride));
    r.set(rr.subarray(0, n * stride));
  }
}

/** Writes a centre and radius whose interval encloses [lo, hi]. */
function setCentreRadius(c: Float64Array, r: Float64Array, i: number, lo: number, hi: number): void {
  const mid = 0.5 * lo + 0.5 * hi;
  c[i] = mid;
  r[i] = roundUp(Math.max(hi - mid, mid - lo));
}

/**
 * Interval bounds of the network's outputs over many boxes, batched in typed arrays.
 *
 * @param net the network (typically a margin network, see marginNetwork)
 * @param lo n × inputSize lower corners in network-input coordinates (not changed)
 * @param hi n × inputSize upper corners
 * @param n number of boxes
 * @param lowerOut n × outputSize: receives lower bounds (−Infinity where overflow is possible)
 * @param upperOut optional n × outputSize: receives upper bounds (+Infinity likewise)
 */
export function intervalBounds(net: Network, lo: Float64Array, hi: Float64Array, n: number, lowerOut: Float64Array, upperOut?: Float64Array): void {
  const stride = maxWidth(net);
  const d = net.inputSize;
  const k = net.outputSize;
  const c = new Float64Array(n * stride);
  const r = new Float64Array(n * stride);
  for (let b = 0; b < n; b++) for (let i = 0; i < d; i++) setCentreRadius(c, r, b * stride + i, lo[b * d + i]!, hi[b * d + i]!);
  const over = new Uint8Array(n);
  propagateInPlace(net, c, r, new Float64Array(n * stride), new Float64Array(n * stride), n, stride, over);
  for (let b = 0; b < n; b++) {
    for (let j = 0; j < k; j++) {
      const cj = c[b * stride + j]!;
      const rj = r[b * stride + j]!;
      lowerOut[b * k + j] = over[b] ? -Infinity : roundDown(cj - rj);
      if (upperOut) upperOut[b * k + j] = over[b] ? Infinity : roundUp(cj + rj);
    }
  }
}

/** Interval bounds of every layer's output for one box, with each affine layer's error bound. */
export function intervalTrace(net: Network, lo: ArrayLike<number>, hi: ArrayLike<number>): IntervalTrace {
  const stride = maxWidth(net);
  const c = new Float64Array(stride);
  const r = new Float64Array(stride);
  for (let i = 0; i < net.inputSize; i++) setCentreRadius(c, r, i, lo[i]!, hi[i]!);
  const over = new Uint8Array(1);
  const trace = { lower: [] as Float64Array[], upper: [] as Float64Array[], noise: [] as Float64Array[], overflow: false };
  propagateInPlace(net, c, r, new Float64Array(stride), new Float64Array(stride), 1, stride, over, trace);
  return { ...trace, overflow: over[0] === 1 };
}
