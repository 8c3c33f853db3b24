import type { GrowState } from './grow-state.js';
import { addNodeInPlace } from './add-node-in-place.js';

/**
 * Splits node t at its candidate split: records the split, partitions every input's sorted
 * segment (rows, values, labels) stably into [start, pos) and [pos, end) — the input split on
 * is already in that order — and appends the two children (left first).
 * O(d · (end - start)), no allocation.
 * @returns the left child's index; the right child is the next one
 */
export function splitNodeInPlace(s: GrowState, t: number): number {
  const { n, d, order, vals, labs, goLeft, scratchRow, scratchVal, scratchLab } = s;
  const f = s.candFeature[t]!;
  const pos = s.candPos[t]!;
  const start = s.start[t]!;
  const end = s.end[t]!;
  const fBase = f * n;
  for (let p = start; p < pos; p++) goLeft[order[fBase + p]!] = 1;
  for (let p = pos; p < end; p++) goLeft[order[fBase + p]!] = 0;
  for (let g = 0; g < d; g++) {
    if (g === f) continue;
    const gBase = g * n;
    let wl = gBase + start;
    let wr = 0;
    for (let p = gBase + start; p < gBase + end; p++) {
      const i = order[p]!;
      if (goLeft[i] === 1) {
        order[wl] = i;
        vals[wl] = vals[p]!;
        labs[wl] = labs[p]!;
        wl++;
      } else {
        scratchRow[wr] = i;
        scratchVal[wr] = vals[p]!;
        scratchLab[wr] = labs[p]!;
        wr++;
      }
    }
    order.set(scratchRow.subarray(0, wr), wl);
    vals.set(scratchVal.subarray(0, wr), wl);
    labs.set(scratchLab.subarray(0, wr), wl);
  }
  const depth = s.depth[t]! + 1;
  const l = addNodeInPlace(s, start, pos, depth);
  const r = addNodeInPlace(s, pos, end, depth);
  s.feature[t] = f;
  s.threshold[t] = s.candThreshold[t]!;
  s.left[t] = l;
  s.right[t] = r;
  return l;
}
