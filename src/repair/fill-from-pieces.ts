import type { Box } from '../prove/index.js';
import { boxShare } from './box-share.js';
import type { ProvenPart } from './peel-and-prove.js';
import { readableAbove, readableBelow } from './readable-near.js';
import { type RepairContext, proveIn, timeLeft } from './repair-context.js';
import { uncoveredBoxes } from './uncovered-boxes.js';

/**
 * A filled box may be this many times smaller than the peeling's `minVolumeShare`: it costs no
 * proof of its own (it lies in pieces proven already), and the boxes along a slanted boundary
 * are small. Measured on the demo: a quarter gave 91.7 % of the largest rule's box against
 * 88.8 % without the fill (docs/repair.md). Choice of this project.
 */
export const FILL_SHARE_DIVISOR = 4;
/**
 * Pieces each mapping proof may bound: small, so that the map spreads over many uncovered parts
 * rather than refining the first ones along their boundaries (on the demo's four largest losses
 * 500 covered 0.5–2 points more of each box than 3,000, with fewer pieces). Choice of this project.
 */
export const MAP_PIECES_PER_CELL = 500;
/**
 * Passes of the map over the uncovered parts (while pieces are left): a second pass goes on
 * from where the first stopped, as its proofs reuse the pieces proven before (on the demo's
 * largest rule 95.5 % of the box after three passes, 94.4 % after one). Choice of this project.
 */
export const MAP_ROUNDS = 2;
/** Seeds under this share of the smallest box kept are not tried (they rarely grow that far). */
const SEED_SHARE_DIVISOR = 16;

export interface FillOptions {
  /** Most proven parts in all (those given included). */
  readonly maxSubRules: number;
  /** Boxes below this share of the rule's box are not kept (the peeling's share / FILL_SHARE_DIVISOR). */
  readonly minVolumeShare: number;
  /** Pieces the mapping proofs may bound together (within the repair's own piece budget). */
  readonly mapPieces: number;
}

type MutableBox = Array<[number, number]>;

/**
 * Covers more of the rule's box after peeling, from the pieces proveBox proved: (1) **map** —
 * each part of the box that no proven part covers, largest first, is searched by proveBox going
 * on past counterexamples (`keepGoing`, MAP_PIECES_PER_CELL pieces each), so its proven pieces
 * tile where the rule holds up to near the network's boundaries; (2) **grow** — each kept part,
 * largest first, grows face by face as far as the proven pieces reach (never into another kept
 * part, never past the rule's box), each face stopped at a readable value (`readableBelow`);
 * (3) **cut** — from each proven piece in the uncovered parts, largest first, a readable box
 * inside it is grown the same way and kept if it reaches `minVolumeShare`. A grown or cut box is
 * kept only when proveBox proves it on exactly that box (inside the known pieces it costs no new
 * piece): the pieces only choose where to cut.
 * @param parts the proven parts so far (not changed)
 * @returns those parts and the new ones
 */
export async function fillFromPieces(ctx: RepairContext, parts: readonly ProvenPart[], options: FillOptions): Promise<ProvenPart[]> {
  const kept = [...parts];
  const share = (b: Box): number => boxShare(b, ctx.ruleBox);
  const open = uncoveredBoxes(ctx.ruleBox, kept.map((p) => p.box)).sort((a, b) => share(b) - share(a));
  // no map when no new box may be kept: the kept parts still grow into the pieces proven so far
  const stopAt = kept.length >= options.maxSubRules ? 0 : Math.min(ctx.maxPieces, ctx.pieces + options.mapPieces);
  for (let round = 0; round < MAP_ROUNDS; round++) {
    for (const cell of open) {
      if (timeLeft(ctx) <= 0 || ctx.pieces >= stopAt) break;
      if (share(cell) < options.minVolumeShare / 8) continue;
      await proveIn(ctx, cell, Math.min(MAP_PIECES_PER_CELL, stopAt - ctx.pieces));
    }
  }
  // first the kept parts grow (no new sub-rule), then new boxes are cut where they cannot reach
  kept.sort((a, b) => share(b.box) - share(a.box));
  for (let k = 0; k < kept.length && timeLeft(ctx) > 0; k++) {
    const others = kept.filter((_, j) => j !== k);
    const box = growAll(ctx, kept[k]!.box, others);
    if (share(box) <= share(kept[k]!.box)) continue;
    const proof = await proveIn(ctx, box);
    if (proof.status === 'proven') kept[k] = { box, proof };
  }
  const seeds: Box[] = [];
  for (const cell of open) for (const p of ctx.known) {
    const s = intersect(p, cell);
    if (s !== undefined) seeds.push(s);
  }
  seeds.sort((a, b) => share(b) - share(a));
  for (const seed of seeds) {
    if (kept.length >= options.maxSubRules || timeLeft(ctx) <= 0) break;
    if (share(seed) * SEED_SHARE_DIVISOR < options.minVolumeShare) break;
    if (kept.some((p) => containsCentre(p.box, seed))) continue;
    const inner = innerReadable(ctx, seed, kept);
    if (inner === undefined || kept.some((p) => intersect(p.box, inner) !== undefined)) continue;
    const box = growAll(ctx, inner, kept);
    if (share(box) < options.minVolumeShare) continue;
    const proof = await proveIn(ctx, box);
    if (proof.status === 'proven') kept.push({ box, proof });
  }
  return kept;
}

