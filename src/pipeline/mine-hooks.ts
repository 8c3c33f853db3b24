/** Progress callbacks and the clock, passed by the CLI into the pipeline. */
export interface MineHooks {
  readonly onStage?: (stage: string) => void;
  readonly onProgress?: (stage: string, done: number, total: number) => void;
  /** Clock in milliseconds for proof budgets; default performance.now. */
  readonly now?: () => number;
}
