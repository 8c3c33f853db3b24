import { cruiseSpacingPolicy } from './policy.js';
import { CRUISE_SPACING_BOX, policyBoundaries } from './policy-boundaries.js';

/** How many samples to draw, and where. */
export interface PolicySampleOptions {
  /** Samples uniform over the whole box. */
  readonly uniform: number;
  /**
   * Samples near the policy's boundary planes: a plane is chosen at random, own speed and
   * closing speed are drawn uniform, and the gap (or, for the zero-closing plane, the closing
   * speed) is placed within ± nearWidth × its range of the plane.
   */
  readonly nearBoundary: number;
  /** Half-width of the band around a plane, as a fraction of the moved input's range. */
  readonly nearWidth: number;
}

/** Labelled samples of the expert policy, in scenario units. */
export interface PolicySamples {
  readonly n: number;
  readonly d: number;
  /** n × d, row-major, scenario units. */
  readonly x: Float64Array;
  /** The policy's advisory per row. */
  readonly labels: Int32Array;
}

/**
 * Draws inputs over the cruise-spacing box and labels them with cruiseSpacingPolicy. The uniform
 * part covers the domain in proportion to volume; the near-boundary part puts extra weight where
 * the advisory changes (sampling the decision boundary densely is standard practice when
 * distilling a rule into a network; no single source). A near-boundary point whose gap would
 * leave [0, 120] m is clamped to the range, which only piles a few points on the box faces.
 *
 * @param options sample counts and band width
 * @param rng uniform random source on [0, 1)
 * @returns the samples, uniform rows first
 */
export function samplePolicy(options: PolicySampleOptions, rng: () => number): PolicySamples {
  const d = CRUISE_SPACING_BOX.length;
  const n = options.uniform + options.nearBoundary;
  const x = new Float64Array(n * d);
  const labels = new Int32Array(n);
  const boundaries = policyBoundaries();
  const row = new Float64Array(d);
  for (let r = 0; r < n; r++) {
    for (let j = 0; j < d; j++) {
      const [lo, hi] = CRUISE_SPACING_BOX[j]!;
      row[j] = lo + (hi - lo) * rng();
    }
    if (r >= options.uniform) {
      const b = boundaries[Math.floor(rng() * boundaries.length)]!;
      const moved = b.against === -1 ? 2 : 0;
      const [lo, hi] = CRUISE_SPACING_BOX[moved]!;
      const on = b.against === -1 ? 0 : b.ratio * row[b.against]!;
      const v = on + (2 * rng() - 1) * options.nearWidth * (hi - lo);
      row[moved] = Math.min(hi, Math.max(lo, v));
    }
    x.set(row, r * d);
    labels[r] = cruiseSpacingPolicy(row);
  }
  return { n, d, x, labels };
}
