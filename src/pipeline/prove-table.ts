import type { CheckedRule, Model, Scenario } from '../types.js';
import type { ReadNetworkResult } from '../prove/index.js';
import type { ProveBudget } from './prove-rule.js';
import { settleRule, type SubRuleCheck } from './settle-rule.js';
import { proveInWorkers } from './prove-pool.js';

export interface ProveTableHooks {
  readonly onProgress?: (stage: string, done: number, total: number) => void;
}

export interface ProveTableResult {
  readonly rules: CheckedRule[];
  /** Why nothing was proved, when the graph has an operator the prover does not support. */
  readonly unsupported?: string;
}

/**
 * Proves every rule of a checked table, on `jobs` worker threads (in this thread when jobs is
 * 1). A graph the prover cannot read leaves every rule at its sampled status, with the operator
 * and node that stopped it. Each rule is followed by any sub-rules its settling produced.
 */
export async function proveTable(
  rules: readonly CheckedRule[],
  network: ReadNetworkResult,
  scenario: Scenario,
  model: Model,
  budget: ProveBudget & { readonly jobs: number; readonly repair: boolean; readonly check: SubRuleCheck },
  hooks: ProveTableHooks = {},
): Promise<ProveTableResult> {
  if (!network.supported) {
    return {
      rules: [...rules],
      unsupported: `operator ${network.operator} (node "${network.node}") is not supported by the prover: ${network.reason}; rules keep their sampled status`,
    };
  }
  const progress = (done: number): void => hooks.onProgress?.('proving', done, rules.length);
  let settled: CheckedRule[][];
  if (budget.jobs <= 1 || rules.length <= 1) {
    settled = [];
    for (const checked of rules) {
      settled.push(await settleRule(network.network, checked, scenario, model, budget));
      progress(settled.length);
    }
  } else {
    settled = await proveInWorkers(
      rules,
      scenario,
      { modelPath: model.path, modelSha256: model.sha256, maxBoxes: budget.maxBoxes, maxSeconds: budget.maxSeconds, repair: budget.repair, check: budget.check },
      budget.jobs,
      progress,
    );
  }
  return { rules: settled.flat() };
}
