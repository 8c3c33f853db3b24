import type { Network } from './network.js';
import { ACTIVATION_GUARD, type IntervalTrace, intervalTrace } from './interval.js';
import { type LowerSlopeRule, type Relaxation, relaxActivation } from './relax.js';
import { backSubstitute } from './back-substitute.js';
import { symbolicActivation, symbolicAffine, symbolicInput, tightenInPlace } from './symbolic.js';

/**
 * Linear relaxation with back-substitution: a lower bound of each output as a linear function
 * of the input, obtained by substituting layer by layer from the output back to the input,
 * choosing for each activation the lower or upper relaxing line by the sign of its
 * coefficient (H. Zhang et al., "Efficient Neural Network Robustness Certification with
 * General Activation Functions", NeurIPS 2018, §3; G. Singh et al., "An Abstract Domain for
 * Certifying Neural Networks", POPL 2019, §4–5, back-substitution). The linear function is
 * then minimised over the box at a corner. The bounds of each activation's input are taken
 * from interval propagation, intersected with forward symbolic bounds (symbolic.ts) and,
 * for activations after the first nonlinear layer, with the same back-substitution.
 *
 * Float32: every affine layer adds |λ|·e (its error bound e, see interval.ts) to the cost of
 * the bound, and smooth activations |λ|·ACTIVATION_GUARD; their sum is reported as `slack`.
 */
export interface LinearBounds {
  /** Lower bound per output, float32 rounding of the runtime included, rounded outward. */
  readonly lower: Float64Array;
  /** outputs × inputSize: coefficients of each output's linear lower bound. */
  readonly coefficients: Float64Array;
  /** outputs × inputSize: the box corner minimising each linear lower bound. */
  readonly minimiser: Float64Array;
  /** Per output: the part of the bound charged to float32 rounding (≥ 0). */
  readonly slack: Float64Array;
  /** Float32 overflow could not be excluded: every lower bound is −Infinity. */
  readonly overflow: boolean;
  /**
   * Per layer index of an activation: the bounds [lower, upper] used for its input (interval
   * bounds intersected with the tighter ones, so never looser than interval propagation).
   */
  readonly inner: ReadonlyArray<readonly [Float64Array, Float64Array] | undefined>;
}

export interface LinearOptions {
  /**
   * Bounds of the inputs of activations: 'interval' (interval propagation only), 'forward'
   * (intersected with forward symbolic bounds, cheap for few inputs) or 'backward' (default:
   * then tightened by back-substituting each still-unstable neuron, tightest and slowest).
   */
  readonly intermediate?: 'interval' | 'forward' | 'backward';
  /**
   * Lower line of unstable ReLUs: 'adaptive' (area rule), 'zero', or 'best' (default): the
   * outputs are bounded with both and the larger bound kept per output (both are sound).
   */
  readonly slopes?: LowerSlopeRule | 'best';
}

/**
 * Linear lower bounds of every output of `net` over the box [lo, hi] (network-input
 * coordinates), with the corner minimising each bound as a counterexample candidate.
 */
export function linearBounds(net: Network, lo: ArrayLike<number>, hi: ArrayLike<number>, options: LinearOptions = {}): LinearBounds {
  const trace = intervalTrace(net, lo, hi);
  const k = net.outputSize;
  const d = net.inputSize;
  if (trace.overflow) {
    return { lower: new Float64Array(k).fill(-Infinity), coefficients: new Float64Array(k * d), minimiser: new Float64Array(k * d), slack: new Float64Array(k), overflow: true, inner: [] };
  }
  const mode = options.intermediate ?? 'backward';
  const slopes = options.slopes ?? 'best';
  const rule: LowerSlopeRule = slopes === 'zero' ? 'zero' : 'adaptive';
  const relax: (Relaxation | undefined)[] = [];
  const inputBounds: [Float64Array, Float64Array][] = [];
  let sym = mode === 'interval' ? undefined : symbolicInput(lo, hi);
  let nonlinearSeen = false;
  for (let p = 0; p < net.layers.length; p++) {
    const layer = net.layers[p]!;
    if (layer.kind === 'affine') {
      if (sym) sym = symbolicAffine(sym, layer, trace.noise[p]!);
      continue;
    }
    const l = p === 0 ? Float64Array.from(lo) : Float64Array.from(trace.lower[p - 1]!);
    const u = p === 0 ? Float64Array.from(hi) : Float64Array.from(trace.upper[p - 1]!);
    if (sym && p > 0) tightenInPlace(sym, lo, hi, l, u);
    if (mode === 'backward' && nonlinearSeen && p > 0) refineInPlace(net, p - 1, l, u, layer.kind === 'relu', relax, trace, lo, hi);
    const rel = relaxActivation(layer.kind, l, u, rule);
    relax[p] = rel;
    inputBounds[p] = [l, u];
    if (sym) sym = symbolicActivation(sym, rel, layer.kind === 'relu' ? 0 : ACTIVATION_GUARD);
    nonlinearSeen = true;
  }
  const eye = new Float64Array(k * k);
  for (let j = 0; j < k; j++) eye[j * k + j] = 1;
  const pass = backSubstitute(net, net.layers.length - 1, eye, k, relax, trace, lo, hi);
  if (slopes !== 'best') return { ...pass, overflow: false, inner: inputBounds };
  const zero = relax.map((r, p) => (r && net.layers[p]!.kind === 'relu' ? relaxActivation('relu', inputBounds[p]![0], inputBounds[p]![1], 'zero') : r));
  const other = backSubstitute(net, net.layers.length - 1, eye, k, zero, trace, lo, hi);
  for (let j = 0; j < k; j++) {
    if (other.lower[j]! > pass.lower[j]!) {
      pass.lower[j] = other.lower[j]!;
      pass.slack[j] = other.slack[j]!;
      pass.coefficients.set(other.coefficients.subarray(j * d, j * d + d), j * d);
      pass.minimiser.set(other.minimiser.subarray(j * d, j * d + d), j * d);
    }
  }
  return { ...pass, overflow: false, inner: inputBounds };
}

/** Tightens bounds [l, u] of layer `q`'s output by back-substitution, in place. */
function refineInPlace(net: Network, q: number, l: Float64Array, u: Float64Array, reluOnly: boolean, relax: (Relaxation | undefined)[], trace: IntervalTrace, lo: ArrayLike<number>, hi: ArrayLike<number>): void {
  const n = l.length;
  const pick: number[] = [];
  for (let j = 0; j < n; j++) if (!reluOnly || (l[j]! < 0 && u[j]! > 0)) pick.push(j);
  if (pick.length === 0) return;
  const rows = 2 * pick.length;
  const lam = new Float64Array(rows * n);
  pick.forEach((j, t) => {
    lam[2 * t * n + j] = 1;
    lam[(2 * t + 1) * n + j] = -1;
  });
  const pass = backSubstitute(net, q, lam, rows, relax, trace, lo, hi);
  pick.forEach((j, t) => {
    l[j] = Math.max(l[j]!, pass.lower[2 * t]!);
    u[j] = Math.min(u[j]!, -pass.lower[2 * t + 1]!);
  });
}
