import type { CheckedRule, Scenario } from '../types.js';
import type { SubRuleCheck } from './settle-rule.js';

/** What a proof worker is started with. */
export interface WorkerInit {
  readonly scenario: Scenario;
  readonly modelPath: string;
  /** The SHA-256 the main thread loaded; the worker refuses a file that differs. */
  readonly modelSha256: string;
  readonly maxBoxes: number;
  readonly maxSeconds: number;
  readonly repair: boolean;
  readonly check: SubRuleCheck;
}

/** One task of a proof worker: a checked rule to settle (its result: the rule and any sub-rules). */
export interface ProveTask {
  readonly checked: CheckedRule;
}
