import * as ort from 'onnxruntime-node';
import { ModelError } from '../errors.js';
import type { Evaluation, Evaluator, Scenario } from '../types.js';
import { decideInPlace } from './decide-in-place.js';
import type { GraphIo } from './graph-io.js';
import { firstLine } from './open-session.js';
import { toNetworkInputInPlace } from './to-network-input-in-place.js';

/** What the evaluator needs to know about the model and the scenario. */
export interface BatchEvaluatorSpec {
  readonly session: ort.InferenceSession;
  readonly io: GraphIo;
  readonly scenario: Scenario;
  /** Rows per onnxruntime call (the graph's fixed batch overrides it). */
  readonly batchSize: number;
  /** The model file, for messages. */
  readonly path: string;
}

/**
 * Labels rows [from, from + n) of x in place: writes advisory[from + r] and margin[from + r]
 * (as `Evaluator` computes them) for r < n, in batches of the model's batch size counted from
 * `from`, so that the same call gives the same onnxruntime batches, and the same bits, in any
 * thread. `x`, `advisory` and `margin` may live in shared memory (worker threads).
 */
export type LabelInPlace = (x: Float64Array, from: number, n: number, advisory: Int32Array, margin: Float32Array) => Promise<void>;

function describeRow(scenario: Scenario, x: Float64Array, row: number): string {
  const d = scenario.inputs.length;
  return scenario.inputs
    .map((input, j) => `${input.name} = ${x[row * d + j]}${input.unit === '' ? '' : ` ${input.unit}`}`)
    .join(', ');
}

/**
 * Builds the model's Evaluator: inputs in scenario units → normalised float32 → onnxruntime in
 * batches → scores, decision and margin. One float32 input buffer (and its tensor) is reused
 * across batches and calls; calls are queued so that a call never overwrites the buffer while
 * onnxruntime still has to read it (onnxruntime-node reads feeds on a later turn of the event
 * loop). Costs per row: d conversions, one copy of k scores, one pass over them.
 * `labelInPlace` does the same batches but writes only decisions and margins, straight into
 * the caller's arrays (no result arrays allocated: the sampler's path).
 * @throws (from the evaluator) ModelError `MODEL_NONFINITE_SCORE` naming the first row with a
 *   NaN or infinite score and its inputs in scenario units; `MODEL_RUN` when onnxruntime fails;
 *   `MODEL_CLOSED` after close
 */
export function batchEvaluator(spec: BatchEvaluatorSpec): { evaluate: Evaluator; labelInPlace: LabelInPlace; batch: number; close(): Promise<void> } {
  const { session, io, scenario, path } = spec;
  const d = scenario.inputs.length;
  const k = scenario.advisories.length;
  const batch = io.fixedBatch ?? spec.batchSize;
  const buffer = new Float32Array(batch * d);
  const dims = (rows: number): number[] => (io.inputRank === 3 ? [rows, 1, d] : [rows, d]);
  const fullTensor = new ort.Tensor('float32', buffer, dims(batch));
  const offset = scenario.normalize ? Float64Array.from(scenario.normalize.offset) : undefined;
  const scale = scenario.normalize ? Float64Array.from(scenario.normalize.scale) : new Float64Array(d).fill(1);
  let queue: Promise<unknown> = Promise.resolve();
  let closed = false;

  /**
   * Runs rows [start, start + rows) of x (rows ≤ batch) as one onnxruntime call, writes their
   * decisions to advisory/margin from row `outRow` on, and returns the call's scores.
   */
  async function runBatch(x: Float64Array, start: number, rows: number, advisory: Int32Array, margin: Float32Array, outRow: number): Promise<Float32Array> {
    toNetworkInputInPlace(x, start, rows, d, offset, scale, buffer);
    let tensor = fullTensor;
    if (rows < batch) {
      if (io.fixedBatch === undefined) tensor = new ort.Tensor('float32', buffer.subarray(0, rows * d), dims(rows));
      else buffer.fill(0, rows * d); // a graph with a fixed batch gets padding rows, ignored below
    }
    let out: Float32Array;
    try {
      const result = await session.run({ [io.inputName]: tensor });
      out = result[io.outputName]!.data as Float32Array;
    } catch (error) {
      throw new ModelError('MODEL_RUN', `${path}: onnxruntime failed on rows ${start}–${start + rows - 1} (onnxruntime: ${firstLine(error)})`);
    }
    if (out.length !== tensor.dims[0]! * k) {
      throw new ModelError('MODEL_WIDTH_MISMATCH', `${path} gives ${out.length / tensor.dims[0]!} scores, scenario lists ${k} advisories`);
    }
    const chunk = out.length === rows * k ? out : out.subarray(0, rows * k);
    const bad = decideInPlace(chunk, rows, k, scenario.decision, advisory, margin, outRow);
    if (bad >= 0) {
      const row = start + bad;
      const rowScores = Array.from(chunk.subarray(bad * k, bad * k + k));
      const j = rowScores.findIndex((s) => !Number.isFinite(s));
      throw new ModelError(
        'MODEL_NONFINITE_SCORE',
        `${path}: score ${rowScores[j]} for "${scenario.advisories[j]}" at input row ${row} (${describeRow(scenario, x, row)})`,
      );
    }
    return chunk;
  }

  async function run(x: Float64Array, n: number): Promise<Evaluation> {
    if (closed) throw new ModelError('MODEL_CLOSED', `${path}: the model was closed`);
    // One batch: onnxruntime's own output array becomes the result (no copy, no allocation).
    let scores: Float32Array = n <= batch ? new Float32Array(0) : new Float32Array(n * k);
    const advisory = new Int32Array(n);
    const margin = new Float32Array(n);
    for (let start = 0; start < n; start += batch) {
      const rows = Math.min(batch, n - start);
      const chunk = await runBatch(x, start, rows, advisory, margin, start);
      if (n <= batch) scores = chunk;
      else scores.set(chunk, start * k);
    }
    return { scores, advisory, margin };
  }

  async function label(x: Float64Array, from: number, n: number, advisory: Int32Array, margin: Float32Array): Promise<void> {
    if (closed) throw new ModelError('MODEL_CLOSED', `${path}: the model was closed`);
    for (let start = from; start < from + n; start += batch) await runBatch(x, start, Math.min(batch, from + n - start), advisory, margin, start);
  }

  /** Queues a call behind the ones before it (onnxruntime reads the shared buffer later). */
  function queued<T>(call: () => Promise<T>): Promise<T> {
    const next = queue.then(call);
    queue = next.catch(() => undefined);
    return next;
  }

  const evaluate: Evaluator = (x, n) => {
    if (!Number.isInteger(n) || n < 0 || x.length < n * d) {
      return Promise.reject(new RangeError(`evaluate: expected n >= 0 rows of ${d} values, got n = ${n} and ${x.length} values`));
    }
    return queued(() => run(x, n));
  };
  const labelInPlace: LabelInPlace = (x, from, n, advisory, margin) => {
    if (!Number.isInteger(from) || !Number.isInteger(n) || from < 0 || n < 0 || x.length < (from + n) * d || advisory.length < from + n || margin.length < from + n) {
      return Promise.reject(new RangeError(`labelInPlace: expected rows [${from}, ${from + n}) of ${d} values and as many advisories and margins, got ${x.length} values, ${advisory.length} advisories, ${margin.length} margins`));
    }
    return queued(() => label(x, from, n, advisory, margin));
  };
  const close = async (): Promise<void> => {
    if (closed) return;
    closed = true;
    await queue;
    await session.release();
  };
  return { evaluate, labelInPlace, batch, close };
}
