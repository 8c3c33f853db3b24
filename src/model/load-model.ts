import * as ort from 'onnxruntime-node';
import { ModelError, UsageError } from '../errors.js';
import type { Model, Scenario } from '../types.js';
import { batchEvaluator, type LabelInPlace } from './batch-evaluator.js';
import { graphIo, type GraphIo } from './graph-io.js';
import { firstLine, openSession } from './open-session.js';
import { readModelFile } from './read-model-file.js';
import { toNetworkInputInPlace } from './to-network-input-in-place.js';

/**
 * Rows per onnxruntime call. Per-call overhead is ~18 µs (docs: TOOLCHAIN notes, measured), so
 * 16,384 rows make it negligible while a 50-wide layer's activations (16,384 × 50 × 4 B ≈ 3 MB)
 * stay near cache size.
 */
export const DEFAULT_BATCH_SIZE = 16_384;

export interface LoadModelOptions {
  /** Use this model file instead of the scenario's (e.g. `check --model`, `diff`). */
  readonly modelPath?: string;
  /** onnxruntime intra-op threads; default 1. */
  readonly threads?: number;
  /** Rows per onnxruntime call; default DEFAULT_BATCH_SIZE. */
  readonly batchSize?: number;
}

/** A model run by onnxruntime: the stage's Model, plus in-place labelling and its batch size. */
export interface OnnxModel extends Model {
  /** Writes decisions and margins of some rows straight into the caller's arrays (see LabelInPlace). */
  readonly labelInPlace: LabelInPlace;
  /** Rows per onnxruntime call (the graph's fixed batch when it has one). */
  readonly batchSize: number;
  /** The batch size asked for (a worker loading the same file with it gets the same batches). */
  readonly requestedBatchSize: number;
}

function wholeNumber(name: string, value: number | undefined, fallback: number): number {
  if (value === undefined) return fallback;
  if (!Number.isInteger(value) || value < 1) throw new UsageError(`${name}: expected a whole number >= 1, found ${value}`);
  return value;
}

/** Runs one row (the centre of the box) to learn the output width when the graph does not state it. */
async function probe(session: ort.InferenceSession, io: GraphIo, scenario: Scenario, path: string): Promise<void> {
  const d = scenario.inputs.length;
  const k = scenario.advisories.length;
  const rows = io.fixedBatch ?? 1;
  const centre = Float64Array.from(scenario.inputs, (input) => (input.min + input.max) / 2);
  const buffer = new Float32Array(rows * d);
  const norm = scenario.normalize;
  const offset = norm ? Float64Array.from(norm.offset) : undefined;
  toNetworkInputInPlace(centre, 0, 1, d, offset, norm ? Float64Array.from(norm.scale) : new Float64Array(d).fill(1), buffer);
  const dims = io.inputRank === 3 ? [rows, 1, d] : [rows, d];
  let size: number;
  try {
    const out = await session.run({ [io.inputName]: new ort.Tensor('float32', buffer, dims) });
    size = out[io.outputName]!.size;
  } catch (error) {
    throw new ModelError('MODEL_RUN', `${path}: cannot run on a row of ${d} inputs (onnxruntime: ${firstLine(error)})`);
  }
  if (size !== rows * k) {
    throw new ModelError('MODEL_WIDTH_MISMATCH', `${path} gives ${size / rows} scores, scenario lists ${k} advisories`);
  }
}

/**
 * Loads the scenario's ONNX model into onnxruntime (CPU) and checks it against the scenario:
 * one float32 input of one value per scenario input, one float32 output of one score per
 * advisory (from the graph's metadata, confirmed by one probe row at the centre of the box).
 * @param scenario the validated scenario (inputs, advisories, decision, normalisation)
 * @param options another model file, thread count, batch size
 * @returns the model; call close() when done
 * @throws ModelError `MODEL_UNREADABLE`, `MODEL_EMPTY`, `MODEL_NOT_ONNX`, `MODEL_INVALID`,
 *   `MODEL_GRAPH`, `MODEL_WIDTH_MISMATCH` or `MODEL_RUN`, each naming the file; UsageError for
 *   a thread count or batch size that is not a whole number >= 1
 */
export async function loadModel(scenario: Scenario, options: LoadModelOptions = {}): Promise<OnnxModel> {
  const threads = wholeNumber('threads', options.threads, 1);
  const batchSize = wholeNumber('batchSize', options.batchSize, DEFAULT_BATCH_SIZE);
  const path = options.modelPath ?? scenario.modelPath;
  const { bytes, sha256 } = readModelFile(path);
  const session = await openSession(bytes, path, threads);
  try {
    const io = graphIo(session, scenario.inputs.length, scenario.advisories.length, path);
    await probe(session, io, scenario, path);
    const { evaluate, labelInPlace, batch, close } = batchEvaluator({ session, io, scenario, batchSize, path });
    const counts = { inputCount: scenario.inputs.length, outputCount: scenario.advisories.length };
    return { path, sha256, ...counts, evaluate, labelInPlace, batchSize: batch, requestedBatchSize: batchSize, close };
  } catch (error) {
    await session.release();
    throw error;
  }
}
