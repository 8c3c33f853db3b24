import type { Box } from '../prove/index.js';
import { type GuidePoints, OBSTACLE_KIND, PointKind, pointInBox } from './guide-points.js';
import { type ReadableCutLimits, readableMiddle } from './readable-cut.js';

/** Positions tried per input, as shares of the region's width (readable values near them). */
const CUT_POSITIONS = [0.125, 0.25, 0.375, 0.5, 0.625, 0.75, 0.875];

/**
 * Splits a region whose violations are spread through it rather than against its faces: the
 * readable cut, among values near the eighths of each input's width, that most reduces the Gini
 * impurity of allowed (uniform) points against obstacle points (the CART split rule: Breiman,
 * Friedman, Olshen & Stone, "Classification and Regression Trees", Wadsworth, 1984). The two
 * parts are peeled again; the cleaner one usually becomes a proven box.
 * @returns the two parts, or undefined when no cut separates anything
 */
export function separatingCut(region: Box, points: GuidePoints, limits: readonly ReadableCutLimits[]): [Box, Box] | undefined {
  const d = points.d;
  const rows: number[] = [];
  for (let r = 0; r < points.n; r++) {
    const k = points.kind[r]!;
    if ((k === PointKind.uniform || k >= OBSTACLE_KIND) && pointInBox(points.x, r, d, region)) rows.push(r);
  }
  let bad = 0;
  for (const r of rows) if (points.kind[r]! >= OBSTACLE_KIND) bad++;
  const good = rows.length - bad;
  if (bad === 0 || good === 0) return undefined;
  const gini = (g: number, b: number): number => (g + b > 0 ? (g + b) * (1 - (g * g + b * b) / ((g + b) * (g + b))) : 0);
  const parent = gini(good, bad);
  let best: { dim: number; cut: number; gain: number } | undefined;
  for (let i = 0; i < d; i++) {
    const [lo, hi] = region[i]!;
    const w = hi - lo;
    if (!(w > 0)) continue;
    for (const f of CUT_POSITIONS) {
      const cut = readableMiddle(lo + (f - 0.125) * w, lo + (f + 0.125) * w, Math.max(limits[i]!.finest, limits[i]!.clearance));
      if (cut === undefined || !(cut > lo && cut < hi)) continue;
      let gl = 0;
      let bl = 0;
      for (const r of rows) {
        if (points.x[r * d + i]! > cut) continue;
        if (points.kind[r]! >= OBSTACLE_KIND) bl++;
        else gl++;
      }
      const gain = parent - gini(gl, bl) - gini(good - gl, bad - bl);
      if (best === undefined || gain > best.gain) best = { dim: i, cut, gain };
    }
  }
  if (best === undefined || !(best.gain > 0)) return undefined;
  const { dim, cut } = best;
  return [region.map((b, i) => (i === dim ? ([b[0], cut] as const) : b)), region.map((b, i) => (i === dim ? ([cut, b[1]] as const) : b))];
}
