import type { MarginSpec } from './margin-network.js';
import type { LinearBounds } from './linear.js';

/**
 * The allowed advisory (group index) whose margins over every rival are all proven above
 * `minMargin`, or −1 when none is.
 * @param lower lower bounds of the spec's margin rows
 */
export function provingGroup(lower: ArrayLike<number>, spec: MarginSpec, minMargin: number): number {
  const nr = spec.rivals.length;
  for (let g = 0; g < spec.allowed.length; g++) {
    let ok = true;
    for (let q = 0; q < nr && ok; q++) ok = lower[g * nr + q]! > minMargin;
    if (ok) return g;
  }
  return -1;
}

/**
 * The margin row to refine: in the allowed group closest to being proven (largest smallest
 * bound), the rival with the smallest bound.
 */
export function worstRow(lower: ArrayLike<number>, spec: MarginSpec): number {
  const nr = spec.rivals.length;
  let bestGroupMin = -Infinity;
  let row = 0;
  for (let g = 0; g < spec.allowed.length; g++) {
    let m = Infinity;
    let arg = g * nr;
    for (let q = 0; q < nr; q++) {
      const v = lower[g * nr + q]!;
      if (v < m) {
        m = v;
        arg = g * nr + q;
      }
    }
    if (m > bestGroupMin || g === 0) {
      bestGroupMin = m;
      row = arg;
    }
  }
  return row;
}

/**
 * Whether halving input i can still shrink the network's input box: its float32 range
 * [netLo, netHi] must be wider than two float32 ulps, and the midpoint in units representable.
 */
function splittable(i: number, piece: { readonly lo: Float64Array; readonly hi: Float64Array }, netLo: ArrayLike<number>, netHi: ArrayLike<number>): boolean {
  const a = piece.lo[i]!;
  const z = piece.hi[i]!;
  const mid = a + (z - a) / 2;
  if (!(mid > a && mid < z)) return false;
  const ulp = Math.max(Math.abs(netLo[i]!), Math.abs(netHi[i]!)) * 2 ** -23 + 2 ** -149;
  return netHi[i]! - netLo[i]! > 2 * ulp;
}

/**
 * The input to halve: the largest width × |∂ bound / ∂ input| of the row's linear lower bound
 * (widths and coefficients in network-input coordinates, so the product is in score units).
 * Where every product is zero (or the bound overflowed), the input widest relative to the
 * root box. Only inputs that can still be split count; −1 when none can.
 *
 * @param netLo the piece's box in network-input coordinates (float32 outward)
 */
export function splitDimension(
  lin: LinearBounds,
  row: number,
  piece: { readonly lo: Float64Array; readonly hi: Float64Array },
  rootWidth: Float64Array,
  netLo: ArrayLike<number>,
  netHi: ArrayLike<number>,
): number {
  const d = piece.lo.length;
  let best = -1;
  let bestScore = 0;
  if (!lin.overflow) {
    for (let i = 0; i < d; i++) {
      const score = (netHi[i]! - netLo[i]!) * Math.abs(lin.coefficients[row * d + i]!);
      if (score > bestScore && splittable(i, piece, netLo, netHi)) {
        bestScore = score;
        best = i;
      }
    }
  }
  if (best >= 0) return best;
  for (let i = 0; i < d; i++) {
    if (rootWidth[i]! <= 0) continue;
    const score = (piece.hi[i]! - piece.lo[i]!) / rootWidth[i]!;
    if (score > bestScore && splittable(i, piece, netLo, netHi)) {
      bestScore = score;
      best = i;
    }
  }
  return best;
}
