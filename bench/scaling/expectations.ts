/**
 * A fixed set of rules that the study's policy satisfies with a margin, written for any number
 * of inputs d ≥ 2. A network that learned the policy well should satisfy them too, so proving
 * them measures what a proof of a true statement costs as the inputs grow (the mined table of a
 * briefly trained network is mostly refuted at once, which costs a proof next to nothing).
 * Each box keeps at least EXPECTATION_MARGIN between its faces and the policy's boundaries.
 */
export const EXPECTATION_MARGIN = 0.15;

/** `name in [a, b]` for every input from index `from` (0-based) on. */
function rest(d: number, from: number, a: number, b: number): string {
  const parts: string[] = [];
  for (let j = from; j < d; j++) parts.push(`x${j + 1} in [${a}, ${b}]`);
  return parts.length ? ' and ' + parts.join(' and ') : '';
}

/**
 * The rule file text (the project's rule format) for d inputs.
 * Why each holds for the policy (thresholds 0.7, -0.5, and 0.4 on Σx/√d):
 *  E1  x1 ≥ 0.85 → stop.
 *  E2  x1 ≤ 0.55, x2 ≤ -0.65 → lower.
 *  E3  x1 in [0.35, 0.55], all others in [0.35, 1]: Σx/√d ≥ 0.35√d ≥ 0.49 → raise (x2 ≥ 0.35).
 *  E4  all in [-0.35, 0]: x1 < 0.7, x2 > -0.5, Σx ≤ 0 → hold.
 *  E5  x1 in [-1, -0.2], x2 in [-0.35, 0.2], others in [-1, 0]: Σx ≤ 0 → hold.
 */
export function expectationRules(d: number): string {
  return [
    `E1: when x1 >= 0.85 expect stop`,
    `E2: when x1 <= 0.55 and x2 <= -0.65 expect lower`,
    `E3: when x1 in [0.35, 0.55]${rest(d, 1, 0.35, 1)} expect raise`,
    `E4: when x1 in [-0.35, 0]${rest(d, 1, -0.35, 0)} expect hold`,
    `E5: when x1 in [-1, -0.2] and x2 in [-0.35, 0.2]${rest(d, 2, -1, 0)} expect hold`,
  ].join('\n') + '\n';
}
