import type { Decision, Normalization } from '../types.js';
import type { Network } from './network.js';
import { marginNetwork, marginSpec } from './margin-network.js';
import { intervalBounds } from './interval.js';
import { linearBounds } from './linear.js';
import { networkBoxInPlace, toScenarioUnits } from './input-box.js';
import { type ConfirmFn, type ProofCounterexample, confirmCandidates } from './candidates.js';
import { provingGroup, splitDimension, worstRow } from './split-choice.js';
import { coverCells } from './cover-cells.js';

/** A closed box, one [min, max] per input, in scenario units. */
export type Box = ReadonlyArray<readonly [number, number]>;

export interface ProveOptions {
  /** Most pieces to bound (each costs one interval and at most one linear bound). */
  readonly maxBoxes: number;
  readonly maxSeconds: number;
  /** Clock in milliseconds (e.g. performance.now); proveBox reads no other clock. */
  readonly now: () => number;
  /** The runtime's advisory for points in scenario units; only confirmed points refute. */
  readonly confirm: ConfirmFn;
  /** The scenario's normalisation: the network sees fl32((x − offset) / scale). */
  readonly normalize?: Normalization;
  /** Margin a piece must exceed beyond the float32 allowance (score units, default 0). */
  readonly minMargin?: number;
  /** Pieces bounded per round and per confirm call (default 64). */
  readonly batchSize?: number;
  /** Fall back to back-substituted inner bounds when the forward ones fail (default true). */
  readonly refine?: boolean;
  /**
   * Pieces already proven by earlier proveBox calls for the same network, allowed set, decision
   * and normalisation, with a `minMargin` at least this call's (boxes in scenario units). The
   * part of the box inside them is accepted without bounding and only the rest is searched.
   * The caller vouches for them: pass only `provenBoxes` of such calls (src/repair does).
   */
  readonly known?: readonly Box[];
  /**
   * Go on past a confirmed counterexample (default false: stop at the first): every unproven
   * piece is split as before, so within the budget `provenBoxes` maps where the rule holds. The
   * status is then `refuted` (with the first counterexample) when any was found.
   */
  readonly keepGoing?: boolean;
}

export interface ProveResult {
  readonly status: 'proven' | 'refuted' | 'unknown';
  /** Share of the box's volume covered by proven pieces (over inputs of non-zero width). */
  readonly provenVolumeFraction: number;
  /** Pieces bounded. */
  readonly pieces: number;
  readonly counterexample?: ProofCounterexample;
  /** The proven pieces, in scenario units. */
  readonly provenBoxes: Box[];
  /** Largest float32 rounding allowance charged by the linear bound of a proven piece. */
  readonly slack: number;
  /** Pieces too small to split that were neither proven nor refuted. */
  readonly unresolved: number;
  readonly method: string;
  /** How many of the first `provenBoxes` are parts of `known` pieces (0 without `known`). */
  readonly reused?: number;
}

export const PROOF_METHOD = 'branch and bound: interval bounds, then linear relaxation with back-substitution';

interface Piece {
  readonly lo: Float64Array;
  readonly hi: Float64Array;
}

/**
 * Proves or refutes "inputs in `box` ⇒ advisory ∈ allowed" for the float32 network by branch
 * and bound over the input box: each piece is bounded by interval propagation, then, if
 * that fails, by linear relaxation; a piece is proven when for some allowed a every margin
 * a − j (rival j) has a lower bound above `minMargin` with the float32 allowance included.
 * Unproven pieces offer two candidates (the centre and the corner minimising the linear bound),
 * screened by the forward pass (outside the allowed set, or within the piece's float32
 * allowance of it) and confirmed by `confirm`; otherwise they are halved along
 * the input with the largest width × |coefficient of the linear bound|.
 * A pure function of its arguments apart from `now` and `confirm`.
 *
 * @param box closed box in scenario units, one [min, max] per network input
 * @param allowed advisory indices (output positions) the rule allows
 */
