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

/** Messages from a worker: ready for work, a settled rule (with any sub-rules), or a failure. */
export type WorkerReply =
  | { readonly kind: 'ready' }
  | { readonly kind: 'result'; readonly i: number; readonly rules: CheckedRule[] }
  | { readonly kind: 'error'; readonly tool: boolean; readonly code: string; readonly message: string };
