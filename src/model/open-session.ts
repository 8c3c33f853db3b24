import * as ort from 'onnxruntime-node';
import { ModelError } from '../errors.js';

/** onnxruntime's own log level "fatal": its errors reach us as exceptions, so it need not print. */
const ORT_LOG_FATAL = 4;

/** The first line of an onnxruntime error message, for one-line messages. */
export function firstLine(error: unknown): string {
  const text = error instanceof Error ? error.message : String(error);
  return text.trim().split('\n')[0]!.trim();
}

/**
 * Creates an onnxruntime inference session on CPU from a model file's bytes.
 * @param bytes the model file's bytes
 * @param path the model file, for messages
 * @param threads intra-op threads (1 keeps results and timing reproducible, and leaves the
 *   other core to worker threads)
 * @throws ModelError `MODEL_NOT_ONNX` when the bytes are not an ONNX protobuf (a different file,
 *   or a truncated one) and `MODEL_INVALID` when onnxruntime reads the file but refuses the graph
 */
export async function openSession(bytes: Uint8Array, path: string, threads: number): Promise<ort.InferenceSession> {
  try {
    return await ort.InferenceSession.create(bytes, {
      executionProviders: ['cpu'],
      intraOpNumThreads: threads,
      interOpNumThreads: 1,
      executionMode: 'sequential',
      graphOptimizationLevel: 'all',
      logSeverityLevel: ORT_LOG_FATAL,
    });
  } catch (error) {
    const detail = firstLine(error);
    if (/protobuf parsing failed|model data pointer is null/i.test(detail)) {
      throw new ModelError('MODEL_NOT_ONNX', `${path}: not an ONNX model, or truncated (onnxruntime: ${detail})`);
    }
    throw new ModelError('MODEL_INVALID', `${path}: onnxruntime cannot load this model (onnxruntime: ${detail})`);
  }
}
