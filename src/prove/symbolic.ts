import type { AffineLayer } from './network.js';
import type { Relaxation } from './relax.js';
import { roundDown, roundUp } from './float-error.js';

/**
 * Forward symbolic bounds: every neuron carries a lower and an upper linear function of the
 * network input, L(x) ≤ ẑ ≤ U(x) on the box, pushed forward layer by layer
 * (S. Wang, K. Pei, J. Whitehouse, J. Yang, S. Jana, "Efficient Formal Safety Analysis of
 * Neural Networks", NeurIPS 2018, symbolic linear relaxation; the same lines as
 * relax.ts). With few inputs (d ≪ width) this costs width² · (d + 1) per layer, far less
 * than back-substituting every neuron, and gives the intermediate bounds the linear method
 * starts from; back-substitution stays for the final margins, where it is tighter.
 *
 * Float64 rounding: `mass` bounds Σ|terms| of each neuron's functions anywhere in the box
 * (mass' = Σ_k|W_jk| · max_k mass_k + |b_j| + e_j), and concretised bounds move outward by
 * SYMBOLIC_GUARD · mass, which exceeds the rounding of the ≤ 2^22 operations behind them.
 */
export interface Symbolic {
  readonly d: number;
  readonly width: number;
  /** Row length: d + 1 rounded up to a multiple of 4 (the padding stays zero). */
  readonly pad: number;
  /** width × pad: coefficients, then the constant at index d, of each lower function. */
  readonly low: Float64Array;
  readonly up: Float64Array;
  readonly mass: Float64Array;
}

const SYMBOLIC_GUARD = 2 ** -30;

/** The identity functions of the input box. */
export function symbolicInput(lo: ArrayLike<number>, hi: ArrayLike<number>): Symbolic {
  const d = lo.length;
  const pad = 4 * Math.ceil((d + 1) / 4);
  const low = new Float64Array(d * pad);
  const mass = new Float64Array(d);
  for (let i = 0; i < d; i++) {
    low[i * pad + i] = 1;
    mass[i] = Math.max(Math.abs(lo[i]!), Math.abs(hi[i]!));
  }
  return { d, width: d, pad, low, up: Float64Array.from(low), mass };
}

/** Per row, the columns of positive then negative weights: sign-split loops without branches. */
interface SignSplit {
  /** outSize + 1 offsets into `cols`; row j's positive columns, then its negative ones. */
  readonly start: Int32Array;
  /** Where row j's negative columns begin. */
  readonly split: Int32Array;
  readonly cols: Int32Array;
  readonly absRow: Float64Array;
}

const splitCache = new WeakMap<AffineLayer, SignSplit>();

function signSplit(layer: AffineLayer): SignSplit {
  let s = splitCache.get(layer);
  if (s) return s;
  const { inSize, outSize, weights } = layer;
  const start = new Int32Array(outSize + 1);
  const split = new Int32Array(outSize);
  const cols: number[] = [];
  const absRow = new Float64Array(outSize);
  for (let j = 0; j < outSize; j++) {
    start[j] = cols.length;
    for (let k = 0; k < inSize; k++) if (weights[j * inSize + k]! > 0) cols.push(k);
    split[j] = cols.length;
    for (let k = 0; k < inSize; k++) if (weights[j * inSize + k]! < 0) cols.push(k);
    for (let k = 0; k < inSize; k++) absRow[j]! += Math.abs(weights[j * inSize + k]!);
  }
  start[outSize] = cols.length;
  s = { start, split, cols: Int32Array.from(cols), absRow };
  splitCache.set(layer, s);
  return s;
}

