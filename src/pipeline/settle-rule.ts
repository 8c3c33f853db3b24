import type { CheckedRule, Model, Scenario } from '../types.js';
import type { Network } from '../prove/index.js';
import { repairRule } from '../repair/index.js';
import { checkRules } from '../check/index.js';
import { proveRuleWithProof, type ProveBudget } from './prove-rule.js';

/**
 * Pieces per proof attempt inside a repair: repair tries many slightly different boxes, and a
 * small budget per attempt covered more of the demo's domain per second than the full per-rule
 * budget (measured by bench/repair.ts: 3,000 pieces gave 83 % coverage in 110 CPU-seconds).
 */
export const REPAIR_PIECES_PER_PROOF = 3_000;

/**
 * The repair budget of a table, in pieces, shared by rule volume: a rule covering a share v of
 * the domain may bound REPAIR_PIECES_FLOOR + v · REPAIR_PIECES_PER_DOMAIN pieces in all its
 * repair's proofs. A piece budget, unlike a clock, gives the same sub-rules on any machine and
 * with any number of workers. Large rules stop well before their budget (nothing left worth
 * repairing); the floor is what a small rule riddled with violations needs for a few sub-rules.
 * About 106 CPU-seconds for the demo's whole table (bench/repair.ts); choices of this project,
 * measured against a clock budget shared largest rule first (docs/repair.md).
 */
export const REPAIR_PIECES_PER_DOMAIN = 400_000;
export const REPAIR_PIECES_FLOOR = 10_000;
/**
 * Regions a repair may take from its work list: REPAIR_STEPS_FLOOR + v · REPAIR_STEPS_PER_DOMAIN.
 * Screening, planning and searching cost time without bounding pieces; on small rules riddled
 * with violations they would otherwise run on with few proofs. The floor of 80 lets two of the
 * demo's six smallest, most violated rules find a proven sub-rule that 40 steps did not
 * (docs/repair.md).
 */
export const REPAIR_STEPS_PER_DOMAIN = 2_000;
export const REPAIR_STEPS_FLOOR = 80;
/**
 * Sub-rules per rule: ⌈v · REPAIR_SUB_RULES_PER_DOMAIN⌉, at least REPAIR_SUB_RULES_FLOOR: the
 * slabs of large rules are worth sub-rules of their own, a tiny rule's are not (on the demo, a
 * floor of 16 and 100 per domain gave 273 sub-rules and 86.66 %, this 231 and 86.31 %, in a
 * sixth less time).
 */
export const REPAIR_SUB_RULES_PER_DOMAIN = 1_200;
export const REPAIR_SUB_RULES_FLOOR = 12;
/**
 * Pieces the fill's mapping proofs may bound (`fillPieces` of repairRule): v · this, within the
 * rule's piece budget. The fill cuts readable boxes from the pieces proven after peeling
 * (src/repair/fill-from-pieces.ts); mapping the unproven rest first lets it reach closer to the
 * boundaries of large rules (docs/repair.md).
 */
export const REPAIR_FILL_PIECES_PER_DOMAIN = 200_000;
/**
 * Regions dropped by a repair: under 1 % of the rule's box, or under 0.05 % of the domain when
 * that is smaller (a slab of a large rule is worth repairing even if a small share of it).
 */
export const REPAIR_MIN_RULE_SHARE = 0.01;
export const REPAIR_MIN_DOMAIN_SHARE = 0.0005;

/** Repair options of a rule covering the share `volume` of the domain (see the constants above). */
export function repairBudgetOf(volume: number): { maxPieces: number; maxSteps: number; maxSubRules: number; minVolumeShare: number; fillPieces: number } {
  const v = Math.max(0, Math.min(1, volume));
  return {
    maxPieces: Math.round(REPAIR_PIECES_FLOOR + v * REPAIR_PIECES_PER_DOMAIN),
    maxSteps: Math.round(REPAIR_STEPS_FLOOR + v * REPAIR_STEPS_PER_DOMAIN),
    maxSubRules: Math.max(REPAIR_SUB_RULES_FLOOR, Math.ceil(v * REPAIR_SUB_RULES_PER_DOMAIN)),
    minVolumeShare: v > 0 ? Math.min(REPAIR_MIN_RULE_SHARE, REPAIR_MIN_DOMAIN_SHARE / v) : REPAIR_MIN_RULE_SHARE,
    fillPieces: Math.round(v * REPAIR_FILL_PIECES_PER_DOMAIN),
  };
}

/**
 * The repair's clock limit, in multiples of the per-rule proof seconds: only a safety net, as the
 * piece and step budgets bound the repair; wide, so that a loaded machine does not hit it (a run
 * that hits it is not reproducible to the sub-rule).
 */
export const REPAIR_SECONDS_FACTOR = 6;

/** Dense-check settings for the sub-rules a repair produces. */
export interface SubRuleCheck {
  readonly seed: number;
  readonly samplesPerRule: number;
  readonly confidence: number;
}

/**
 * Settles one rule: proves it, and splits a refuted or unknown rule into the fewest readable
 * sub-rules that are each proven (src/repair). Returns the rule with its new evidence first,
 * then its sub-rules, each checked on dense samples and carrying its own proof. The same
 * function runs in the main thread and in proof workers.
 */
export async function settleRule(
  net: Network,
  checked: CheckedRule,
  scenario: Scenario,
  model: Model,
  budget: ProveBudget & { readonly repair: boolean; readonly check: SubRuleCheck },
): Promise<CheckedRule[]> {
  const { evidence, result } = await proveRuleWithProof(net, checked, scenario, model, budget);
  const settled: CheckedRule[] = [{ rule: checked.rule, evidence }];
  if (!budget.repair || evidence.status === 'proven') return settled;
  const repaired = await repairRule(net, checked.rule, scenario, {
    confirm: async (points, n) => (await model.evaluate(points, n)).advisory,
    now: budget.now,
    maxSeconds: budget.maxSeconds * REPAIR_SECONDS_FACTOR,
    maxBoxesPerProof: Math.min(budget.maxBoxes, REPAIR_PIECES_PER_PROOF),
    ...repairBudgetOf(checked.evidence.volumeFraction),
    // the rule's own proof bounded these pieces already: the repair's proofs reuse them
    known: result.provenBoxes,
  });
  if (repaired.subRules.length === 0) return settled;
  const subChecked = await checkRules(repaired.subRules, scenario.inputs, model.evaluate, {
    seed: budget.check.seed,
    samplesPerRule: budget.check.samplesPerRule,
    confidence: budget.check.confidence,
    decision: scenario.decision,
  });
  repaired.subRules.forEach((sub, k) => {
    const proof = repaired.proofs[k]!;
    const sampled = subChecked[k]!.evidence;
    // Proven by proveBox on exactly this box; a violation seen by onnxruntime would contradict
    // the proof, so the sampled evidence decides then (a defect to report, never hidden).
    const status = sampled.violations > 0 ? 'refuted' : 'proven';
    settled.push({
      rule: sub,
      evidence: {
        ...sampled,
        status,
        proof: { method: proof.method, pieces: proof.pieces, provenFraction: 1, seconds: 0, margin: proof.slack },
      },
    });
  });
  return settled;
}
