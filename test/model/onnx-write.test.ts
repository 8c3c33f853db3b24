import { describe, expect, it } from 'vitest';
import * as ort from 'onnxruntime-node';
import { writeMlpOnnx } from '../../src/model/onnx-write.js';

describe('writeMlpOnnx', () => {
  it('writes a Gemm/Relu graph that onnxruntime runs with the hand-computed result', async () => {
    // y = W2 relu(W1 x + b1) + b2, computed by hand for x = (1, 2) and (-1, 3)
    const bytes = writeMlpOnnx([
      { inSize: 2, outSize: 3, weights: [1, 0, 0, 1, 1, 1], bias: [0, 0, -1], activation: 'relu' },
      { inSize: 3, outSize: 2, weights: [1, 0, 0, 0, 1, 1], bias: [0.5, 0], activation: 'none' },
    ]);
    const session = await ort.InferenceSession.create(bytes);
    const out = await session.run({ input: new ort.Tensor('float32', new Float32Array([1, 2, -1, 3]), [2, 2]) });
    // exact: all values are small dyadic rationals, representable in float32
    expect(Array.from(out['scores']!.data as Float32Array)).toEqual([1.5, 4, 0.5, 4]);
    await session.release();
  });

  it('refuses layers whose widths do not chain', () => {
    expect(() =>
      writeMlpOnnx([
        { inSize: 2, outSize: 3, weights: new Array(6).fill(0), bias: [0, 0, 0], activation: 'relu' },
        { inSize: 2, outSize: 1, weights: [0, 0], bias: [0], activation: 'none' },
      ]),
    ).toThrow('layer 1: inSize 2 != previous outSize 3');
  });
});
