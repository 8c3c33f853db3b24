import type { Decision } from '../types.js';
import type { AffineLayer, Network } from './network.js';
import { NOISE_FLOOR } from './float-error.js';

/**
 * The rule "advisory ∈ allowed" as margins. For argmax the rule holds at x iff
 * max_{a∈A} s_a(x) > max_{j∉A} s_j(x); it is implied by: for some single a ∈ A,
 * s_a(x) − s_j(x) > 0 for every j ∉ A (exact when |A| = 1). For argmin the signs flip.
 * Row r of the margin network is sign·(s_{a_r} − s_{j_r}), rows grouped by a: group g holds
 * rows g·R .. g·R + R − 1 with R = number of rivals.
 */
export interface MarginSpec {
  readonly allowed: readonly number[];
  readonly rivals: readonly number[];
  readonly sign: 1 | -1;
  readonly rows: number;
}

export function marginSpec(outputs: number, allowed: readonly number[], decision: Decision): MarginSpec {
  for (const a of allowed) {
    if (!Number.isInteger(a) || a < 0 || a >= outputs) throw new RangeError(`allowed advisory ${a} is outside 0..${outputs - 1}`);
  }
  if (allowed.length === 0) throw new RangeError('allowed advisories must not be empty');
  const set = new Set(allowed);
  const uniq = [...set].sort((x, y) => x - y);
  const rivals: number[] = [];
  for (let j = 0; j < outputs; j++) if (!set.has(j)) rivals.push(j);
  return { allowed: uniq, rivals, sign: decision === 'argmax' ? 1 : -1, rows: uniq.length * rivals.length };
}

/**
 * The network whose outputs are the spec's margin rows. When the last layer is affine the
 * differences are folded into it: ŝ_a − ŝ_j = (W_a − W_j) ŷ + (b_a − b_j) + δ_a − δ_j, so the
 * folded row's error bound is the sum of the two rows' bounds. Otherwise a difference layer
 * carrying only the noise floor is appended (comparing two float32 scores is exact).
 */
export function marginNetwork(net: Network, spec: MarginSpec): Network {
  const last = net.layers[net.layers.length - 1];
  const rows = spec.rows;
  const nr = spec.rivals.length;
  if (last && last.kind === 'affine') {
    const n = last.inSize;
    const w = new Float64Array(rows * n);
    const e = new Float64Array(rows * n);
    const b = new Float64Array(rows);
    const s = new Float64Array(rows);
    const c = new Float64Array(rows);
    spec.allowed.forEach((a, g) => {
      spec.rivals.forEach((j, q) => {
        const r = g * nr + q;
        for (let i = 0; i < n; i++) {
          w[r * n + i] = spec.sign * (last.weights[a * n + i]! - last.weights[j * n + i]!);
          e[r * n + i] = last.errorWeights[a * n + i]! + last.errorWeights[j * n + i]!;
        }
        b[r] = spec.sign * (last.bias[a]! - last.bias[j]!);
        s[r] = last.errorScale[a]! + last.errorScale[j]!;
        c[r] = last.errorConst[a]! + last.errorConst[j]!;
      });
    });
    const folded: AffineLayer = { kind: 'affine', inSize: n, outSize: rows, weights: w, bias: b, errorWeights: e, errorScale: s, errorConst: c, nodes: last.nodes };
    return { ...net, outputSize: rows, layers: [...net.layers.slice(0, -1), folded] };
  }
  const k = net.outputSize;
  const w = new Float64Array(rows * k);
  spec.allowed.forEach((a, g) => {
    spec.rivals.forEach((j, q) => {
      w[(g * nr + q) * k + a] = spec.sign;
      w[(g * nr + q) * k + j] = -spec.sign;
    });
  });
  const zeros = new Float64Array(rows);
  // no float32 error, but the noise floor of two unit weights keeps the float64 argument uniform
  const floor = new Float64Array(rows).fill(2 * NOISE_FLOOR);
  const e = w.map((v) => NOISE_FLOOR * Math.abs(v));
  const diff: AffineLayer = { kind: 'affine', inSize: k, outSize: rows, weights: w, bias: zeros, errorWeights: e, errorScale: floor, errorConst: zeros, nodes: [] };
  return { ...net, outputSize: rows, layers: [...net.layers, diff] };
}
