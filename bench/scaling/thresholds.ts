/**
 * Warning thresholds derived from the fitted cost model: how large a job with the CLI's
 * default budgets must grow before its estimate passes the default warning time.
 */
import { MINE_DEFAULTS } from '../../src/cli/commands/mine.js';
import { type CostJob, type CostModel, DEFAULT_WARN_SECONDS, estimateSeconds, formatDuration } from '../../src/scale/index.js';

/** Weights and layers of a d-input MLP with `depth` hidden layers of `width` and 5 outputs. */
function mlp(d: number, width: number, depth: number): { weights: number; layers: number } {
  const sizes = [d, ...new Array<number>(depth).fill(width), 5];
  let weights = 0;
  for (let l = 0; l + 1 < sizes.length; l++) weights += sizes[l]! * sizes[l + 1]! + sizes[l + 1]!;
  return { weights, layers: sizes.length - 1 };
}

/** A mine job with the CLI's defaults on a d-input network of the given shape, proving on `jobs` threads. */
export function defaultMineJob(d: number, width: number, depth: number, jobs: number): CostJob {
  return {
    kind: 'mine', inputs: d, ...mlp(d, width, depth),
    samples: MINE_DEFAULTS.samples, fidelitySamples: MINE_DEFAULTS.fidelitySamples, checkSamples: MINE_DEFAULTS.checkSamples,
    rules: MINE_DEFAULTS.maxRules, prove: true, proveBoxes: MINE_DEFAULTS.proveBoxes, proveSeconds: MINE_DEFAULTS.proveSeconds, jobs,
  };
}

/** Markdown lines: estimates of default jobs, and the sizes at which they pass the warning time. */
export function thresholdLines(model: CostModel): string[] {
  const lines: string[] = [];
  const show = (what: string, job: CostJob): void => {
    const e = estimateSeconds(job, model);
    lines.push(`| ${what} | ${formatDuration(e.seconds)} | ${formatDuration(e.samplingSeconds)} | ${formatDuration(e.provingSeconds)} | ${formatDuration(e.worstSeconds)} |`);
  };
  lines.push('| mine job with the CLI defaults, 2 proof workers | estimate | sampling + checking | proving | worst case (every proof spends its budget) |', '| --- | --- | --- | --- | --- |');
  for (const d of [2, 5, 8, 10]) show(`${d} inputs, 32×2 network (the demo size)`, defaultMineJob(d, 32, 2, 2));
  for (const [w, l] of [[64, 4], [128, 4], [256, 4], [256, 8], [512, 8]] as const) show(`5 inputs, ${w}×${l} network`, defaultMineJob(5, w, l, 2));
  // sizes that pass the default warning time, scanning one size at a time from the demo job
  const passes = (job: CostJob): boolean => estimateSeconds(job, model).seconds > DEFAULT_WARN_SECONDS;
  let width = 32;
  while (width < 1 << 14 && !passes(defaultMineJob(5, width, 2, 2))) width *= 2;
  let depth = 2;
  while (depth < 64 && !passes(defaultMineJob(5, 64, depth, 2))) depth++;
  let samples = MINE_DEFAULTS.samples;
  while (samples < 1e10 && !passes({ ...defaultMineJob(5, 32, 2, 2), samples })) samples *= 2;
  let rules = MINE_DEFAULTS.maxRules;
  while (rules < 1e6 && !passes({ ...defaultMineJob(5, 32, 2, 2), rules })) rules *= 2;
  lines.push(
    '',
    `Sizes at which a default mine job (5 inputs, 2 proof workers, otherwise the demo network) is estimated to pass the default warning time of ${formatDuration(DEFAULT_WARN_SECONDS)}, doubling one size at a time:`,
    '',
    `- width (2 hidden layers): ${width < 1 << 14 ? width : 'not below 16384'}`,
    `- depth (width 64): ${depth < 64 ? depth : 'not below 64'} hidden layers`,
    `- --samples: ${samples < 1e10 ? samples.toLocaleString('en-US') : 'not below 1e10'}`,
    `- --max-rules: ${rules < 1e6 ? rules.toLocaleString('en-US') : 'not below 1e6'}`,
  );
  // inputs at which a hard rule's proof passes the default budgets, on the demo network
  const demo = defaultMineJob(5, 32, 2, 1);
  const piece = model.perPiece + model.perPieceWeightLayer * demo.weights * demo.layers;
  const dAt = (pieces: number): number => (Math.log(pieces) - model.hardLog) / model.hardGrowth;
  lines.push(
    '',
    `A hard rule (a box spanning every free input next to a decision boundary) needs about exp(${model.hardLog.toFixed(2)} + ${model.hardGrowth.toFixed(2)}·d) pieces, ` +
      `×${Math.exp(model.hardGrowth).toFixed(1)} per input. It passes the default --prove-boxes ${MINE_DEFAULTS.proveBoxes.toLocaleString('en-US')} at d ≈ ${dAt(MINE_DEFAULTS.proveBoxes).toFixed(1)} inputs, ` +
      `and the default --prove-seconds ${MINE_DEFAULTS.proveSeconds} on the demo-size network (${(1000 * piece).toFixed(2)} ms a piece) at d ≈ ${dAt(MINE_DEFAULTS.proveSeconds / piece).toFixed(1)}: ` +
      `above that, such rules end \`unknown\` with a part of their volume proven, unless the budgets are raised (each input more costs about ×${Math.exp(model.hardGrowth).toFixed(0)} in pieces and time).`,
    '',
    `Proving is bounded by its budgets: at most rules × (--prove-seconds + one piece) / jobs. With the defaults, ${MINE_DEFAULTS.maxRules} × ${MINE_DEFAULTS.proveSeconds} s / 2 = ` +
      `${formatDuration((MINE_DEFAULTS.maxRules * MINE_DEFAULTS.proveSeconds) / 2)}; a mine job passes an hour through larger budgets (e.g. --prove-seconds 120 with 60 rules on 2 cores in the worst case), ` +
      'very large networks (per-piece cost grows with weights × layers) or hundreds of millions of samples.',
  );
  return lines;
}
