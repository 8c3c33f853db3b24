/** A box of grid indices: lo[f] ..= hi[f] on each axis. */
export interface GridBox {
  readonly lo: readonly number[];
  readonly hi: readonly number[];
  /** Grid points inside the box (all of them members). */
  readonly points: number;
}

/**
 * Groups the marked points of a grid into boxes of grid indices, each holding only marked
 * points, that together cover every marked point (boxes may overlap). Greedy: in grid order,
 * each marked point not yet covered seeds a box, which grows on each axis in turn, first upward
 * and then downward, one slab at a time while the whole new slab is marked; this is tried for
 * each of the d rotations of the axis order, and the box covering the most not-yet-covered
 * points (then the most points) is kept and its points covered. This is the usual greedy cover of a binary grid by rectangles (finding the fewest is
 * NP-hard; the greedy result is not minimal but every box is exact).
 * @param marked one flag per grid point in grid order (last axis fastest); not changed
 * @param shape number of values per axis
 * Cost: O(boxes · d · box size · d) on top of one pass over the grid.
 */
export function gridBoxes(marked: Uint8Array, shape: readonly number[]): GridBox[] {
  const d = shape.length;
  const stride = new Array<number>(d).fill(1);
  for (let f = d - 2; f >= 0; f--) stride[f] = stride[f + 1]! * shape[f + 1]!;
  const covered = new Uint8Array(marked.length);
  const boxes: GridBox[] = [];
  const idx = new Array<number>(d);
  for (let p = 0; p < marked.length; p++) {
    if (marked[p] !== 1 || covered[p] === 1) continue;
    for (let f = 0; f < d; f++) idx[f] = Math.floor(p / stride[f]!) % shape[f]!;
    // grow in each of the d rotations of the axis order; keep the box adding most new points
    let best: { lo: number[]; hi: number[]; fresh: number; points: number } | undefined;
    for (let r = 0; r < d; r++) {
      const lo = [...idx];
      const hi = [...idx];
      for (let s = 0; s < d; s++) {
        const f = (r + s) % d;
        while (hi[f]! + 1 < shape[f]! && slabMarked(marked, lo, hi, f, hi[f]! + 1, stride)) hi[f]!++;
        while (lo[f]! > 0 && slabMarked(marked, lo, hi, f, lo[f]! - 1, stride)) lo[f]!--;
      }
      let fresh = 0;
      let points = 0;
      forEachIn(lo, hi, stride, (q) => {
        points++;
        if (covered[q] === 0) fresh++;
      });
      if (!best || fresh > best.fresh || (fresh === best.fresh && points > best.points)) best = { lo, hi, fresh, points };
    }
    forEachIn(best!.lo, best!.hi, stride, (q) => {
      covered[q] = 1;
    });
    boxes.push({ lo: best!.lo, hi: best!.hi, points: best!.points });
  }
  return boxes;
}

/** True when every point of the box with axis f fixed at `at` is marked. */
function slabMarked(marked: Uint8Array, lo: readonly number[], hi: readonly number[], f: number, at: number, stride: readonly number[]): boolean {
  const l = [...lo];
  const h = [...hi];
  l[f] = at;
  h[f] = at;
  let all = true;
  forEachIn(l, h, stride, (q) => {
    if (marked[q] !== 1) all = false;
  });
  return all;
}

/** Calls visit with the flat index of every point of the index box (odometer order). */
function forEachIn(lo: readonly number[], hi: readonly number[], stride: readonly number[], visit: (q: number) => void): void {
  const d = lo.length;
  const i = [...lo];
  for (;;) {
    let q = 0;
    for (let f = 0; f < d; f++) q += i[f]! * stride[f]!;
    visit(q);
    let f = d - 1;
    while (f >= 0 && i[f] === hi[f]) {
      i[f] = lo[f]!;
      f--;
    }
    if (f < 0) return;
    i[f]!++;
  }
}
