import type { CostJob, CostModel } from './cost-model.js';
import { COST_MODEL } from './cost-coefficients.js';
import { estimateSeconds } from './estimate-seconds.js';

/**
 * Without a time budget from the user, a job estimated to take longer than this gets a
 * warning: an hour is longer than anyone waits at a terminal without having planned to
 * (docs/scaling.md gives the job sizes that cross it).
 */
export const DEFAULT_WARN_SECONDS = 3600;

/** "40 s", "14 min", "2.3 h": one unit, rounded for reading. */
export function formatDuration(seconds: number): string {
  if (seconds < 90) return `${Math.round(seconds)} s`;
  if (seconds < 5400) return `${Math.round(seconds / 60)} min`;
  return `${(seconds / 3600).toFixed(1)} h`;
}

/** Which options shorten each part, for the advice in the warning. */
const ADVICE: Record<CostJob['kind'], string> = {
  mine: '--samples, --max-rules, --check-samples, --prove-boxes or --prove-seconds (or --no-prove)',
  check: '--check-samples, --prove-boxes or --prove-seconds (or --no-prove)',
  prove: '--prove-boxes or --prove-seconds, or more --jobs on a machine with more cores',
};

/**
 * The warning to print before a job whose estimated time exceeds the user's budget, or
 * DEFAULT_WARN_SECONDS when no budget is given; undefined when the estimate is within it.
 * The text names the estimate, its largest parts, the budget, and the options that shorten
 * the job; the job is not stopped (the estimate is a fitted model, not a promise).
 *
 * @param job the job's size and budgets (see estimateSeconds)
 * @param budgetSeconds the user's time budget in seconds (e.g. --time-budget), if any
 * @param model fitted coefficients; default the committed ones
 */
export function costWarning(job: CostJob, budgetSeconds?: number, model: CostModel = COST_MODEL): string | undefined {
  const e = estimateSeconds(job, model);
  const limit = budgetSeconds ?? DEFAULT_WARN_SECONDS;
  if (!(e.seconds > limit)) return undefined;
  const parts = [`sampling and checking ${formatDuration(e.samplingSeconds)}`];
  if (e.provingSeconds > 0) parts.push(`proving ${formatDuration(e.provingSeconds)} on ${job.jobs} worker thread${job.jobs === 1 ? '' : 's'}`);
  const against = budgetSeconds === undefined ? `longer than ${formatDuration(limit)}` : `over the time budget of ${formatDuration(limit)}`;
  return (
    `warning: this ${job.kind} job is estimated to take about ${formatDuration(e.seconds)} (${parts.join(', ')}), ${against}; ` +
    `it runs anyway. Smaller ${ADVICE[job.kind]} shorten it (estimate from docs/scaling.md)`
  );
}
