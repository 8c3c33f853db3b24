import type { Box, ProveResult } from '../prove/index.js';
import { boxShare } from './box-share.js';
import { PointKind, appendPointsInPlace, screeningPoints } from './guide-points.js';
import { planMainBox } from './plan-main-box.js';
import { type RepairContext, addLabelledPoints, budgetLeft, proveIn } from './repair-context.js';
import { separatingCut } from './separating-cut.js';
import { splitWhereUnproven } from './split-where-unproven.js';
import { uncoveredBoxes } from './uncovered-boxes.js';
import { SEARCH_STARTS, allowedMargin, leastMarginRows, searchViolations } from './violation-search.js';
import { type WorkItem, pushWork, strikeLimits } from './work-list.js';

/**
 * Half-width of the neighbourhood sampled around a violation found by search or proof, as a
 * share of the region's width per input: wide enough to see the extent of a pocket a few
 * percent across, so one cut clears it instead of one cut per point. Choice of this project.
 */
export const NEIGHBOURHOOD_SHARE = 0.05;
/** Points drawn in each such neighbourhood (one onnxruntime batch; cheap). */
export const NEIGHBOURHOOD_POINTS = 256;
/** Most violations per search whose neighbourhoods are sampled. */
const NEIGHBOURHOODS_PER_SEARCH = 4;

/**
 * Largest unproven share of a region that is peeled off like violations (the centres of the
 * unproven cells become obstacles); a larger unproven share is split in halves instead. A proof
 * that leaves under 2 % unproven has usually failed only along one face near the boundary.
 * Choice of this project, from the demo's proofs (docs/repair.md).
 */
export const PEEL_UNPROVEN_MAX = 0.02;

export interface PeelOptions {
  /** Uniform points drawn in each region before it is planned; as many again on its surface. */
  readonly screenPoints: number;
  readonly maxSubRules: number;
  /** Regions below this share of the rule's box are dropped, not repaired. */
  readonly minVolumeShare: number;
  /** Disjoint regions inside the rule's box to start from (default: the rule's box). */
  readonly start?: readonly Box[];
}

/** A proven box with the proof that proved it. */
export interface ProvenPart {
  readonly box: Box;
  readonly proof: ProveResult;
}

/**
 * Repairs the rule's box by peeling and proving. A work list of regions starts with the box and
 * the largest region is taken first. It is screened (fresh uniform and surface points labelled
 * by the runtime) and planned (`planMainBox`): a region with obstacles is replaced by its main
 * box and slabs (adjacent slabs are joined on the list); one whose violations are spread through
 * it is split (`separatingCut`). A clean region is searched for violations the points missed
 * (`searchViolations`), then proven by proveBox on exactly that box. Proven → kept. A violation
 * found by search or proof → it and its neighbourhood's violations become obstacles and the
 * region goes back with one more strike (each strike doubles the clearance of its cuts, so a
 * face creeping after a slanted boundary moves in growing steps). Unknown → search from the
 * unproven cells; with nothing found, a small unproven residue (at most PEEL_UNPROVEN_MAX) is
 * peeled off like violations, a larger one is halved (`splitWhereUnproven`). Regions below
 * `minVolumeShare` of the rule's box are dropped. Stops at `maxSubRules` proven parts, at the
 * deadline or when the list is empty. Only proveBox decides what is kept.
 */
