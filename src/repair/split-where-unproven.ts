import type { Box } from '../prove/index.js';
import { boxShare } from './box-share.js';
import { type ReadableCutLimits, readableMiddle } from './readable-cut.js';

/**
 * Halves a region that a proof could not settle within its piece budget: at a readable value
 * near the middle of the input along which the unproven volume is most unevenly shared between
 * the halves (so one half is mostly proven ground), ties to the input widest relative to the
 * rule's box. Proving the halves takes about as many pieces as proving the whole would have
 * (branch and bound splits the same way), but each gets the full per-proof budget.
 *
 * @param open the cells the proof left unproven (disjoint boxes in the region)
 * @returns the two halves, or none when no input can be split
 */
export function splitWhereUnproven(region: Box, open: readonly Box[], ruleBox: Box, limits: readonly ReadableCutLimits[]): Box[] {
  let best: { dim: number; cut: number; score: number } | undefined;
  for (let i = 0; i < region.length; i++) {
    const [lo, hi] = region[i]!;
    const cut = readableMiddle(lo, hi, Math.max(limits[i]!.finest, limits[i]!.clearance));
    if (cut === undefined) continue;
    let below = 0;
    let above = 0;
    for (const b of open) {
      const v = boxShare(b, region);
      const w = b[i]![1] - b[i]![0];
      const part = w > 0 ? Math.min(1, Math.max(0, (cut - b[i]![0]) / w)) : b[i]![0] < cut ? 1 : 0;
      below += v * part;
      above += v * (1 - part);
    }
    const ruleWidth = ruleBox[i]![1] - ruleBox[i]![0];
    // the relative width only breaks ties: it is below 1, scaled far under any real imbalance
    const tieBreak = ruleWidth > 0 ? (1e-6 * (hi - lo)) / ruleWidth : 0;
    const score = Math.abs(below - above) / Math.max(below + above, Number.MIN_VALUE) + tieBreak;
    if (best === undefined || score > best.score) best = { dim: i, cut, score };
  }
  if (best === undefined) return [];
  const { dim, cut } = best;
  return [region.map((b, i) => (i === dim ? ([b[0], cut] as const) : b)), region.map((b, i) => (i === dim ? ([cut, b[1]] as const) : b))];
}
