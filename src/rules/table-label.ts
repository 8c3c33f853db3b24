import type { Rule } from '../types.js';

/**
 * The advisory a rule table gives each point: `allowed[0]` of the first rule, in table order,
 * whose closed box contains the point; -1 where no rule does. Used for fidelity figures
 * (how often the table agrees with the network), so a rule allowing several advisories counts
 * as predicting its lowest-index one.
 *
 * @param rules the table, in order; each box has d intervals
 * @param x row-major n × d points, float64, scenario units
 * @param n number of points
 * @param d number of inputs
 * @returns n labels (advisory index or -1)
 * Cost: O(n · r · d) worst case for r rules; the scan stops at the first containing rule.
 */
export function tableLabel(rules: readonly Rule[], x: Float64Array, n: number, d: number): Int32Array {
  const r = rules.length;
  // flat bounds so the per-point loop touches only typed arrays
  const lo = new Float64Array(r * d);
  const hi = new Float64Array(r * d);
  const label = new Int32Array(r);
  for (let k = 0; k < r; k++) {
    const rule = rules[k]!;
    for (let f = 0; f < d; f++) {
      lo[k * d + f] = rule.box[f]![0];
      hi[k * d + f] = rule.box[f]![1];
    }
    label[k] = rule.allowed[0]!;
  }
  const out = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    const row = i * d;
    for (let k = 0; k < r; k++) {
      const base = k * d;
      let inside = true;
      for (let f = 0; f < d; f++) {
        const v = x[row + f]!;
        // written as !(inside) so a NaN coordinate is outside every box
        if (!(v >= lo[base + f]! && v <= hi[base + f]!)) {
          inside = false;
          break;
        }
      }
      if (inside) {
        out[i] = label[k]!;
        break;
      }
    }
  }
  return out;
}
