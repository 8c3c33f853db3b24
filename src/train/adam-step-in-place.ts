/** Adam's hyper-parameters; the defaults are the ones recommended in the paper. */
export interface AdamSettings {
  readonly learningRate: number;
  /** Decay of the first-moment average; default 0.9. */
  readonly beta1?: number;
  /** Decay of the second-moment average; default 0.999. */
  readonly beta2?: number;
  /** Added to the root of the second moment so a zero gradient history cannot divide by 0; default 1e-8. */
  readonly epsilon?: number;
}

/**
 * One Adam update of a parameter array, in place (params, m and v change).
 *
 *   m ← β1 m + (1 − β1) g,   v ← β2 v + (1 − β2) g²,
 *   θ ← θ − α · (m / (1 − β1^t)) / (sqrt(v / (1 − β2^t)) + ε)
 *
 * D. P. Kingma & J. Ba, "Adam: A method for stochastic optimization", ICLR 2015, Algorithm 1.
 *
 * @param params parameters θ, updated in place
 * @param grad gradient g of the loss at θ (not changed)
 * @param m first-moment estimate, same length, updated in place (starts at 0)
 * @param v second-moment estimate, same length, updated in place (starts at 0)
 * @param step the time step t, counting from 1
 */
export function adamStepInPlace(
  params: Float64Array,
  grad: Float64Array,
  m: Float64Array,
  v: Float64Array,
  step: number,
  settings: AdamSettings,
): void {
  const beta1 = settings.beta1 ?? 0.9;
  const beta2 = settings.beta2 ?? 0.999;
  const epsilon = settings.epsilon ?? 1e-8;
  const c1 = 1 - Math.pow(beta1, step);
  const c2 = 1 - Math.pow(beta2, step);
  const lr = settings.learningRate;
  for (let i = 0; i < params.length; i++) {
    const g = grad[i]!;
    const mi = beta1 * m[i]! + (1 - beta1) * g;
    const vi = beta2 * v[i]! + (1 - beta2) * g * g;
    m[i] = mi;
    v[i] = vi;
    params[i] = params[i]! - (lr * (mi / c1)) / (Math.sqrt(vi / c2) + epsilon);
  }
}
