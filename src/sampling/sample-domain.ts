import { ToolError } from '../errors.js';
import type { Evaluator, InputSpec, SampleSet } from '../types.js';
import type { Box } from './check-box.js';
import { refineRoundInPlace } from './refine.js';
import type { ActiveSamples } from './refine-passes.js';
import { createRng32 } from './rng.js';
import { evaluatorLabeller, type RowLabeller } from './row-labeller.js';
import { SOBOL_MAX_DIMENSION } from './sobol.js';
import { spaceFillingRows } from './space-filling.js';

/** Share of the budget spent near boundaries by default; the rest covers the box evenly. */
export const BOUNDARY_SHARE_DEFAULT = 0.6;
/** Rows per evaluator call by default (matches the model stage's onnxruntime batch). */
export const BATCH_SIZE_DEFAULT = 16_384;
/** Refinement rounds: each sees the labels of the rounds before it, so boxes can shrink. */
export const REFINE_ROUNDS = 4;
export { GRID_SHARE } from './space-filling.js';

export interface SampleDomainOptions {
  /** Seed of every random choice: the same seed gives the same SampleSet. */
  readonly seed: number;
  /** Exact number of samples returned. */
  readonly budget: number;
  /** Share of the budget for boundary refinement, in [0, 1); default BOUNDARY_SHARE_DEFAULT. */
  readonly boundaryShare?: number;
  /** Rows per evaluator (labeller) call; default BATCH_SIZE_DEFAULT. */
  readonly batchSize?: number;
  /** Called after every evaluated batch with samples done and the budget. */
  readonly onProgress?: (done: number, total: number) => void;
}

function fail(message: string): never {
  throw new ToolError('SAMPLING_OPTIONS', `sampleDomain: ${message}`);
}

/**
 * Samples the network over the input box: a jittered grid and digitally shifted Sobol points
 * for the first (1 − boundaryShare) of the budget, then REFINE_ROUNDS rounds of adaptive
 * refinement near the boundaries between advisories (see refine.ts) for the rest. Points are
 * in scenario units (the model normalises). Deterministic: one seeded generator (`createRng32`:
 * 32-bit draws, scaled into cells and boxes) drives every choice in a fixed order, and batches
 * are labelled as fixed ranges of rows. Nothing of the sample set's size is allocated besides the result:
 * fresh memory is slow to fault in on small virtual machines (docs/sampling.md).
 * @param inputs the scenario's inputs (their [min, max] ranges form the box; not changed)
 * @param source the controller: an evaluator, called with at most batchSize rows at a time, or
 *   a labeller that also provides the arrays (worker threads label batches in parallel; the
 *   result is the same bit for bit, as the batches are the same)
 * @param options seed, budget, boundary share, batch size, progress callback
 * @returns exactly `budget` labelled samples
 * @throws ToolError (`SAMPLING_OPTIONS`, `SAMPLING_DIMENSION`, `SAMPLING_EVALUATOR`,
 *   `SAMPLING_SEED`) for bad options, too many inputs, or an evaluator returning too few rows;
 *   whatever the evaluator throws
 */
