import { describe, expect, it } from 'vitest';
import { writeMlpOnnx } from '../../src/model/onnx-write.js';
import { forward, intervalBounds, readOnnxNetwork, type Network } from '../../src/prove/index.js';
import { ModelError } from '../../src/errors.js';
import { attr, graphModel, mulberry32, runOrt, samplePoints } from './helpers.js';

/**
 * Forward pass (float64 over float32 weights) against onnxruntime (float32): they differ only
 * by float32 rounding, at most γ_n·Σ|w||x| per layer (Higham 2002, §3.1), about 1e-6 of the
 * score scale for these few-layer, unit-scale graphs; observed differences are near 1e-8, and
 * 1e-5 relative leaves room for other summation orders in the runtime's kernels.
 */
const FORWARD_REL_TOL = 1e-5;

function read(bytes: Uint8Array): Network {
  const r = readOnnxNetwork(bytes);
  if (!r.supported) throw new Error(`unsupported: ${r.operator} ${r.node}: ${r.reason}`);
  return r.network;
}

/**
 * The reader's network must agree with onnxruntime on random inputs, and the interval bound
 * of the one-point box [x, x] (which includes the float32 error model) must contain the
 * runtime's float32 output exactly.
 */
async function expectMatchesOrt(bytes: Uint8Array, d: number, seed: number, range = 3): Promise<Network> {
  const net = read(bytes);
  const n = 200;
  const rng = mulberry32(seed);
  const x = samplePoints(rng, new Array(d).fill(-range), new Array(d).fill(range), n);
  const ours = forward(net, x, n);
  const theirs = await runOrt(bytes, x, n, d);
  const k = net.outputSize;
  expect(theirs.length).toBe(n * k);
  const lower = new Float64Array(n * k);
  const upper = new Float64Array(n * k);
  intervalBounds(net, x, x, n, lower, upper);
  for (let i = 0; i < n * k; i++) {
    expect(Math.abs(ours[i]! - theirs[i]!)).toBeLessThanOrEqual(FORWARD_REL_TOL * (1 + Math.abs(theirs[i]!)));
    expect(theirs[i]!).toBeGreaterThanOrEqual(lower[i]!);
    expect(theirs[i]!).toBeLessThanOrEqual(upper[i]!);
  }
  return net;
}

const W23 = { name: 'W', dims: [2, 3], values: [0.5, -1.25, 2, 0.75, 1.5, -0.5] };

