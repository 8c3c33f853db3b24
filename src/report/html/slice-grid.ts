import type { Evaluator, InputSpec } from '../../types.js';

/** Default cells per side of a slice plot: 80 × 80 = 6,400 network evaluations per slice. */
export const SLICE_GRID = 80;

/**
 * The network's advisory on a `n × n` grid of cell centres over the domain of inputs `pair`,
 * the other inputs held at `held`. Row-major: cell (cx, cy) is entry `cy * n + cx`, cx along
 * the pair's first input, cy along its second; both from the domain's minimum upwards.
 * @param inputs the scenario's inputs (domains in units)
 * @param pair the two varying inputs
 * @param held a full input vector in units (the pair's entries are ignored)
 * @param evaluate the network, in scenario units
 * @param n cells per side (>= 1)
 */
export async function sliceGrid(
  inputs: readonly InputSpec[],
  pair: readonly [number, number],
  held: readonly number[],
  evaluate: Evaluator,
  n = SLICE_GRID,
): Promise<Int32Array> {
  const d = inputs.length;
  const [p, q] = pair;
  const a = inputs[p]!;
  const b = inputs[q]!;
  const x = new Float64Array(n * n * d);
  for (let cy = 0; cy < n; cy++) {
    const vy = b.min + ((cy + 0.5) / n) * (b.max - b.min);
    for (let cx = 0; cx < n; cx++) {
      const row = (cy * n + cx) * d;
      for (let k = 0; k < d; k++) x[row + k] = held[k]!;
      x[row + p] = a.min + ((cx + 0.5) / n) * (a.max - a.min);
      x[row + q] = vy;
    }
  }
  const { advisory } = await evaluate(x, n * n);
  return Int32Array.from(advisory);
}