export async function proveBox(net: Network, box: Box, allowed: readonly number[], decision: Decision, options: ProveOptions): Promise<ProveResult> {
  const d = net.inputSize;
  if (box.length !== d) throw new RangeError(`proveBox expects ${d} input ranges, found ${box.length}`);
  const root: Piece = { lo: Float64Array.from(box, (b) => b[0]), hi: Float64Array.from(box, (b) => b[1]) };
  for (let i = 0; i < d; i++) {
    if (!(Number.isFinite(root.lo[i]!) && Number.isFinite(root.hi[i]!) && root.lo[i]! <= root.hi[i]!)) {
      throw new RangeError(`proveBox input ${i}: expected finite min <= max, found [${root.lo[i]}, ${root.hi[i]}]`);
    }
  }
  const spec = marginSpec(net.outputSize, allowed, decision);
  const mnet = marginNetwork(net, spec);
  const allowedSet = new Set(spec.allowed);
  const minMargin = options.minMargin ?? 0;
  const batchSize = Math.max(1, options.batchSize ?? 64);
  const refine = options.refine !== false && net.layers.filter((l) => l.kind !== 'affine').length > 1;
  const start = options.now();
  const rootWidth = Float64Array.from(root.hi, (h, i) => h - root.lo[i]!);
  const fraction = (p: Piece): number => {
    let f = 1;
    for (let i = 0; i < d; i++) if (rootWidth[i]! > 0) f *= (p.hi[i]! - p.lo[i]!) / rootWidth[i]!;
    return f;
  };
  const provenBoxes: Box[] = [];
  let proven = 0;
  let pieces = 0;
  let slack = 0;
  let unresolved = 0;
  let reused = 0;
  let firstCex: ProofCounterexample | undefined;
  const accept = (p: Piece): void => {
    proven += fraction(p);
    provenBoxes.push(Array.from(p.lo, (v, i) => [v, p.hi[i]!] as const));
  };
  const result = (status: ProveResult['status'], cex?: ProofCounterexample): ProveResult => ({
    status,
    provenVolumeFraction: status === 'proven' ? 1 : Math.min(1, proven),
    pieces,
    ...(cex ? { counterexample: cex } : {}),
    provenBoxes,
    slack,
    unresolved,
    method: PROOF_METHOD,
    reused,
  });
  if (spec.rows === 0) {
    accept(root);
    return result('proven');
  }
  // first in, first out: larger pieces are bounded before their smaller descendants
  let queue: Piece[] = [root];
  if (options.known !== undefined && options.known.length > 0) {
    // cells of the box inside a known piece are proven already; the others are searched
    queue = [];
    coverCells(box, options.known, (lo, hi, covered) => {
      const cell = { lo: Float64Array.from(lo), hi: Float64Array.from(hi) };
      if (covered) accept(cell);
      else queue.push(cell);
    });
    reused = provenBoxes.length;
    queue.sort((a, b) => fraction(b) - fraction(a));
  }
  let head = 0;
  while (head < queue.length) {
    if (pieces >= options.maxBoxes || options.now() - start > options.maxSeconds * 1000) break;
    const nb = Math.min(batchSize, Math.ceil(options.maxBoxes - pieces), queue.length - head);
    const batch = queue.slice(head, head + nb);
    head += nb;
    if (head > 4096 && head * 2 > queue.length) {
      queue = queue.slice(head);
      head = 0;
    }
    pieces += nb;
    const nlo = new Float64Array(nb * d);
    const nhi = new Float64Array(nb * d);
    batch.forEach((p, b) => networkBoxInPlace(p.lo, p.hi, 0, d, options.normalize, nlo, nhi, b * d));
    const ibp = new Float64Array(nb * spec.rows);
    intervalBounds(mnet, nlo, nhi, nb, ibp);
    const open: { piece: Piece; dim: number }[] = [];
    const candidates: number[] = [];
    const screen: number[] = [];
    for (let b = 0; b < nb; b++) {
      const p = batch[b]!;
      if (provingGroup(ibp.subarray(b * spec.rows, (b + 1) * spec.rows), spec, minMargin) >= 0) {
        accept(p);
        continue;
      }
      const blo = nlo.subarray(b * d, b * d + d);
      const bhi = nhi.subarray(b * d, b * d + d);
      // cheaper linear bound first (forward symbolic inner bounds), then back-substituted ones
      let lin = linearBounds(mnet, blo, bhi, { intermediate: 'forward' });
      let g = provingGroup(lin.lower, spec, minMargin);
      if (g < 0 && refine) {
        lin = linearBounds(mnet, blo, bhi, { intermediate: 'backward' });
        g = provingGroup(lin.lower, spec, minMargin);
      }
      if (g >= 0) {
        for (let r = g * spec.rivals.length; r < (g + 1) * spec.rivals.length; r++) slack = Math.max(slack, lin.slack[r]!);
        accept(p);
        continue;
      }
      const r = worstRow(lin.lower, spec);
      const allowance = lin.overflow ? Infinity : lin.slack[r]!;
      screen.push(allowance, allowance);
      for (let i = 0; i < d; i++) candidates.push(0.5 * p.lo[i]! + 0.5 * p.hi[i]!);
      for (let i = 0; i < d; i++) candidates.push(toScenarioUnits(lin.minimiser[r * d + i]!, i, options.normalize, p.lo[i]!, p.hi[i]!));
      open.push({ piece: p, dim: splitDimension(lin, r, p, rootWidth, blo, bhi) });
    }
    const cex = await confirmCandidates(net, Float64Array.from(candidates), candidates.length / d, allowedSet, decision, options.normalize, options.confirm, screen);
    if (cex && options.keepGoing !== true) return result('refuted', cex);
    // (keepGoing) a piece with a confirmed candidate is split like any other: its parts away
    // from the violation may still be proven
    firstCex ??= cex;
    for (const { piece, dim } of open) {
      if (dim < 0) {
        unresolved++;
        continue;
      }
      const mid = piece.lo[dim]! + (piece.hi[dim]! - piece.lo[dim]!) / 2;
      const left = { lo: Float64Array.from(piece.lo), hi: Float64Array.from(piece.hi) };
      const right = { lo: Float64Array.from(piece.lo), hi: Float64Array.from(piece.hi) };
      left.hi[dim] = mid;
      right.lo[dim] = mid;
      queue.push(left, right);
    }
  }
  if (firstCex !== undefined) return result('refuted', firstCex);
  return result(head === queue.length && unresolved === 0 ? 'proven' : 'unknown');
}
