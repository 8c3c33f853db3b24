import { ToolError } from '../errors.js';
import type { CostEstimate, CostJob, CostModel } from './cost-model.js';
import { COST_MODEL } from './cost-coefficients.js';

function invalid(field: string, v: number, expected: string): ToolError {
  return new ToolError('COST_JOB_INVALID', `estimateSeconds: ${field} ${v}, expected ${expected}`);
}

function validate(job: CostJob): void {
  const counts: [string, number][] = [
    ['inputs', job.inputs], ['weights', job.weights], ['layers', job.layers], ['samples', job.samples],
    ['fidelitySamples', job.fidelitySamples], ['checkSamples', job.checkSamples], ['rules', job.rules], ['proveBoxes', job.proveBoxes],
  ];
  for (const [name, v] of counts) if (!(Number.isFinite(v) && v >= 0)) throw invalid(name, v, 'a number >= 0');
  if (!(job.proveSeconds >= 0)) throw invalid('proveSeconds', job.proveSeconds, 'a number >= 0');
  if (!(job.jobs >= 1)) throw invalid('jobs', job.jobs, 'a number >= 1');
}

/** Seconds one piece of branch and bound costs on this network. */
function pieceSeconds(job: CostJob, m: CostModel): number {
  return m.perPiece + m.perPieceWeightLayer * job.weights * job.layers;
}

/**
 * Seconds one rule's proof takes when it bounds `pieces` pieces, stopped by the seconds budget
 * (checked between pieces, so one piece may run past it).
 */
function ruleSeconds(job: CostJob, m: CostModel, pieces: number): number {
  const setup = m.perRule + m.perRuleWeight * job.weights;
  const piece = pieceSeconds(job, m);
  return setup + Math.min(pieces * piece, job.proveSeconds + piece);
}

/**
 * Estimates the wall seconds of a mine, check or prove job from its size, before it starts.
 * The model is linear in the work each stage does, with coefficients fitted to the scaling
 * study (docs/scaling.md), except proofs, whose pieces for a hard rule grow exponentially with
 * the inputs:
 *
 *   evaluations N = samples + rules·checkSamples + fidelitySamples (check: rules·checkSamples)
 *   sampling  = N·(perSample + perSampleWeight·W) + perSampleInput·samples·d
 *   pieces    = easyPieces + hardShare·min(proveBoxes, exp(hardLog + hardGrowth·d))
 *   proving   = rules/jobs · (perRule + perRuleWeight·W + min(pieces·q, proveSeconds + q)),
 *               q = perPiece + perPieceWeightLayer·W·L
 *
 * with W weights, L layers and d inputs. Every coefficient is ≥ 0, so the estimate rises (or
 * stays) when any size grows and falls (or stays) when jobs grow. Proving is assumed to
 * parallelise perfectly over jobs (measured with one job only).
 *
 * @param job the job's size and budgets
 * @param model fitted coefficients; default the committed ones (cost-coefficients.ts)
 * @returns estimated seconds, by part, and the worst case of proving (every rule spends its budget)
 * @throws ToolError (COST_JOB_INVALID) on a negative or non-finite size, or jobs < 1
 */
export function estimateSeconds(job: CostJob, model: CostModel = COST_MODEL): CostEstimate {
  validate(job);
  const m = model;
  const w = job.weights;
  const evaluations = job.kind === 'prove' ? 0 : job.samples + job.rules * job.checkSamples + job.fidelitySamples;
  const samplingSeconds = evaluations * (m.perSample + m.perSampleWeight * w) + m.perSampleInput * job.samples * job.inputs;
  const startSeconds = job.kind === 'prove' ? m.proveStart : m.start;
  let provingSeconds = 0;
  let worstProving = 0;
  if (job.kind === 'prove' || job.prove) {
    const hard = Math.min(job.proveBoxes, Math.exp(m.hardLog + m.hardGrowth * job.inputs));
    const pieces = Math.min(job.proveBoxes, m.easyPieces + m.hardShare * hard);
    provingSeconds = (job.rules / job.jobs) * ruleSeconds(job, m, pieces);
    worstProving = (job.rules / job.jobs) * ruleSeconds(job, m, job.proveBoxes);
  }
  const seconds = startSeconds + samplingSeconds + provingSeconds;
  return { seconds, startSeconds, samplingSeconds, provingSeconds, worstSeconds: startSeconds + samplingSeconds + worstProving };
}
