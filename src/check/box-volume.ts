import type { InputSpec } from '../types.js';

/**
 * Share of the input domain's volume inside a box: the product over inputs of the box's width
 * divided by the input's range. Boxes are clipped to the domain first.
 */
export function boxVolumeFraction(box: ReadonlyArray<readonly [number, number]>, inputs: readonly InputSpec[]): number {
  let f = 1;
  for (let i = 0; i < inputs.length; i++) {
    const { min, max } = inputs[i]!;
    const lo = Math.max(min, box[i]![0]);
    const hi = Math.min(max, box[i]![1]);
    f *= hi > lo ? (hi - lo) / (max - min) : 0;
  }
  return f;
}
