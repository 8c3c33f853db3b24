/**
 * The scaling study's own controller policy, invented for this benchmark: a generic n-input
 * advisory over the box [-1, 1]^n (inputs `x1 … xn`, no units) with four advisories. Two
 * thresholds on single inputs and one oblique combination of all inputs decide it:
 *
 *   x1 > 0.7                      → stop
 *   else x2 < -0.5                → lower
 *   else (x1 + … + xn) / √n > 0.4 → raise
 *   else                          → hold
 *
 * The oblique term keeps its spread the same for every n (each xj is uniform with variance 1/3,
 * so the sum over √n has variance 1/3), so every network of the sweep sees a boundary of the
 * same kind that touches every input: the tree and the prover have to deal with all of them.
 */
export const SCALING_ADVISORIES = ['hold', 'raise', 'lower', 'stop'] as const;

/** Threshold on x1 above which the policy says stop. */
const STOP_ABOVE = 0.7;
/** Threshold on x2 below which the policy says lower. */
const LOWER_BELOW = -0.5;
/** Threshold on the normalised sum of all inputs above which the policy says raise. */
const RAISE_ABOVE = 0.4;

/**
 * The advisory (index into SCALING_ADVISORIES) for one input row.
 * @param x row-major inputs, n × d
 * @param row the row to read
 * @param d number of inputs (≥ 2)
 */
export function scalingPolicy(x: Float64Array, row: number, d: number): number {
  const o = row * d;
  if (x[o]! > STOP_ABOVE) return 3;
  if (x[o + 1]! < LOWER_BELOW) return 2;
  let s = 0;
  for (let j = 0; j < d; j++) s += x[o + j]!;
  return s / Math.sqrt(d) > RAISE_ABOVE ? 1 : 0;
}

/**
 * Labelled samples of the policy, uniform over [-1, 1]^d.
 * @param n rows
 * @param d inputs
 * @param rng uniform random source on [0, 1)
 */
export function samplePolicy(n: number, d: number, rng: () => number): { x: Float64Array; labels: Int32Array } {
  const x = new Float64Array(n * d);
  const labels = new Int32Array(n);
  for (let i = 0; i < x.length; i++) x[i] = 2 * rng() - 1;
  for (let i = 0; i < n; i++) labels[i] = scalingPolicy(x, i, d);
  return { x, labels };
}
