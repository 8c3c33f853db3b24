/**
 * Sobol low-discrepancy points with a seeded digital shift.
 *
 * I. M. Sobol', "On the distribution of points in a cube and the approximate evaluation of
 * integrals", USSR Computational Mathematics and Mathematical Physics 7(4):86–112, 1967.
 * Points are generated in Gray-code order (I. A. Antonov & V. M. Saleev, USSR Comput. Math.
 * Math. Phys. 19(1):252–256, 1979), one XOR per coordinate per point, as in S. Joe & F. Y. Kuo,
 * "Constructing Sobol sequences with better two-dimensional projections", SIAM J. Sci. Comput.
 * 30(5):2635–2654, 2008. Direction numbers: the first rows of their table "new-joe-kuo-6.21201"
 * (https://web.maths.unsw.edu.au/~fkuo/sobol/), typed in here and checked against the copy of
 * that table shipped with scipy (scipy.stats.qmc.Sobol) — see test/sampling/sobol.test.ts.
 *
 * Randomisation: a digital shift (XOR of every coordinate's 32 bits with one seeded 32-bit word
 * per dimension; see A. B. Owen, "Monte Carlo variance of scrambled net quadrature", SIAM J.
 * Numer. Anal. 34(5), 1997, §2, and P. L'Ecuyer & C. Lemieux, "Recent advances in randomized
 * quasi-Monte Carlo methods", 2002). Unlike a Cranley–Patterson rotation (addition mod 1), the
 * XOR shift keeps the net property: every elementary dyadic interval still holds the same number
 * of the first 2^m points, which is why it was chosen.
 */
import { ToolError } from '../errors.js';
import { checkRoom } from './check-box.js';
import type { Rng } from './rng.js';

/**
 * Rows of new-joe-kuo-6.21201 for dimensions 2..21: [s, a, m_1 … m_s] where s is the degree of
 * the primitive polynomial, a encodes its inner coefficients, and m_i are the initial direction
 * numbers. Dimension 1 is the van der Corput sequence (all m_i = 1).
 */
const JOE_KUO_ROWS: ReadonlyArray<readonly number[]> = [
  [1, 0, 1],
  [2, 1, 1, 3],
  [3, 1, 1, 3, 1],
  [3, 2, 1, 1, 1],
  [4, 1, 1, 1, 3, 3],
  [4, 4, 1, 3, 5, 13],
  [5, 2, 1, 1, 5, 5, 17],
  [5, 4, 1, 1, 5, 5, 5],
  [5, 7, 1, 1, 7, 11, 19],
  [5, 11, 1, 1, 5, 1, 1],
  [5, 13, 1, 1, 1, 3, 11],
  [5, 14, 1, 3, 5, 5, 31],
  [6, 1, 1, 3, 3, 9, 7, 49],
  [6, 13, 1, 1, 1, 15, 21, 21],
  [6, 16, 1, 3, 1, 13, 27, 49],
  [6, 19, 1, 1, 1, 15, 7, 5],
  [6, 22, 1, 3, 1, 15, 13, 25],
  [6, 25, 1, 1, 5, 5, 19, 61],
  [7, 1, 1, 3, 7, 11, 23, 15, 103],
  [7, 4, 1, 3, 7, 13, 13, 15, 69],
];

/** The number of dimensions the typed-in table supports. */
export const SOBOL_MAX_DIMENSION = JOE_KUO_ROWS.length + 1;
/** Bits per coordinate: points are multiples of 2^-32, so at most 2^32 distinct points. */
const BITS = 32;
const TWO_POW_MINUS_32 = 1 / 4294967296;
const TWO_POW_32 = 4294967296;

/**
 * Direction numbers V_k (k = 1..32) of each dimension, scaled to 32 bits, by the recurrence of
 * Bratley & Fox (ACM TOMS 14(1), 1988, Algorithm 659) as written in Joe & Kuo's reference code.
 * @returns d × 32 words (bit patterns in Int32 storage), row per dimension
 */
function directionNumbers(d: number): Int32Array {
  const v = new Int32Array(d * BITS);
  for (let k = 0; k < BITS; k++) v[k] = 2 ** (BITS - 1 - k) | 0;
  for (let j = 1; j < d; j++) {
    const row = JOE_KUO_ROWS[j - 1]!;
    const s = row[0]!;
    const a = row[1]!;
    const base = j * BITS;
    for (let i = 1; i <= s; i++) v[base + i - 1] = (row[1 + i]! * 2 ** (BITS - i)) | 0;
    for (let i = s + 1; i <= BITS; i++) {
      const prev = v[base + i - s - 1]!;
      let value = prev ^ (prev >>> s);
      for (let k = 1; k < s; k++) {
        if ((a >>> (s - 1 - k)) & 1) value ^= v[base + i - k - 1]!;
      }
      v[base + i - 1] = value;
    }
  }
  return v;
}