export async function peelAndProve(ctx: RepairContext, options: PeelOptions): Promise<ProvenPart[]> {
  const d = ctx.ruleBox.length;
  const kept: ProvenPart[] = [];
  const work: WorkItem[] = (options.start ?? [ctx.ruleBox]).map((box) => ({ box, slab: false, strikes: 0 }));
  const reserve: WorkItem[] = [];
  const share = (b: Box): number => boxShare(b, ctx.ruleBox);
  while (work.length > 0 && kept.length < options.maxSubRules && budgetLeft(ctx)) {
    let pick = 0;
    for (let k = 1; k < work.length; k++) if (share(work[k]!.box) > share(work[pick]!.box)) pick = k;
    const item = work.splice(pick, 1)[0]!;
    const region = item.box;
    ctx.steps++;
    if (share(region) < options.minVolumeShare) {
      // too small alone; a slab stays in reserve in case a later slab joins it
      if (item.slab) reserve.push(item);
      ctx.onEvent?.({ kind: 'drop', box: region, share: share(region) });
      continue;
    }
    const screen = screeningPoints(region, options.screenPoints, options.screenPoints, ctx.rng);
    await addLabelledPoints(ctx, screen.subarray(0, options.screenPoints * d), options.screenPoints, PointKind.uniform);
    await addLabelledPoints(ctx, screen.subarray(options.screenPoints * d), options.screenPoints, PointKind.other);
    const plan = planMainBox(region, ctx.points, strikeLimits(ctx.limits, item.strikes));
    ctx.onEvent?.({ kind: 'plan', box: region, share: share(region), strikes: item.strikes, slabs: plan.slabs.length, ...(plan.main ? { main: plan.main } : {}) });
    if (plan.main === undefined || share(plan.main) < options.minVolumeShare) {
      // violations spread through the region: peeling leaves nothing worth proving, so split it
      for (const part of separatingCut(region, ctx.points, ctx.limits) ?? []) work.push({ box: part, slab: false, strikes: 0 });
      continue;
    }
    if (plan.slabs.length > 0) {
      work.push({ box: plan.main, slab: false, strikes: item.strikes });
      for (const slab of plan.slabs) pushWork(work, reserve, { box: slab, slab: true, strikes: 0 });
      continue;
    }
    const margin = allowedMargin(ctx, screen, 2 * options.screenPoints);
    const found = await searchFrom(ctx, region, screen, leastMarginRows(margin, SEARCH_STARTS));
    if (found) {
      work.push({ box: region, slab: false, strikes: item.strikes + 1 });
      continue;
    }
    const proof = await proveIn(ctx, region);
    ctx.onEvent?.({ kind: 'proof', box: region, status: proof.status, pieces: proof.pieces, provenVolumeFraction: proof.provenVolumeFraction });
    if (proof.status === 'proven') {
      kept.push({ box: region, proof });
    } else if (proof.counterexample !== undefined) {
      const c = Float64Array.from(proof.counterexample.x);
      appendPointsInPlace(ctx.points, c, [PointKind.violation], 1);
      await sampleNeighbourhoods(ctx, region, c, 1);
      work.push({ box: region, slab: false, strikes: item.strikes + 1 });
    } else if (budgetLeft(ctx)) {
      const open = uncoveredBoxes(region, proof.provenBoxes);
      const centres = new Float64Array(open.length * d);
      open.forEach((b, k) => b.forEach(([lo, hi], i) => (centres[k * d + i] = lo + (hi - lo) / 2)));
      if (await searchFrom(ctx, region, centres, leastMarginRows(allowedMargin(ctx, centres, open.length), 4 * SEARCH_STARTS))) {
        work.push({ box: region, slab: false, strikes: item.strikes + 1 });
      } else if (1 - proof.provenVolumeFraction <= PEEL_UNPROVEN_MAX) {
        appendPointsInPlace(ctx.points, centres, new Uint8Array(open.length).fill(PointKind.unproven), open.length);
        work.push({ box: region, slab: false, strikes: item.strikes + 1 });
      } else {
        for (const half of splitWhereUnproven(region, open, ctx.ruleBox, ctx.limits)) work.push({ box: half, slab: false, strikes: 0 });
      }
    }
  }
  return kept;
}

/** Runs the violation search from the given rows of `points`; samples around what it finds. */
async function searchFrom(ctx: RepairContext, region: Box, points: Float64Array, rows: readonly number[]): Promise<boolean> {
  const d = region.length;
  const starts = new Float64Array(rows.length * d);
  rows.forEach((r, k) => starts.set(points.subarray(r * d, r * d + d), k * d));
  const found = await searchViolations(ctx, region, starts, rows.length);
  const count = found.length / d;
  ctx.onEvent?.({ kind: 'search', box: region, violations: count });
  if (count === 0) return false;
  await sampleNeighbourhoods(ctx, region, found, Math.min(count, NEIGHBOURHOODS_PER_SEARCH));
  return true;
}

/** Labels NEIGHBOURHOOD_POINTS uniform points around each of the first m centres (inside the region). */
async function sampleNeighbourhoods(ctx: RepairContext, region: Box, centres: Float64Array, m: number): Promise<void> {
  const d = region.length;
  for (let k = 0; k < m; k++) {
    const around = region.map(([lo, hi], i) => {
      const h = NEIGHBOURHOOD_SHARE * (hi - lo);
      const c = centres[k * d + i]!;
      return [Math.max(lo, c - h), Math.min(hi, c + h)] as const;
    });
    await addLabelledPoints(ctx, screeningPoints(around, NEIGHBOURHOOD_POINTS, 0, ctx.rng), NEIGHBOURHOOD_POINTS, PointKind.other);
  }
}
