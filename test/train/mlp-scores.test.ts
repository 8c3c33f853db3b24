import { describe, expect, it } from 'vitest';
import * as ort from 'onnxruntime-node';
import { writeMlpOnnx } from '../../src/model/onnx-write.js';
import { createRng, heInit, mlpPredict, mlpScores } from '../../src/train/index.js';

describe('mlpScores', () => {
  it('matches onnxruntime running the same network written as ONNX', async () => {
    const rng = createRng(21);
    const layers = heInit([5, 12, 9, 4], rng);
    for (const l of layers) for (let i = 0; i < l.bias.length; i++) l.bias[i] = rng() - 0.5;
    const n = 300;
    const x = Float64Array.from({ length: n * 5 }, () => 4 * rng() - 2);
    const ours = mlpScores(layers, x, n);
    const session = await ort.InferenceSession.create(writeMlpOnnx(layers));
    const out = await session.run({ input: new ort.Tensor('float32', Float32Array.from(x), [n, 5]) });
    const theirs = out['scores']!.data as Float32Array;
    await session.release();
    // onnxruntime computes in float32 from float32-rounded weights: relative error ~1e-7 per
    // operation, a few dozen operations per score of size ~1–10; 1e-4 absolute is ~100× that.
    const FLOAT32_AGREEMENT = 1e-4;
    let worst = 0;
    for (let i = 0; i < ours.length; i++) worst = Math.max(worst, Math.abs(ours[i]! - theirs[i]!));
    expect(worst).toBeLessThan(FLOAT32_AGREEMENT);
    expect(ours).toHaveLength(n * 4);
  });

  it('picks the argmax class per row in mlpPredict', () => {
    // One identity layer: the scores are the inputs themselves.
    const identity = { inSize: 3, outSize: 3, weights: [1, 0, 0, 0, 1, 0, 0, 0, 1], bias: [0, 0, 0], activation: 'none' as const };
    const predicted = mlpPredict([identity], new Float64Array([0, 2, 1, 5, -1, 3, 1, 1, 1]), 3);
    expect(Array.from(predicted)).toEqual([1, 0, 0]);
  });
});