/** `from` grown face by face (see growFace), two rounds over the inputs. */
function growAll(ctx: RepairContext, from: Box, kept: readonly ProvenPart[]): MutableBox {
  const box = from.map((r) => [r[0], r[1]] as [number, number]);
  for (let round = 0; round < 2; round++) {
    for (let i = 0; i < box.length; i++) {
      growFace(ctx, box, i, 'hi', kept);
      growFace(ctx, box, i, 'lo', kept);
    }
  }
  return box;
}

/** Whether closed boxes a and b overlap on input i: with positive width there where `b` has. */
function overlapsOn(a: Box, b: Box, i: number): boolean {
  const lo = Math.max(a[i]![0], b[i]![0]);
  const hi = Math.min(a[i]![1], b[i]![1]);
  return hi > lo || (hi === lo && b[i]![1] === b[i]![0]);
}

/** The intersection of two closed boxes when they overlap on every input (`overlapsOn`). */
function intersect(a: Box, b: Box): Box | undefined {
  if (!b.every((_, i) => overlapsOn(a, b, i))) return undefined;
  return b.map(([lo, hi], i) => [Math.max(a[i]![0], lo), Math.min(a[i]![1], hi)] as const);
}

function containsCentre(box: Box, of: Box): boolean {
  return of.every(([lo, hi], i) => {
    const c = lo + (hi - lo) / 2;
    return c >= box[i]![0] && c <= box[i]![1];
  });
}

/** Whether a value is a face of the rule's box or of a kept part on input i (readable already). */
function isFace(ctx: RepairContext, kept: readonly ProvenPart[], i: number, v: number): boolean {
  return v === ctx.ruleBox[i]![0] || v === ctx.ruleBox[i]![1] || kept.some((p) => p.box[i]![0] === v || p.box[i]![1] === v);
}

/**
 * A box with readable faces inside the seed keeping at least half its width on every input
 * (faces of the rule's box or of kept parts stay as they are), or undefined when the seed is
 * too thin for the readable steps.
 */
function innerReadable(ctx: RepairContext, seed: Box, kept: readonly ProvenPart[]): MutableBox | undefined {
  const out: MutableBox = [];
  for (let i = 0; i < seed.length; i++) {
    const [lo, hi] = seed[i]!;
    if (hi === lo) {
      out.push([lo, hi]);
      continue;
    }
    const window = (hi - lo) / 4;
    const a = isFace(ctx, kept, i, lo) ? lo : readableAbove(lo, hi, window, ctx.limits[i]!);
    const b = isFace(ctx, kept, i, hi) ? hi : readableBelow(hi, lo, window, ctx.limits[i]!);
    if (a === undefined || b === undefined || !(b > a)) return undefined;
    out.push([a, b]);
  }
  return out;
}

/**
 * Moves one face of `box` outward (in place) as far as the known proven pieces cover the slab
 * it sweeps, stopping at the rule's box and before any kept part the slab would overlap; the
 * new face is that limit when it is a face already, else a readable value at most the input's
 * allowance short of where the cover ends.
 */
function growFace(ctx: RepairContext, box: MutableBox, i: number, side: 'lo' | 'hi', kept: readonly ProvenPart[]): void {
  const up = side === 'hi';
  const at = box[i]![up ? 1 : 0];
  let limit = ctx.ruleBox[i]![up ? 1 : 0];
  for (const p of kept) {
    if (!crossOverlap(p.box, box, i)) continue;
    if (up && p.box[i]![0] >= at) limit = Math.min(limit, p.box[i]![0]);
    if (!up && p.box[i]![1] <= at) limit = Math.max(limit, p.box[i]![1]);
  }
  if (up ? limit <= at : limit >= at) return;
  const slab = box.map((r) => [r[0], r[1]] as [number, number]);
  slab[i] = up ? [at, limit] : [limit, at];
  const near = ctx.known.filter((k) => k.every(([lo, hi], j) => lo <= slab[j]![1] && hi >= slab[j]![0]));
  let reach = limit;
  for (const gap of uncoveredBoxes(slab, near)) reach = up ? Math.min(reach, gap[i]![0]) : Math.max(reach, gap[i]![1]);
  if (up ? reach <= at : reach >= at) return;
  const allowance = ctx.limits[i]!.allowance;
  const v = reach === limit ? limit : up ? readableBelow(reach, at, allowance, ctx.limits[i]!) : readableAbove(reach, at, allowance, ctx.limits[i]!);
  if (v !== undefined) box[i]![up ? 1 : 0] = v;
}

/** Whether two boxes overlap (`overlapsOn`) on every input but i. */
function crossOverlap(a: Box, of: Box, i: number): boolean {
  return of.every((_, j) => j === i || overlapsOn(a, of, j));
}
