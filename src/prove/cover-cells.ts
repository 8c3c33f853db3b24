import type { Box } from './branch-and-bound.js';

/** Receives one cell: its corners (read them before returning) and whether the boxes cover it. */
export type CellVisitor = (lo: Float64Array, hi: Float64Array, covered: boolean) => void;

/**
 * Cuts a region into cells, each either inside one of the boxes or outside all of them, and
 * hands every cell to `visit`. Recursive space partitioning for Klee's measure problem
 * (J. L. Bentley, "Algorithms for Klee's rectangle problems", Carnegie Mellon University, 1977;
 * M. H. Overmars & C.-K. Yap, "New upper bounds in Klee's measure problem", SIAM Journal on
 * Computing 20(6), 1991, use the same idea with a balanced partition): a cell that no box meets
 * is uncovered, one that a box contains is covered, and any other cell is halved at the median
 * of the box edges strictly inside it, on the input with the most such edges. Every cut is a box
 * edge, so no cut repeats on a path and the recursion ends; the cells are exact (no grid). For
 * boxes that hardly overlap, such as rule tables and proof pieces, the number of cells stays close
 * to the number of boxes.
 *
 * Inputs on which the region has zero width are not cut: a box meets the region there when it
 * contains the region's value.
 *
 * @param region closed box (not changed)
 * @param boxes closed boxes, same inputs (not changed); parts outside the region are ignored
 * Cost: O(cells · b · d) for b boxes in d inputs.
 */
export function coverCells(region: Box, boxes: readonly Box[], visit: CellVisitor): void {
  const d = region.length;
  const n = boxes.length;
  const blo = new Float64Array(n * d);
  const bhi = new Float64Array(n * d);
  boxes.forEach((b, k) => {
    for (let i = 0; i < d; i++) [blo[k * d + i], bhi[k * d + i]] = [b[i]![0], b[i]![1]];
  });
  const rlo = Float64Array.from(region, (r) => r[0]);
  const rhi = Float64Array.from(region, (r) => r[1]);
  const all = new Int32Array(n);
  for (let k = 0; k < n; k++) all[k] = k;
  const edges: number[] = [];
  const recurse = (lo: Float64Array, hi: Float64Array, candidates: Int32Array): void => {
    const kept: number[] = [];
    for (const k of candidates) {
      let meets = true;
      let contains = true;
      for (let i = 0; i < d && meets; i++) {
        const a = blo[k * d + i]!;
        const z = bhi[k * d + i]!;
        meets = hi[i]! > lo[i]! ? Math.min(z, hi[i]!) > Math.max(a, lo[i]!) : a <= lo[i]! && z >= hi[i]!;
        contains = contains && a <= lo[i]! && z >= hi[i]!;
      }
      if (!meets) continue;
      if (contains) {
        visit(lo, hi, true);
        return;
      }
      kept.push(k);
    }
    if (kept.length === 0) {
      visit(lo, hi, false);
      return;
    }
    let dim = -1;
    let bestCount = 0;
    let cut = 0;
    for (let i = 0; i < d; i++) {
      edges.length = 0;
      for (const k of kept) {
        for (const e of [blo[k * d + i]!, bhi[k * d + i]!]) if (e > lo[i]! && e < hi[i]!) edges.push(e);
      }
      if (edges.length > bestCount) {
        bestCount = edges.length;
        dim = i;
        edges.sort((a, b) => a - b);
        cut = edges[edges.length >> 1]!;
      }
    }
    // a kept box meets the cell without containing it, so one of its edges lies strictly inside
    const keptIndex = Int32Array.from(kept);
    const midHi = Float64Array.from(hi);
    midHi[dim] = cut;
    recurse(lo, midHi, keptIndex);
    const midLo = Float64Array.from(lo);
    midLo[dim] = cut;
    recurse(midLo, hi, keptIndex);
  };
  recurse(rlo, rhi, all);
}