/**
 * The first n points of the d-dimensional Sobol sequence in [0, 1)^d (the first point is the
 * origin before shifting), optionally digitally shifted by words drawn from `rng`.
 * @param n number of points, 0 ≤ n ≤ 2^32
 * @param d number of dimensions, 1 ≤ d ≤ SOBOL_MAX_DIMENSION
 * @param rng seeded source for the shift; omitted: the plain (unshifted) sequence
 * @returns row-major n × d coordinates in [0, 1), each a multiple of 2^-32
 * @throws ToolError (`SAMPLING_DIMENSION`, `SAMPLING_COUNT`) for d or n out of range
 * Cost: O(n·d) after O(32·d) set-up.
 */
export function sobol(n: number, d: number, rng?: Rng): Float64Array {
  checkArguments(n, d);
  const out = new Float64Array(n * d);
  sobolInPlace(n, d, rng, out, 0);
  return out;
}

function checkArguments(n: number, d: number): void {
  if (!Number.isInteger(d) || d < 1 || d > SOBOL_MAX_DIMENSION) {
    throw new ToolError('SAMPLING_DIMENSION', `sobol: expected 1 to ${SOBOL_MAX_DIMENSION} dimensions, found ${d}`);
  }
  if (!Number.isInteger(n) || n < 0 || n > TWO_POW_32) {
    throw new ToolError('SAMPLING_COUNT', `sobol: expected 0 to 2^32 points, found ${n}`);
  }
}

/**
 * As `sobol`, but writes the points into `out` from row `row` on (d values a row); `rng`
 * undefined gives the plain sequence.
 * @throws ToolError (`SAMPLING_DIMENSION`, `SAMPLING_COUNT`) for d, n or `out` out of range
 */
export function sobolInPlace(n: number, d: number, rng: Rng | undefined, out: Float64Array, row: number): void {
  checkArguments(n, d);
  checkRoom(out, row, n, d, 'sobol');
  sobolRangeInPlace(0, n, sobolShift(d, rng), out, row);
}

/** The digital shift: one seeded 32-bit word per dimension (d draws), or none without rng. */
export function sobolShift(d: number, rng: Rng | undefined): Int32Array {
  // Int32 storage keeps every word a small integer for the JIT; >>> 0 reads it unsigned
  const shift = new Int32Array(d);
  if (rng) for (let j = 0; j < d; j++) shift[j] = Math.floor(rng() * TWO_POW_32) | 0;
  return shift;
}

/**
 * Points [first, first + n) of the shifted sequence (d = shift.length), written from row `row`
 * on: point i is the XOR of the direction numbers picked by the bits of its Gray code
 * i ^ (i >> 1), which is where the Gray-code steps from point 0 arrive; then steps as in
 * `sobolInPlace`. Lets a sequence be made a batch at a time. With `lo` and `width` (d values
 * each) every coordinate u is written as lo + u·width instead (the same double as mapping the
 * unit-cube point afterwards, without a second pass). Arguments are not checked.
 */
export function sobolRangeInPlace(first: number, n: number, shift: Int32Array, out: Float64Array, row: number, lo?: Float64Array, width?: Float64Array): void {
  const d = shift.length;
  const v = directionNumbers(d);
  // y = the point's coordinates XOR the shift: a Gray-code step XORs y as it would x
  const y = Int32Array.from(shift);
  const gray = (first ^ (first >>> 1)) >>> 0;
  for (let b = 0; b < BITS; b++) {
    if (((gray >>> b) & 1) === 0) continue;
    for (let j = 0; j < d; j++) y[j] = y[j]! ^ v[j * BITS + b]!;
  }
  // the identity map when no box is given: 0 + u·1 is u exactly
  const base = lo ?? new Float64Array(d);
  const size = width ?? new Float64Array(d).fill(1);
  for (let i = first, end = first + n, at = row * d; i < end; i++) {
    if (i > first) {
      // Gray-code step: flip direction number c, the index of the lowest zero bit of i − 1
      const m = i - 1;
      const c = 31 - Math.clz32(~m & (m + 1));
      for (let j = 0; j < d; j++) y[j] = y[j]! ^ v[j * BITS + c]!;
    }
    for (let j = 0; j < d; j++, at++) out[at] = base[j]! + (y[j]! >>> 0) * TWO_POW_MINUS_32 * size[j]!;
  }
}
