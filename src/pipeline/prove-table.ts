import type { CheckedRule, Model, Scenario } from '../types.js';
import type { ReadNetworkResult } from '../prove/index.js';
import { proveRule, type ProveBudget } from './prove-rule.js';

export interface ProveTableHooks {
  readonly onProgress?: (stage: string, done: number, total: number) => void;
}

export interface ProveTableResult {
  readonly rules: CheckedRule[];
  /** Why nothing was proved, when the graph has an operator the prover does not support. */
  readonly unsupported?: string;
}

/**
 * Proves every rule of a checked table. A graph the prover cannot read leaves every rule at
 * its sampled status, with the operator and node that stopped it.
 */
export async function proveTable(
  rules: readonly CheckedRule[],
  network: ReadNetworkResult,
  scenario: Scenario,
  model: Model,
  budget: ProveBudget,
  hooks: ProveTableHooks = {},
): Promise<ProveTableResult> {
  if (!network.supported) {
    return {
      rules: [...rules],
      unsupported: `operator ${network.operator} (node "${network.node}") is not supported by the prover: ${network.reason}; rules keep their sampled status`,
    };
  }
  const out: CheckedRule[] = [];
  for (let i = 0; i < rules.length; i++) {
    const checked = rules[i]!;
    out.push({ rule: checked.rule, evidence: await proveRule(network.network, checked, scenario, model, budget) });
    hooks.onProgress?.('proving', i + 1, rules.length);
  }
  return { rules: out };
}
