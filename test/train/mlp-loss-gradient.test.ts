import { describe, expect, it } from 'vitest';
import type { DenseLayer } from '../../src/model/onnx-write.js';
import { createRng, heInit, layerGradients, mlpLossGradient, mlpScores, mlpWorkspace } from '../../src/train/index.js';

/** Mean loss of the whole tiny batch (rows 0..n−1). */
function meanLoss(layers: DenseLayer[], x: Float64Array, labels: Int32Array, n: number): number {
  const rows = Int32Array.from({ length: n }, (_, i) => i);
  return mlpLossGradient(layers, x, labels, rows, 0, n, layerGradients(layers), mlpWorkspace(layers, n)).lossSum / n;
}

describe('mlpLossGradient', () => {
  it('gives the loss ln(k) when every score is equal', () => {
    // All-zero weights and biases: softmax is uniform, so the cross-entropy is ln k exactly
    // (closed form), and the gradient of every hidden weight is 0 (no signal passes a dead ReLU).
    const layers = heInit([3, 4, 5], createRng(1)).map((l) => ({ ...l, weights: l.weights.fill(0) }));
    const x = new Float64Array([0.3, -1, 2, 1, 1, 1]);
    const labels = new Int32Array([4, 0]);
    const grads = layerGradients(layers);
    const r = mlpLossGradient(layers, x, labels, new Int32Array([0, 1]), 0, 2, grads, mlpWorkspace(layers, 2));
    // ln 5 computed as log(sum of five exp(0)): one rounding, well inside 1e-15.
    const EXACT_ROUNDING = 1e-15;
    expect(Math.abs(r.lossSum / 2 - Math.log(5))).toBeLessThan(EXACT_ROUNDING);
    expect(Array.from(grads[0]!.weights).every((g) => g === 0)).toBe(true);
    // Output bias gradient: mean of (1/5 − onehot) over the two rows, closed form.
    const expected = [-0.3, 0.2, 0.2, 0.2, -0.3];
    grads[1]!.bias.forEach((g, i) => expect(Math.abs(g - expected[i]!)).toBeLessThan(EXACT_ROUNDING));
  });

  it('agrees with central finite differences on a tiny two-hidden-layer network', () => {
    const rng = createRng(7);
    const layers = heInit([3, 4, 4, 3], rng);
    for (const l of layers) for (let i = 0; i < l.bias.length; i++) l.bias[i] = 0.2 * (rng() - 0.5);
    const n = 6;
    const x = Float64Array.from({ length: n * 3 }, () => 2 * rng() - 1);
    const labels = Int32Array.from({ length: n }, (_, i) => i % 3);

    // Finite differences are only valid away from ReLU kinks: every hidden pre-activation must
    // stay clear of 0 by far more than the step can move it (|Δz| <= H × |∂z/∂θ| ~ 1e-6).
    const KINK_CLEARANCE = 1e-3;
    for (let depth = 1; depth < layers.length; depth++) {
      const pre = layers.slice(0, depth).map((l, i) => (i === depth - 1 ? { ...l, activation: 'none' as const } : l));
      const z = mlpScores(pre, x, n);
      expect(Math.min(...Array.from(z, Math.abs))).toBeGreaterThan(KINK_CLEARANCE);
    }

    const grads = layerGradients(layers);
    const rows = Int32Array.from({ length: n }, (_, i) => i);
    mlpLossGradient(layers, x, labels, rows, 0, n, grads, mlpWorkspace(layers, n));

    // Central difference: truncation error ~H² |L'''| ≈ 1e-12 and rounding error
    // ~eps·|L| / H ≈ 2e-16 / 1e-6 ≈ 2e-10. A tolerance of 1e-7 is ~500× that, yet far below the
    // gradients' size (~1e-3 to 1), so a wrong index, transpose or missing factor fails.
    const H = 1e-6;
    const TOLERANCE = 1e-7;
    let checked = 0;
    let largest = 0;
    layers.forEach((layer, l) => {
      for (const [name, values] of [['weights', layer.weights], ['bias', layer.bias]] as const) {
        for (let i = 0; i < values.length; i++) {
          const keep = values[i]!;
          values[i] = keep + H;
          const up = meanLoss(layers, x, labels, n);
          values[i] = keep - H;
          const down = meanLoss(layers, x, labels, n);
          values[i] = keep;
          const numeric = (up - down) / (2 * H);
          const analytic = grads[l]![name][i]!;
          expect(Math.abs(numeric - analytic), `layer ${l} ${name}[${i}]`).toBeLessThan(TOLERANCE);
          largest = Math.max(largest, Math.abs(analytic));
          checked++;
        }
      }
    });
    expect(checked).toBe(4 * 3 + 4 + 4 * 4 + 4 + 3 * 4 + 3);
    // The check means something only if the gradients are not all tiny.
    expect(largest).toBeGreaterThan(1e-2);
  });
});