/** Through ẑ' = W ŷ + b + δ, |δ| ≤ e: positive weights take like bounds, negative the opposite. */
export function symbolicAffine(s: Symbolic, layer: AffineLayer, noise: Float64Array): Symbolic {
  const { inSize, outSize, weights, bias } = layer;
  const { start, split, cols, absRow } = signSplit(layer);
  const pad = s.pad;
  const low = new Float64Array(outSize * pad);
  const up = new Float64Array(outSize * pad);
  const mass = new Float64Array(outSize);
  const sl = s.low;
  const su = s.up;
  let maxMass = 0;
  for (let k = 0; k < inSize; k++) maxMass = Math.max(maxMass, s.mass[k]!);
  for (let j = 0; j < outSize; j++) {
    const row = j * inSize;
    // four coefficients at a time, lower and upper, in registers across the columns
    for (let t = 0; t < pad; t += 4) {
      let l0 = 0, l1 = 0, l2 = 0, l3 = 0, u0 = 0, u1 = 0, u2 = 0, u3 = 0;
      for (let q = start[j]!; q < split[j]!; q++) {
        const k = cols[q]!;
        const w = weights[row + k]!;
        const p = k * pad + t;
        l0 += w * sl[p]!;
        l1 += w * sl[p + 1]!;
        l2 += w * sl[p + 2]!;
        l3 += w * sl[p + 3]!;
        u0 += w * su[p]!;
        u1 += w * su[p + 1]!;
        u2 += w * su[p + 2]!;
        u3 += w * su[p + 3]!;
      }
      for (let q = split[j]!; q < start[j + 1]!; q++) {
        const k = cols[q]!;
        const w = weights[row + k]!;
        const p = k * pad + t;
        l0 += w * su[p]!;
        l1 += w * su[p + 1]!;
        l2 += w * su[p + 2]!;
        l3 += w * su[p + 3]!;
        u0 += w * sl[p]!;
        u1 += w * sl[p + 1]!;
        u2 += w * sl[p + 2]!;
        u3 += w * sl[p + 3]!;
      }
      const o = j * pad + t;
      low[o] = l0;
      low[o + 1] = l1;
      low[o + 2] = l2;
      low[o + 3] = l3;
      up[o] = u0;
      up[o + 1] = u1;
      up[o + 2] = u2;
      up[o + 3] = u3;
    }
    low[j * pad + s.d]! += bias[j]! - noise[j]!;
    up[j * pad + s.d]! += bias[j]! + noise[j]!;
    mass[j] = absRow[j]! * maxMass + Math.abs(bias[j]!) + noise[j]!;
  }
  return { d: s.d, width: outSize, pad, low, up, mass };
}

/**
 * Through an activation with relaxation lines of non-negative slope (true of every line in
 * relax.ts): y ≥ a_L·ẑ + b_L ≥ a_L·L(x) + b_L, and likewise above; `guard` widens both
 * (the runtime's activation error, 0 for ReLU).
 */
export function symbolicActivation(s: Symbolic, rel: Relaxation, guard: number): Symbolic {
  const w1 = s.pad;
  const low = new Float64Array(s.width * w1);
  const up = new Float64Array(s.width * w1);
  const mass = new Float64Array(s.width);
  for (let j = 0; j < s.width; j++) {
    const ls = rel.lowerSlope[j]!;
    const us = rel.upperSlope[j]!;
    const o = j * w1;
    for (let t = 0; t < w1; t++) {
      low[o + t] = ls * s.low[o + t]!;
      up[o + t] = us * s.up[o + t]!;
    }
    low[o + s.d]! += rel.lowerIntercept[j]! - guard;
    up[o + s.d]! += rel.upperIntercept[j]! + guard;
    mass[j] = Math.max(ls, us) * s.mass[j]! + Math.max(Math.abs(rel.lowerIntercept[j]!), Math.abs(rel.upperIntercept[j]!)) + guard;
  }
  return { d: s.d, width: s.width, pad: s.pad, low, up, mass };
}

/** Intersects [l, u] in place with the box's range of the lower and upper functions. */
export function tightenInPlace(s: Symbolic, lo: ArrayLike<number>, hi: ArrayLike<number>, l: Float64Array, u: Float64Array): void {
  const d = s.d;
  const w1 = s.pad;
  for (let j = 0; j < s.width; j++) {
    let a = s.low[j * w1 + d]!;
    let b = s.up[j * w1 + d]!;
    for (let i = 0; i < d; i++) {
      const cl = s.low[j * w1 + i]!;
      const cu = s.up[j * w1 + i]!;
      a += cl >= 0 ? cl * lo[i]! : cl * hi[i]!;
      b += cu >= 0 ? cu * hi[i]! : cu * lo[i]!;
    }
    const g = SYMBOLIC_GUARD * s.mass[j]!;
    l[j] = Math.max(l[j]!, roundDown(a - g));
    u[j] = Math.min(u[j]!, roundUp(b + g));
  }
}
