import { ToolError } from '../errors.js';
import type { Decision, InputSpec, Normalization, Rule } from '../types.js';
import type { Box, ConfirmFn, Network, ProveResult } from '../prove/index.js';
import { READABLE_STEP_MIN_FRACTION, readableSteps, sortRules } from '../rules/index.js';
import { createRng } from '../sampling/index.js';
import { boxShare } from './box-share.js';
import { PointKind, appendPointsInPlace, emptyGuidePoints, pointInBox } from './guide-points.js';
import { FILL_SHARE_DIVISOR, fillFromPieces } from './fill-from-pieces.js';
import { mergeProven } from './merge-proven.js';
import { peelAndProve } from './peel-and-prove.js';
import type { RepairContext, RepairEvent } from './repair-context.js';
import { checkRepairInput } from './check-repair-input.js';

/** Defaults of the repair options; choices of this project, measured on the demo (docs/repair.md). */
export const REPAIR_DEFAULTS = {
  maxSubRules: 8,
  minVolumeShare: 0.02,
  /** Uniform points drawn per region before planning (as many again on its surface). */
  screenPoints: 1024,
  /** Least gap between a point cut off and the new face, as a share of the rule box's width. */
  clearanceShare: 0.005,
  /** Greatest gap, as a share of the rule box's width: the room a rounder cut value may take. */
  allowanceShare: 0.03,
  seed: 1,
  fillPieces: 0,
} as const;

/** Labelled samples (e.g. the checker's) that show where a rule's box is violated. */
export interface RepairSamples {
  /** n × d, row-major, float64, scenario units. */
  readonly x: Float64Array;
  readonly n: number;
  readonly d: number;
  /** The network's advisory per sample. */
  readonly advisory: Int32Array;
}

export interface RepairScenario {
  readonly inputs: readonly InputSpec[];
  readonly advisories: readonly string[];
  readonly decision: Decision;
  readonly normalize?: Normalization;
}

export interface RepairOptions {
  /** The runtime's advisory for points in scenario units (labels samples; confirms refutations). */
  readonly confirm: ConfirmFn;
  /** Clock in milliseconds (e.g. performance.now); the only clock read. */
  readonly now: () => number;
  /** Time budget of the whole repair; no proof starts after it. */
  readonly maxSeconds: number;
  /** Piece budget of each proveBox call. */
  readonly maxBoxesPerProof: number;
  /**
   * Pieces all proofs of the repair may bound together (default: no limit but the clock). A
   * piece budget makes the result independent of the machine's speed and load.
   */
  readonly maxPieces?: number;
  /**
   * Pieces already proven for this rule's allowed set by proveBox (e.g. `provenBoxes` of the
   * rule's own proof): the repair's proofs accept what lies inside them without bounding it.
   */
  readonly known?: readonly Box[];
  readonly maxSubRules?: number;
  /** Share of the rule's box below which a region is dropped rather than repaired. */
  readonly minVolumeShare?: number;
  /** Labelled samples; those inside the rule's box guide the first cuts. */
  readonly samples?: RepairSamples;
  readonly screenPoints?: number;
  readonly clearanceShare?: number;
  readonly allowanceShare?: number;
  /**
   * Regions the repair may take from its work list (screen, plan, search, prove) in all; with
   * `maxPieces` it bounds the repair's work without a clock (default: no limit).
   */
  readonly maxSteps?: number;
  /**
   * Pieces the proofs that map the uncovered rest of the box may bound after peeling
   * (`fillFromPieces`; default REPAIR_DEFAULTS.fillPieces, within `maxPieces`). With 0 the fill
   * only cuts boxes from the pieces the peeling's proofs proved.
   */
  readonly fillPieces?: number;
  /** Seed of the screening points (runs are reproducible given the same proof outcomes). */
  readonly seed?: number;
  /** Called at each step (plan, search, proof, drop); must not throw. */
  readonly onEvent?: (event: RepairEvent) => void;
}

export interface RepairResult {
  /** Proven sub-rules: disjoint boxes inside the rule's box, same allowed set, sortRules order. */
  readonly subRules: Rule[];
  /** Share of the rule's box covered by the sub-rules (over inputs where it has width). */
  readonly provenVolumeFraction: number;
  /** Pieces bounded by all proofs, failed ones included. */
  readonly pieces: number;
  readonly seconds: number;
  /** proofs[k] is the proveBox result that proved subRules[k] on exactly its box. */
  readonly proofs: ProveResult[];
  /** proveBox calls made, failed ones included. */
  readonly attempts: number;
  /** Regions taken from the work list (see `maxSteps`). */
  readonly steps: number;
}

