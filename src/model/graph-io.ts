import type * as ort from 'onnxruntime-node';
import { ModelError } from '../errors.js';

/** How the evaluator feeds the graph: names, the rank of the input tensor and a fixed batch size. */
export interface GraphIo {
  readonly inputName: string;
  readonly outputName: string;
  /** 2 for `[batch, d]`, 3 for `[batch, 1, d]` (some exporters add a sequence axis). */
  readonly inputRank: 2 | 3;
  /** The batch dimension when the graph fixes it (often 1 in exported models), else undefined. */
  readonly fixedBatch: number | undefined;
}

type Dim = number | string;

function tensorShape(meta: ort.InferenceSession.ValueMetadata, role: string, path: string): readonly Dim[] {
  if (!meta.isTensor) throw new ModelError('MODEL_GRAPH', `${path}: the graph ${role} "${meta.name}" is not a tensor`);
  if (meta.type !== 'float32') {
    throw new ModelError('MODEL_GRAPH', `${path}: the graph ${role} "${meta.name}" is ${meta.type}; expected float32`);
  }
  return meta.shape;
}

/** The feature width of a `[batch, w]` or `[batch, 1, w]` shape: a number, a symbol, or undefined when unknown. */
function featureDim(shape: readonly Dim[]): Dim | undefined {
  if (shape.length === 2) return shape[1];
  if (shape.length === 3 && shape[1] === 1) return shape[2];
  return undefined;
}

function showShape(shape: readonly Dim[]): string {
  return `[${shape.map(String).join(', ')}]`;
}

/**
 * Reads the graph's input and output from onnxruntime's session metadata and checks them against
 * the scenario: exactly one float32 input of width `d` and one float32 output of width `k`.
 * Widths given as symbols are left to the probe run that follows (see loadModel).
 * @param session an open session
 * @param d number of scenario inputs
 * @param k number of scenario advisories
 * @param path the model file, for messages
 * @throws ModelError `MODEL_GRAPH` (not one input and one output, wrong type or rank) or
 *   `MODEL_WIDTH_MISMATCH` (width differs from the scenario)
 */
export function graphIo(session: ort.InferenceSession, d: number, k: number, path: string): GraphIo {
  const { inputNames, outputNames } = session;
  if (inputNames.length !== 1) {
    throw new ModelError(
      'MODEL_GRAPH',
      `${path}: the graph has ${inputNames.length} inputs (${inputNames.join(', ')}); expected one float32 tensor [batch, ${d}]`,
    );
  }
  if (outputNames.length !== 1) {
    throw new ModelError(
      'MODEL_GRAPH',
      `${path}: the graph has ${outputNames.length} outputs (${outputNames.join(', ')}); expected one float32 tensor [batch, ${k}]`,
    );
  }
  const inShape = tensorShape(session.inputMetadata[0]!, 'input', path);
  const outShape = tensorShape(session.outputMetadata[0]!, 'output', path);
  // An empty shape means onnxruntime does not know it; the probe run settles the widths.
  const inWidth = inShape.length === 0 ? undefined : featureDim(inShape);
  const outWidth = outShape.length === 0 ? undefined : featureDim(outShape);
  if (inShape.length > 0 && inWidth === undefined) {
    throw new ModelError('MODEL_GRAPH', `${path}: the graph input has shape ${showShape(inShape)}; expected [batch, ${d}] or [batch, 1, ${d}]`);
  }
  if (outShape.length > 0 && outWidth === undefined) {
    throw new ModelError('MODEL_GRAPH', `${path}: the graph output has shape ${showShape(outShape)}; expected [batch, ${k}] or [batch, 1, ${k}]`);
  }
  if (typeof inWidth === 'number' && inWidth !== d) {
    throw new ModelError('MODEL_WIDTH_MISMATCH', `${path} takes ${inWidth} inputs, scenario lists ${d}`);
  }
  if (typeof outWidth === 'number' && outWidth !== k) {
    throw new ModelError('MODEL_WIDTH_MISMATCH', `${path} gives ${outWidth} scores, scenario lists ${k} advisories`);
  }
  const batch = inShape[0];
  return {
    inputName: inputNames[0]!,
    outputName: outputNames[0]!,
    inputRank: inShape.length === 3 ? 3 : 2,
    fixedBatch: typeof batch === 'number' && batch > 0 ? batch : undefined,
  };
}
