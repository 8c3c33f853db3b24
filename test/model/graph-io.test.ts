import * as ort from 'onnxruntime-node';
import { describe, expect, it } from 'vitest';
import { ModelError } from '../../src/errors.js';
import { graphIo } from '../../src/model/graph-io.js';
import { writeMlpOnnx } from '../../src/model/onnx-write.js';
import { matMulGraph } from './graph-bytes.js';

const W = [1, 0, 0, 0, 1, 0];

describe('graphIo', () => {
  it('reads names, rank and a symbolic batch from the session metadata', async () => {
    const session = await ort.InferenceSession.create(
      writeMlpOnnx([{ inSize: 2, outSize: 3, weights: W, bias: [0, 0, 0], activation: 'none' }], { inputName: 'obs', outputName: 'q' }),
    );
    expect(graphIo(session, 2, 3, 'm.onnx')).toEqual({ inputName: 'obs', outputName: 'q', inputRank: 2, fixedBatch: undefined });
    await session.release();
  });

  it('reads a fixed batch and a [batch, 1, d] input', async () => {
    const session = await ort.InferenceSession.create(matMulGraph({ d: 2, k: 3, w: W, b: [0, 0, 0], inputShape: [1, 1, 2], outputShape: [1, 1, 3] }));
    expect(graphIo(session, 2, 3, 'm.onnx')).toEqual({ inputName: 'x', outputName: 'y', inputRank: 3, fixedBatch: 1 });
    await session.release();
  });

  it('refuses an input shape that is not [batch, d] or [batch, 1, d]', async () => {
    const session = await ort.InferenceSession.create(matMulGraph({ d: 2, k: 3, w: W, b: [0, 0, 0], inputShape: ['n', 2, 2], outputShape: ['n', 2, 3] }));
    expect(() => graphIo(session, 2, 3, 'm.onnx')).toThrow(
      new ModelError('MODEL_GRAPH', 'm.onnx: the graph input has shape [n, 2, 2]; expected [batch, 2] or [batch, 1, 2]'),
    );
    await session.release();
  });
});
