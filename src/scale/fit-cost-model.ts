import { ToolError } from '../errors.js';
import type { CostJob, CostModel, MeasuredPoint } from './cost-model.js';
import { nonnegativeLeastSquares } from './nonnegative-least-squares.js';

/** Network evaluations of a mine or check job (the N of estimateSeconds). */
function evaluations(j: CostJob): number {
  return j.kind === 'prove' ? 0 : j.samples + j.rules * j.checkSamples + j.fidelitySamples;
}

/**
 * Relative non-negative least squares: each row and its target are divided by the measured
 * value, so a 2 s job and a 200 s job count alike (the fit minimises squared relative errors).
 */
function relativeFit(rows: readonly number[][], targets: readonly number[]): Float64Array {
  const k = rows[0]!.length;
  const cols = Array.from({ length: k }, (_, j) => Float64Array.from(rows, (r, i) => r[j]! / targets[i]!));
  return nonnegativeLeastSquares(cols, Float64Array.from(targets, () => 1)).x;
}

/**
 * Ordinary least squares of y on x: y ≈ a + b·x (Gauss–Legendre normal equations for one
 * regressor). Returns b = 0 when x does not vary.
 */
function line(xs: readonly number[], ys: readonly number[]): { a: number; b: number } {
  const n = xs.length;
  const mx = xs.reduce((s, v) => s + v, 0) / n;
  const my = ys.reduce((s, v) => s + v, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (xs[i]! - mx) * (ys[i]! - my);
    sxx += (xs[i]! - mx) ** 2;
  }
  const b = sxx > 0 ? sxy / sxx : 0;
  return { a: my - b * mx, b };
}

/**
 * The job as it ran: a mine job's table has rulesOut rules (at most the --max-rules asked), and
 * its checking cost follows those.
 */
export function measuredJob(p: MeasuredPoint): CostJob {
  return p.job.kind === 'mine' ? { ...p.job, rules: p.rulesOut } : p.job;
}

/** Whether some rule of the job's table was proven or left unknown (not every rule refuted). */
export function holds(p: MeasuredPoint): boolean {
  return (p.statuses['proven'] ?? 0) + (p.statuses['unknown'] ?? 0) > 0;
}

function need(what: string, count: number, min: number): void {
  if (count < min) throw new ToolError('COST_FIT_DATA', `fitCostModel: ${count} ${what}, expected at least ${min}`);
}

/**
 * Fits the cost model of estimateSeconds to measured jobs, in four steps:
 *  1. mine and check jobs without proofs: wall = start + N·(perSample + perSampleWeight·W)
 *     + perSampleInput·samples·d (relative non-negative least squares);
 *  2. prove jobs: wall = proveStart + R·(perRule + perRuleWeight·W) + P·(perPiece +
 *     perPieceWeightLayer·W·L) with P the pieces measured over all rules;
 *  3. pieces of a hard rule: ln(maxPieces) = hardLog + hardGrowth·d, least squares over the
 *     prove jobs of the sweep over inputs (the rule with the most pieces that was not refuted),
 *     leaving out tables where a rule hit its budget (unknown), whose count is only a lower bound;
 *  4. pieces per rule: P/R = easyPieces + hardShare·min(proveBoxes, hard pieces) over the prove
 *     jobs with a rule that holds (proven or unknown).
 * Non-negative coefficients keep the estimate monotone in every size.
 *
 * @param points measured jobs (docs/scaling/scaling-data.json); not changed
 * @param source where the points come from, stored in the model
 * @throws ToolError (COST_FIT_DATA) when a step has too few points
 */
export function fitCostModel(points: readonly MeasuredPoint[], source: string): CostModel {
  const plain = points.filter((p) => p.job.kind !== 'prove' && !p.job.prove);
  need('mine/check jobs without proofs', plain.length, 4);
  const [start, perSample, perSampleWeight, perSampleInput] = relativeFit(
    plain.map(measuredJob).map((j) => [1, evaluations(j), evaluations(j) * j.weights, j.samples * j.inputs]),
    plain.map((p) => p.cpuSeconds),
  );
  const proofs = points.filter((p) => p.job.kind === 'prove' && p.pieces !== undefined && p.rulesOut > 0);
  need('prove jobs with pieces', proofs.length, 5);
  const [proveStart, perRule, perRuleWeight, perPiece, perPieceWeightLayer] = relativeFit(
    proofs.map(({ job: j, pieces, rulesOut }) => [1, rulesOut, rulesOut * j.weights, pieces!, pieces! * j.weights * j.layers]),
    proofs.map((p) => p.cpuSeconds),
  );
  // a table with an unknown rule hit its proof budget: its most pieces is a lower bound, left out
  const hardPoints = proofs.filter((p) => p.sweep === 'inputs' && (p.maxPieces ?? 0) > 0 && !((p.statuses['unknown'] ?? 0) > 0));
  need('prove jobs of the inputs sweep with a rule not refuted', hardPoints.length, 2);
  const { a: hardLog, b: hardGrowth } = line(hardPoints.map((p) => p.job.inputs), hardPoints.map((p) => Math.log(p.maxPieces!)));
  const hard = (j: CostJob): number => Math.min(j.proveBoxes, Math.exp(hardLog + Math.max(0, hardGrowth) * j.inputs));
  // Tables whose every rule was refuted at once say nothing about proofs that have to finish;
  // fitting the pieces per rule to tables with rules that hold keeps the estimate on the side
  // of a network worth proving (it overestimates tables refuted at once: docs/scaling.md).
  const holding = proofs.filter(holds);
  need('prove jobs with a rule proven or unknown', holding.length, 2);
  const [easyPieces, hardShare] = relativeFit(
    holding.map(({ job: j }) => [1, hard(j)]),
    holding.map((p) => p.pieces! / p.rulesOut),
  );
  return {
    source,
    start: start!, perSample: perSample!, perSampleWeight: perSampleWeight!, perSampleInput: perSampleInput!,
    proveStart: proveStart!, perRule: perRule!, perRuleWeight: perRuleWeight!, perPiece: perPiece!, perPieceWeightLayer: perPieceWeightLayer!,
    hardLog, hardGrowth: Math.max(0, hardGrowth), easyPieces: easyPieces!, hardShare: hardShare!,
  };
}
