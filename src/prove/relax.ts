import { roundDown, roundUp } from './float-error.js';

/**
 * Linear relaxations of elementwise activations over [l, u]:
 * lowerSlope·z + lowerIntercept ≤ f(z) ≤ upperSlope·z + upperIntercept for z ∈ [l, u].
 *
 * ReLU: stable neurons are exact; an unstable one (l < 0 < u) is bounded above by the chord
 * u(z − l)/(u − l) and below by z when u ≥ −l, else by 0 — the adaptive lower bound of
 * H. Zhang, T.-W. Weng, P.-Y. Chen, C.-J. Hsieh, L. Daniel, "Efficient Neural Network
 * Robustness Certification with General Activation Functions", NeurIPS 2018, which
 * is the area-minimising choice of G. Singh, T. Gehr, M. Püschel, M. Vechev, "An Abstract
 * Domain for Certifying Neural Networks", POPL 2019, §4. The rule 'zero' always
 * takes 0, the choice in the worked example of Singh et al. (§2); any slope in [0, 1] is sound.
 *
 * Sigmoid and tanh (S-shaped, convex for z ≤ 0 and concave for z ≥ 0): with
 * λ = min(f'(l), f'(u)), the lines f(l) + λ(z − l) ≤ f(z) ≤ f(u) + λ(z − u) hold on any
 * interval (f' is smallest at an endpoint); on the convex side the chord is the upper bound,
 * on the concave side the lower bound (Singh et al. 2019, §4.3). Slopes and intercepts are nudged so
 * the lines stay valid after float64 rounding; the runtime's own activation error is charged
 * separately (ACTIVATION_GUARD).
 */
export interface Relaxation {
  readonly lowerSlope: Float64Array;
  readonly lowerIntercept: Float64Array;
  readonly upperSlope: Float64Array;
  readonly upperIntercept: Float64Array;
}

/** Below this width the chord of a smooth activation is ill-conditioned: use tangent-slope lines. */
const CHORD_MIN_WIDTH = 1e-6;
/** Vertical shift keeping smooth-activation lines valid under float64 rounding of f and f'. */
const SMOOTH_LINE_GUARD = 2 ** -44;

function f(kind: 'sigmoid' | 'tanh', z: number): number {
  return kind === 'tanh' ? Math.tanh(z) : 1 / (1 + Math.exp(-z));
}

/** f' in forms without cancellation: tanh' = 4/(e^z + e^-z)², σ' = e^-|z| / (1 + e^-|z|)². */
function df(kind: 'sigmoid' | 'tanh', z: number): number {
  if (kind === 'tanh') {
    const s = Math.exp(z) + Math.exp(-z);
    return 4 / (s * s);
  }
  const e = Math.exp(-Math.abs(z));
  return e / ((1 + e) * (1 + e));
}

/** How an unstable ReLU's lower line is chosen: by area (z when u ≥ −l, else 0), or always 0. */
export type LowerSlopeRule = 'adaptive' | 'zero';

export function relaxActivation(kind: 'relu' | 'sigmoid' | 'tanh', l: Float64Array, u: Float64Array, rule: LowerSlopeRule = 'adaptive'): Relaxation {
  const n = l.length;
  const ls = new Float64Array(n);
  const li = new Float64Array(n);
  const us = new Float64Array(n);
  const ui = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const lo = l[j]!;
    const hi = u[j]!;
    if (kind === 'relu') {
      if (hi <= 0) continue;
      if (lo >= 0) {
        ls[j] = 1;
        us[j] = 1;
        continue;
      }
      // a ≥ u/(u − l) and b ≥ −a·l make the line ≥ 0 at l and ≥ u at u
      const a = roundUp(hi / (hi - lo));
      us[j] = a;
      ui[j] = roundUp(-a * lo);
      ls[j] = rule === 'adaptive' && hi >= -lo ? 1 : 0;
      continue;
    }
    const fl = f(kind, lo);
    const fu = f(kind, hi);
    const lam = roundDown(Math.min(df(kind, lo), df(kind, hi)) * (1 - 2 ** -40));
    // tangent-slope lines, valid on any interval
    let lowA = lam;
    let lowB = roundDown(fl - lam * lo) - SMOOTH_LINE_GUARD;
    let upA = lam;
    let upB = roundUp(fu - lam * hi) + SMOOTH_LINE_GUARD;
    if (hi - lo > CHORD_MIN_WIDTH) {
      const chord = (fu - fl) / (hi - lo);
      if (hi <= 0) {
        upA = chord;
        upB = roundUp(fl - chord * lo) + SMOOTH_LINE_GUARD;
      } else if (lo >= 0) {
        lowA = chord;
        lowB = roundDown(fl - chord * lo) - SMOOTH_LINE_GUARD;
      }
    }
    // the intercepts cancel against slope × endpoint: allow for that product's rounding
    const reach = Math.max(Math.abs(lo), Math.abs(hi));
    ls[j] = lowA;
    li[j] = lowB - Math.abs(lowA) * reach * 2 ** -50;
    us[j] = upA;
    ui[j] = upB + Math.abs(upA) * reach * 2 ** -50;
  }
  return { lowerSlope: ls, lowerIntercept: li, upperSlope: us, upperIntercept: ui };
}
