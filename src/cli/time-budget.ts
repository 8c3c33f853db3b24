import { availableParallelism } from 'node:os';
import type { Model, Scenario } from '../types.js';
import { costWarning, networkSizeOfModel, type CostJob } from '../scale/index.js';
import type { CliIo } from './io.js';
import { positiveNumber } from './option-checks.js';

/** The `--time-budget` option of mine, check and prove (docs/scaling.md). */
export const TIME_BUDGET_OPTION = {
  type: 'number',
  describe: 'seconds you mean to wait: warn on stderr before starting when the estimate is longer (default: warn past 1 hour)',
} as const;

/** The checked `--time-budget` value, or undefined when it was not given. */
export function timeBudgetOf(value: number | undefined): number | undefined {
  return value === undefined ? undefined : positiveNumber('time-budget', value);
}

/**
 * What a command knows of its job when it is about to start: the cost model's job, with the
 * scenario and the model in place of the sizes read from them.
 */
export type JobAtStart = Omit<CostJob, 'inputs' | 'weights' | 'layers'> & { readonly scenario: Scenario; readonly model: Model };

/**
 * Prints the scaling warning (src/scale, fitted to the curves of docs/scaling.md) on stderr
 * before work starts when the estimated time exceeds the budget, or an hour without one. It is
 * printed even with --quiet: it is a warning, not progress.
 */
export function warnIfLong(io: CliIo, job: JobAtStart, budgetSeconds: number | undefined): void {
  const warning = costWarning(
    {
      kind: job.kind,
      inputs: job.scenario.inputs.length,
      ...networkSizeOfModel(job.model),
      samples: job.samples,
      fidelitySamples: job.fidelitySamples,
      checkSamples: job.checkSamples,
      rules: job.rules,
      prove: job.prove,
      proveBoxes: job.proveBoxes,
      proveSeconds: job.proveSeconds,
      jobs: Math.min(job.jobs, availableParallelism()),
    },
    budgetSeconds,
  );
  if (warning) io.stderr(`specula: ${warning}\n`);
}
