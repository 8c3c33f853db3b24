import type { CheckedRule, Evidence, Model, Scenario } from '../types.js';
import { proveBox, type Network, type ProveResult } from '../prove/index.js';
import { counterexampleAt } from './counterexample-at.js';

export interface ProveBudget {
  /** Most pieces bounded per rule. */
  readonly maxBoxes: number;
  /** Most seconds per rule (a safety net: runs that hit it are not reproducible to the piece). */
  readonly maxSeconds: number;
  readonly now: () => number;
}

/**
 * Proves one checked rule by branch and bound and returns its new evidence:
 * `proven` when the prover shows every input of the box gives an allowed advisory; `refuted`
 * when the prover's candidate or the dense check's worst sample is a violation that
 * onnxruntime confirms (the sampled counterexample was found by onnxruntime already);
 * `unknown` otherwise, with the proven share of the box's volume.
 * A counterexample that onnxruntime confirmed always wins over a proof: should the two ever
 * disagree (a defect of the prover), the rule stays `refuted` and the proof is only recorded.
 */
export async function proveRule(net: Network, checked: CheckedRule, scenario: Scenario, model: Model, budget: ProveBudget): Promise<Evidence> {
  return (await proveRuleWithProof(net, checked, scenario, model, budget)).evidence;
}

/** proveRule, also returning proveBox's result (its proven pieces seed a repair). */
export async function proveRuleWithProof(
  net: Network,
  checked: CheckedRule,
  scenario: Scenario,
  model: Model,
  budget: ProveBudget,
): Promise<{ evidence: Evidence; result: ProveResult }> {
  const { rule, evidence } = checked;
  const t0 = budget.now();
  const result = await proveBox(net, rule.box, rule.allowed, scenario.decision, {
    maxBoxes: budget.maxBoxes,
    maxSeconds: budget.maxSeconds,
    now: budget.now,
    confirm: async (points, n) => (await model.evaluate(points, n)).advisory,
    ...(scenario.normalize ? { normalize: scenario.normalize } : {}),
  });
  const seconds = (budget.now() - t0) / 1000;
  const proof = {
    method: result.method,
    pieces: result.pieces,
    provenFraction: result.status === 'proven' ? 1 : result.provenVolumeFraction,
    seconds,
    margin: result.slack,
  };
  if (result.status === 'proven' && !evidence.counterexample) {
    return { evidence: { ...withoutCounterexample(evidence), status: 'proven', proof }, result };
  }
  let counterexample = evidence.counterexample;
  if (!counterexample && result.counterexample) {
    counterexample = await counterexampleAt(result.counterexample.x, rule.allowed, model.evaluate, scenario.decision);
  }
  if (counterexample) return { evidence: { ...evidence, status: 'refuted', counterexample, proof }, result };
  return { evidence: { ...evidence, status: 'unknown', proof }, result };
}

function withoutCounterexample(e: Evidence): Evidence {
  const { counterexample: _dropped, ...rest } = e;
  return rest;
}
