import { describe, expect, it } from 'vitest';
import { writeMlpOnnx } from '../../src/model/index.js';
import { readOnnxNetwork } from '../../src/prove/index.js';
import { createRng, heInit } from '../../src/train/index.js';
import { networkSize } from '../../src/scale/index.js';

describe('networkSize', () => {
  it('counts the weights and biases of every Gemm layer of a network read from ONNX bytes', () => {
    const layers = heInit([5, 32, 16, 4], createRng(3));
    const read = readOnnxNetwork(writeMlpOnnx(layers), 'test.onnx');
    expect(read.supported).toBe(true);
    if (!read.supported) return;
    // closed form: Σ in·out + out = (5·32 + 32) + (32·16 + 16) + (16·4 + 4) = 192 + 528 + 68
    expect(networkSize(read.network)).toEqual({ weights: 788, layers: 3 });
  });
});
