/**
 * Run-time cost model of mine, check and prove jobs, fitted to the scaling study
 * (bench/scaling.ts, docs/scaling.md), and the warning printed before a job that would run
 * past the user's time budget.
 */
export type { CostJob, CostJobKind, CostEstimate, CostModel, MeasuredPoint } from './cost-model.js';
export { estimateSeconds } from './estimate-seconds.js';
export { costWarning, formatDuration, DEFAULT_WARN_SECONDS } from './cost-warning.js';
export { fitCostModel, holds, measuredJob } from './fit-cost-model.js';
export { nonnegativeLeastSquares } from './nonnegative-least-squares.js';
export { COST_MODEL } from './cost-coefficients.js';
export { networkSize } from './network-size.js';
export { networkSizeOfModel } from './network-size-of-model.js';
