import type { GrowState } from './grow-state.js';

/**
 * Appends a node owning sorted positions [start, end), fills in its class weights and majority
 * label (ties to the lowest class index), and leaves it a leaf for now. O(end - start).
 * @returns the new node's index
 */
export function addNodeInPlace(s: GrowState, start: number, end: number, depth: number): number {
  const { classes, labs, weights, order, counts } = s;
  const t = s.nodeCount++;
  s.start[t] = start;
  s.end[t] = end;
  s.depth[t] = depth;
  const cBase = t * classes;
  // input 0's segment holds the same rows as every other input's
  if (weights === null) {
    for (let p = start; p < end; p++) counts[cBase + labs[p]!]++;
  } else {
    for (let p = start; p < end; p++) counts[cBase + labs[p]!] += weights[order[p]!]!;
  }
  let best = 0;
  for (let k = 1; k < classes; k++) if (counts[cBase + k]! > counts[cBase + best]!) best = k;
  s.label[t] = best;
  return t;
}
