import { describe, expect, it } from 'vitest';
import { ModelError } from '../../src/errors.js';
import { firstLine, openSession } from '../../src/model/open-session.js';
import { matMulGraph } from './graph-bytes.js';

async function codeOf(bytes: Uint8Array): Promise<string> {
  try {
    const session = await openSession(bytes, 'm.onnx', 1);
    await session.release();
  } catch (error) {
    if (error instanceof ModelError) return error.code;
    throw error;
  }
  return 'opened';
}

describe('openSession', () => {
  it('opens a valid graph', async () => {
    expect(await codeOf(matMulGraph({ d: 1, k: 2, w: [1, 1], b: [0, 0], inputShape: ['n', 1], outputShape: ['n', 2] }))).toBe('opened');
  });

  it('tells bytes that are not ONNX (MODEL_NOT_ONNX) from an ONNX graph onnxruntime refuses (MODEL_INVALID)', async () => {
    expect(await codeOf(new TextEncoder().encode('{"inputs": []}'))).toBe('MODEL_NOT_ONNX');
    // MatMul of [n, 3] by a [1, 2] weight: the file parses, the graph's shapes do not fit
    expect(await codeOf(matMulGraph({ d: 1, k: 2, w: [1, 1], b: [0, 0], inputShape: ['n', 3], outputShape: ['n', 2] }))).toBe('MODEL_INVALID');
  });

  it('keeps only the first line of a multi-line message', () => {
    expect(firstLine(new Error('  first\nsecond\n'))).toBe('first');
  });
});
