import type { Box } from '../prove/index.js';

/**
 * The share of `of`'s volume taken by `box` (a part of it), over the inputs on which `of` has
 * non-zero width; a box of zero width on such an input has share 0. Inputs where `of` is a single
 * value are left out, as proveBox does for its proven volume fraction.
 */
export function boxShare(box: Box, of: Box): number {
  let f = 1;
  for (let i = 0; i < of.length; i++) {
    const w = of[i]![1] - of[i]![0];
    if (w > 0) f *= Math.max(0, box[i]![1] - box[i]![0]) / w;
  }
  return f;
}