export async function sampleDomain(inputs: readonly InputSpec[], source: Evaluator | RowLabeller, options: SampleDomainOptions): Promise<SampleSet> {
  const { seed, budget } = options;
  const boundaryShare = options.boundaryShare ?? BOUNDARY_SHARE_DEFAULT;
  const batchSize = options.batchSize ?? BATCH_SIZE_DEFAULT;
  if (!Number.isSafeInteger(budget) || budget < 1) fail(`budget: expected a whole number >= 1, found ${budget}`);
  if (!(boundaryShare >= 0 && boundaryShare < 1)) fail(`boundaryShare: expected a number in [0, 1), found ${boundaryShare}`);
  if (!Number.isSafeInteger(batchSize) || batchSize < 1) fail(`batchSize: expected a whole number >= 1, found ${batchSize}`);
  const d = inputs.length;
  if (d < 1 || d > SOBOL_MAX_DIMENSION) {
    throw new ToolError('SAMPLING_DIMENSION', `sampleDomain: expected 1 to ${SOBOL_MAX_DIMENSION} inputs, found ${d}`);
  }
  inputs.forEach((input, j) => {
    if (!Number.isFinite(input.min) || !Number.isFinite(input.max) || input.min > input.max) {
      fail(`inputs[${j}] "${input.name}": expected finite min <= max, found [${input.min}, ${input.max}]`);
    }
  });
  const box: Box = inputs.map((input) => [input.min, input.max] as const);
  const rng = createRng32(seed);
  const labeller = typeof source === 'function' ? evaluatorLabeller(source, d) : source;
  const arrays = labeller.allocate(budget, d);
  const { x, advisory, margin } = arrays;
  let filled = 0;
  // the largest advisory seen, for the width of refinement's cell tables
  let maxAdvisory = 0;

  /**
   * Labels rows [filled, filled + count) of x in batches, each written first by `write` when
   * given (else already written); up to the labeller's concurrency of them at once (worker
   * threads label while this thread writes the next batch), each finished batch taken in
   * order, so progress and results do not depend on how many run at once.
   */
  async function evaluateNew(count: number, write?: (from: number, rows: number) => void): Promise<void> {
    const start = filled;
    const running: Array<Promise<void>> = [];
    let next = 0;
    const launch = (): void => {
      const rows = Math.min(batchSize, count - next);
      write?.(start + next, rows);
      const batch = labeller.labelInPlace(arrays, start + next, rows);
      // handled now, awaited in turn below: a later batch failing first is not an unhandled rejection
      batch.catch(() => undefined);
      running.push(batch);
      next += rows;
    };
    try {
      while (next < count && running.length < labeller.concurrency) launch();
      while (running.length > 0) {
        await running.shift();
        const rows = Math.min(batchSize, count - (filled - start));
        maxAdvisory = Math.max(maxAdvisory, largest(advisory, filled, filled + rows));
        filled += rows;
        options.onProgress?.(filled, budget);
        if (next < count) launch();
      }
    } finally {
      // a failed batch: the others still running must settle before the error goes up
      await Promise.allSettled(running);
    }
  }

  // points are written straight into x: no intermediate arrays (fresh memory is slow to fault in)
  const refineTotal = Math.floor(budget * boundaryShare);
  const initial = budget - refineTotal;
  await evaluateNew(initial, spaceFillingRows(box, initial, rng, x));
  // each round looks at the candidates (samples in mixed cells, near-ties) and new points of the
  // round before (all samples at first); two work spaces take turns: one holds the candidates
  // being read, the other the new ones. Both start at the first round's size and grow only when
  // a round needs more: pages are faulted in as they are first written, so a space reused
  // costs nothing new, while a space replaced by a larger one is faulted in again
  let active: ActiveSamples = { candidates: new Int32Array(0), from: 0, to: filled };
  const spaces = [new Int32Array(initial), new Int32Array(initial)];
  for (let round = 0; round < REFINE_ROUNDS; round++) {
    const count = Math.floor((refineTotal * (round + 1)) / REFINE_ROUNDS) - Math.floor((refineTotal * round) / REFINE_ROUNDS);
    if (count === 0) continue;
    const need = active.candidates.length + active.to - active.from;
    if (spaces[round % 2]!.length < need) spaces[round % 2] = new Int32Array(need);
    const from = filled;
    // the round's points are made a batch at a time, each labelled while the next is made
    const made = refineRoundInPlace(box, { x, advisory, margin, n: filled }, count, round, rng, x, filled, { active, scratch: spaces[round % 2]!, maxAdvisory });
    await evaluateNew(count, (_from, rows) => made.write(rows));
    active = { candidates: made.candidates, from, to: filled };
  }
  return { d, n: budget, x, advisory, margin, seed };
}

/** The largest of values[from .. to) (0 when empty). */
function largest(values: Int32Array, from: number, to: number): number {
  let max = 0;
  for (let i = from; i < to; i++) if (values[i]! > max) max = values[i]!;
  return max;
}