describe('readOnnxNetwork', () => {
  it('copies the weights of a written MLP exactly and fuses nothing across ReLUs', async () => {
    const layers = [
      { inSize: 2, outSize: 3, weights: [0.1, -0.2, 0.3, 0.4, -0.5, 0.6], bias: [0.01, 0, -0.02], activation: 'relu' as const },
      { inSize: 3, outSize: 2, weights: [1, 2, 3, -4, 5, -6], bias: [0.5, -0.5], activation: 'none' as const },
    ];
    const bytes = writeMlpOnnx(layers);
    const net = await expectMatchesOrt(bytes, 2, 1);
    expect(net.layers.map((l) => l.kind)).toEqual(['affine', 'relu', 'affine']);
    const first = net.layers[0]!;
    if (first.kind !== 'affine') throw new Error('expected affine');
    // exact float32 values, not the float64 literals
    expect(Array.from(first.weights)).toEqual(layers[0]!.weights.map(Math.fround));
    expect(Array.from(first.bias)).toEqual(layers[0]!.bias.map(Math.fround));
    expect(net.inputSize).toBe(2);
    expect(net.outputSize).toBe(2);
  });

  it('reads Gemm with transA = 0, transB = 0, alpha, beta and a [1, n] bias', async () => {
    const bytes = graphModel(
      [{ name: 'g', opType: 'Gemm', input: ['x', 'W', 'C'], output: ['y'], attribute: [attr('alpha', 0.5), attr('beta', 2)] }],
      [W23, { name: 'C', dims: [1, 3], values: [0.25, -0.125, 1] }],
      2,
      3,
    );
    await expectMatchesOrt(bytes, 2, 2);
  });

  it('reads Gemm with transB = 1 and a scalar bias', async () => {
    const bytes = graphModel(
      [{ name: 'g', opType: 'Gemm', input: ['x', 'W', 'C'], output: ['y'], attribute: [attr('transB', 1, 'i')] }],
      [{ name: 'W', dims: [3, 2], values: [0.5, -1.25, 2, 0.75, 1.5, -0.5] }, { name: 'C', dims: [], values: [0.75] }],
      2,
      3,
    );
    await expectMatchesOrt(bytes, 2, 3);
  });

  it('reads MatMul + Add with the bias as either operand, through Relu, fused per layer', async () => {
    const bytes = graphModel(
      [
        { name: 'mm1', opType: 'MatMul', input: ['x', 'W'], output: ['a'] },
        { name: 'add1', opType: 'Add', input: ['b1', 'a'], output: ['z'] },
        { name: 'r', opType: 'Relu', input: ['z'], output: ['h'] },
        { name: 'mm2', opType: 'MatMul', input: ['h', 'W2'], output: ['c'] },
        { name: 'add2', opType: 'Add', input: ['c', 'b2'], output: ['y'] },
      ],
      [W23, { name: 'b1', dims: [3], values: [0.1, -0.2, 0.3] }, { name: 'W2', dims: [3, 1], values: [1, -2, 0.5] }, { name: 'b2', dims: [1], values: [-0.25] }],
      2,
      1,
    );
    const net = await expectMatchesOrt(bytes, 2, 4);
    expect(net.layers.map((l) => l.kind)).toEqual(['affine', 'relu', 'affine']);
    expect(net.layers[0]!.nodes).toEqual(['mm1', 'add1']);
  });

  it('fuses Sub and Div by Constant nodes (input normalisation) and Mul into the next Gemm', async () => {
    const bytes = graphModel(
      [
        { name: 'c_off', opType: 'Constant', input: [], output: ['off'], attribute: [attr('value', { name: 'v', dims: [2], values: [1.5, -20] })] },
        { name: 'c_sc', opType: 'Constant', input: [], output: ['sc'], attribute: [attr('value', { name: 'v', dims: [1, 2], values: [0.5, 40] })] },
        { name: 'sub', opType: 'Sub', input: ['x', 'off'], output: ['s'] },
        { name: 'div', opType: 'Div', input: ['s', 'sc'], output: ['t'] },
        { name: 'mul', opType: 'Mul', input: ['k', 't'], output: ['u'] },
        { name: 'g', opType: 'Gemm', input: ['u', 'W', 'C'], output: ['v'] },
        { name: 'rsub', opType: 'Sub', input: ['one', 'v'], output: ['y'] },
      ],
      [W23, { name: 'C', dims: [3], values: [0.1, 0.2, 0.3] }, { name: 'k', dims: [], values: [3] }, { name: 'one', dims: [1], values: [1] }],
      2,
      3,
    );
    const net = await expectMatchesOrt(bytes, 2, 5, 30);
    expect(net.layers.length).toBe(1);
    expect(net.layers[0]!.nodes).toEqual(['sub', 'div', 'mul', 'g', 'rsub']);
  });

  it('reads LeakyRelu, Clip (inputs at opset 13 and one-sided), Sigmoid and Tanh', async () => {
    const nodes = [
      { name: 'g', opType: 'Gemm', input: ['x', 'W'], output: ['a'] },
      { name: 'lr', opType: 'LeakyRelu', input: ['a'], output: ['b'], attribute: [attr('alpha', 0.2)] },
      { name: 'clip', opType: 'Clip', input: ['b', 'lo', 'hi'], output: ['c'] },
      { name: 'clip_hi', opType: 'Clip', input: ['c', '', 'hi2'], output: ['d'] },
      { name: 'sig', opType: 'Sigmoid', input: ['d'], output: ['e'] },
      { name: 'mm', opType: 'MatMul', input: ['e', 'V'], output: ['f'] },
      { name: 'tanh', opType: 'Tanh', input: ['f'], output: ['y'] },
    ];
    const bytes = graphModel(
      nodes,
      [W23, { name: 'lo', dims: [], values: [-0.5] }, { name: 'hi', dims: [], values: [1.5] }, { name: 'hi2', dims: [], values: [1.25] }, { name: 'V', dims: [3, 2], values: [1, -1, 2, 0.5, -1.5, 1] }],
      2,
      2,
    );
    const net = await expectMatchesOrt(bytes, 2, 6);
    expect(net.layers.map((l) => l.kind)).toContain('sigmoid');
    expect(net.layers.map((l) => l.kind)).toContain('tanh');
  });

  it('reads Clip with min/max attributes at opset 10', async () => {
    const bytes = graphModel(
      [
        { name: 'mm', opType: 'MatMul', input: ['x', 'W'], output: ['a'] },
        { name: 'clip', opType: 'Clip', input: ['a'], output: ['y'], attribute: [attr('min', -1), attr('max', 0.75)] },
      ],
      [W23],
      2,
      3,
      10,
    );
    await expectMatchesOrt(bytes, 2, 7);
  });

  it('treats Identity, Flatten and row-keeping Reshape as no-ops', async () => {
    const bytes = graphModel(
      [
        { name: 'id', opType: 'Identity', input: ['x'], output: ['a'] },
        { name: 'fl', opType: 'Flatten', input: ['a'], output: ['b'] },
        { name: 'rs', opType: 'Reshape', input: ['b', 'shape1'], output: ['c'] },
        { name: 'g', opType: 'Gemm', input: ['c', 'W'], output: ['d'] },
        { name: 'rs2', opType: 'Reshape', input: ['d', 'shape2'], output: ['y'] },
      ],
      [W23, { name: 'shape1', dims: [2], values: [-1, 2], type: 'int64' }, { name: 'shape2', dims: [2], values: [0, -1], type: 'int64' }],
      2,
      3,
    );
    const net = await expectMatchesOrt(bytes, 2, 8);
    expect(net.layers.length).toBe(1);
  });

  it('returns the operator and node of an unsupported operator instead of throwing', () => {
    const soft = graphModel(
      [
        { name: 'g', opType: 'Gemm', input: ['x', 'W'], output: ['a'] },
        { name: 'the_softmax', opType: 'Softmax', input: ['a'], output: ['y'], attribute: [attr('axis', 1, 'i')] },
      ],
      [W23],
      2,
      3,
    );
    expect(readOnnxNetwork(soft)).toEqual({ supported: false, operator: 'Softmax', node: 'the_softmax', reason: 'operator Softmax is not supported by the prover' });
    const conv = graphModel([{ name: 'conv0', opType: 'Conv', input: ['x', 'W'], output: ['y'] }], [{ name: 'W', dims: [1, 1, 1], values: [1] }], 2, 2);
    const r = readOnnxNetwork(conv);
    expect(r.supported).toBe(false);
    if (!r.supported) expect([r.operator, r.node]).toEqual(['Conv', 'conv0']);
  });

  it('rejects graphs that are not a chain, data-dependent divisions and bad constants', () => {
    const residual = graphModel(
      [
        { name: 'g', opType: 'Gemm', input: ['x', 'W'], output: ['a'] },
        { name: 'skip', opType: 'Add', input: ['a', 'a'], output: ['y'] },
      ],
      [W23],
      2,
      3,
    );
    const r1 = readOnnxNetwork(residual);
    expect(r1.supported === false && r1.operator === 'Add' && r1.node === 'skip' && r1.reason.includes('not a single chain')).toBe(true);
    const reciprocal = graphModel([{ name: 'inv', opType: 'Div', input: ['one', 'x'], output: ['y'] }], [{ name: 'one', dims: [], values: [1] }], 2, 2);
    const r2 = readOnnxNetwork(reciprocal);
    expect(r2.supported === false && r2.operator === 'Div' && r2.reason.includes('not affine')).toBe(true);
    const badBias = graphModel([{ name: 'add', opType: 'Add', input: ['x', 'b'], output: ['y'] }], [{ name: 'b', dims: [3], values: [1, 2, 3] }], 2, 2);
    const r3 = readOnnxNetwork(badBias);
    expect(r3.supported === false && r3.node === 'add' && r3.reason.includes('broadcast')).toBe(true);
  });

  it('throws a ModelError for bytes that are not ONNX', () => {
    expect(() => readOnnxNetwork(new Uint8Array([0xff, 0xff, 0xff, 0xff, 0x0f]), 'junk.onnx')).toThrow(ModelError);
  });
});