/**
 * Repairs a refuted rule: finds few readable sub-boxes of its box, each proven by proveBox on
 * exactly that box for the same allowed advisories, covering as much of the box as the budget
 * allows (`peelAndProve`, `mergeProven`, `fillFromPieces`, then `mergeProven` again). Sub-rules
 * get ids `<parent>.1`, `<parent>.2`, … in sortRules order and origin
 * `{ kind: 'repaired', from: parent.id }`. Sound by construction:
 * nothing is returned that proveBox did not prove; samples only choose the cuts.
 *
 * @param net the network as read from the ONNX file (readOnnxNetwork)
 * @param rule the rule to repair (not changed)
 * @throws ToolError `REPAIR_RULE` when the rule does not fit the scenario or network,
 *   `REPAIR_OPTION` for a budget or share out of range
 */
export async function repairRule(net: Network, rule: Rule, scenario: RepairScenario, options: RepairOptions): Promise<RepairResult> {
  checkRepairInput(net, rule, scenario, options);
  const start = options.now();
  const d = rule.box.length;
  const clearanceShare = options.clearanceShare ?? REPAIR_DEFAULTS.clearanceShare;
  const allowanceShare = options.allowanceShare ?? REPAIR_DEFAULTS.allowanceShare;
  const limits = rule.box.map(([lo, hi], i) => {
    const range = scenario.inputs[i]!.max - scenario.inputs[i]!.min;
    const width = hi > lo ? hi - lo : range;
    const finest = range * READABLE_STEP_MIN_FRACTION;
    const steps = readableSteps(Math.max(range, hi - lo), finest);
    return { clearance: clearanceShare * width, allowance: allowanceShare * width, finest, steps };
  });
  const ctx: RepairContext = {
    net,
    ruleBox: rule.box,
    allowed: rule.allowed,
    allowedSet: new Set(rule.allowed),
    decision: scenario.decision,
    ...(scenario.normalize !== undefined ? { normalize: scenario.normalize } : {}),
    confirm: options.confirm,
    now: options.now,
    deadline: start + options.maxSeconds * 1000,
    maxBoxesPerProof: options.maxBoxesPerProof,
    maxPieces: options.maxPieces ?? Infinity,
    maxSteps: options.maxSteps ?? Infinity,
    steps: 0,
    known: [...(options.known ?? [])],
    limits,
    rng: createRng(options.seed ?? REPAIR_DEFAULTS.seed),
    points: emptyGuidePoints(d),
    ...(options.onEvent !== undefined ? { onEvent: options.onEvent } : {}),
    pieces: 0,
    attempts: 0,
  };
  const given = options.samples;
  if (given !== undefined) {
    for (let r = 0; r < given.n; r++) {
      if (!pointInBox(given.x, r, d, rule.box)) continue;
      const kind = ctx.allowedSet.has(given.advisory[r]!) ? PointKind.other : PointKind.violation;
      appendPointsInPlace(ctx.points, given.x.subarray(r * d, r * d + d), [kind], 1);
    }
  }
  const peel = {
    screenPoints: options.screenPoints ?? REPAIR_DEFAULTS.screenPoints,
    maxSubRules: options.maxSubRules ?? REPAIR_DEFAULTS.maxSubRules,
    minVolumeShare: options.minVolumeShare ?? REPAIR_DEFAULTS.minVolumeShare,
  };
  const merged = await mergeProven(ctx, await peelAndProve(ctx, peel));
  const fillPieces = options.fillPieces ?? REPAIR_DEFAULTS.fillPieces;
  const filled = await fillFromPieces(ctx, merged, { maxSubRules: peel.maxSubRules, minVolumeShare: peel.minVolumeShare / FILL_SHARE_DIVISOR, mapPieces: fillPieces });
  // boxes the fill grew side by side may now form a box together: fewer sub-rules, same cover
  const parts = (await mergeProven(ctx, filled)).map((p) => ({ ...p, allowed: rule.allowed }));
  const origin = { kind: 'repaired', from: rule.id } as const;
  const partOf = new Map(parts.map((p) => [p.box, p]));
  const ordered = sortRules(parts.map((p) => ({ id: '', box: p.box, allowed: p.allowed, origin })));
  const proofs = ordered.map((r) => partOf.get(r.box)!.proof);
  // soundness guard: every sub-rule carries the proof of exactly its own box and allowed set
  if (ordered.some((r, k) => partOf.get(r.box)?.allowed !== r.allowed || proofs[k]?.status !== 'proven')) {
    throw new ToolError('REPAIR_INTERNAL', `repair of ${rule.id}: a sub-rule lacks its proof`);
  }
  let provenVolumeFraction = 0;
  for (const p of parts) provenVolumeFraction += boxShare(p.box, rule.box);
  return {
    subRules: ordered.map((r, k) => ({ ...r, id: `${rule.id}.${k + 1}` })),
    provenVolumeFraction: Math.min(1, provenVolumeFraction),
    pieces: ctx.pieces,
    seconds: (options.now() - start) / 1000,
    proofs,
    attempts: ctx.attempts,
    steps: ctx.steps,
  };
}
