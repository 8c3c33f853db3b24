import type { CheckedRule, Model, Scenario } from '../types.js';
import type { Network } from '../prove/index.js';
import { proveRule, type ProveBudget } from './prove-rule.js';

/**
 * Settles one rule: proves it, and (once repair is wired in) splits a refuted or unknown rule
 * into proven readable sub-rules. Returns the rule with its new evidence first, then any
 * sub-rules. The same function runs in the main thread and in proof workers.
 */
export async function settleRule(net: Network, checked: CheckedRule, scenario: Scenario, model: Model, budget: ProveBudget): Promise<CheckedRule[]> {
  const evidence = await proveRule(net, checked, scenario, model, budget);
  return [{ rule: checked.rule, evidence }];
}
