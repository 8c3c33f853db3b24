import type { CheckedRule, Model, Scenario } from '../types.js';
import type { Network } from '../prove/index.js';
import { repairRule } from '../repair/index.js';
import { checkRules } from '../check/index.js';
import { proveRule, type ProveBudget } from './prove-rule.js';

/**
 * Pieces per proof attempt inside a repair: repair tries many slightly different boxes, and a
 * small budget per attempt covered more of the demo's domain per second than the full per-rule
 * budget (measured by bench/repair.ts: 3,000 pieces gave 83 % coverage in 110 CPU-seconds).
 */
export const REPAIR_PIECES_PER_PROOF = 3_000;

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
  const evidence = await proveRule(net, checked, scenario, model, budget);
  const settled: CheckedRule[] = [{ rule: checked.rule, evidence }];
  if (!budget.repair || evidence.status === 'proven') return settled;
  const repaired = await repairRule(net, checked.rule, scenario, {
    confirm: async (points, n) => (await model.evaluate(points, n)).advisory,
    now: budget.now,
    maxSeconds: budget.maxSeconds,
    maxBoxesPerProof: Math.min(budget.maxBoxes, REPAIR_PIECES_PER_PROOF),
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
