import { describe, expect, it } from 'vitest';
import { intervalBounds, linearBounds, marginNetwork, marginSpec, readOnnxNetwork, type Network } from '../../src/prove/index.js';
import { graphModel, negateOutputs } from './helpers.js';

/**
 * Bounds include the float32 rounding allowance of every layer (γ_n·Σ|w||x| with the safety
 * factor 2: about 2e-6 per layer for these unit-weight, two-input layers and |x| ≤ 5, summed
 * over layers and weighted by |coefficients|, measured up to 1.3e-5), so "exact" means within
 * 1e-4: far below the bound differences the tests tell apart (≥ 0.5).
 */
const EXACT_TOL = 1e-4;

function net(nodes: Parameters<typeof graphModel>[0], inits: Parameters<typeof graphModel>[1], d: number, k: number): Network {
  const r = readOnnxNetwork(graphModel(nodes, inits, d, k));
  if (!r.supported) throw new Error(r.reason);
  return r.network;
}

function linearRange(n: Network, lo: number[], hi: number[], options = {}): [number[], number[]] {
  const low = linearBounds(n, lo, hi, options).lower;
  const up = linearBounds(negateOutputs(n), lo, hi, options).lower;
  return [Array.from(low), Array.from(up, (v) => -v)];
}

function intervalRange(n: Network, lo: number[], hi: number[]): [number[], number[]] {
  const low = new Float64Array(n.outputSize);
  const up = new Float64Array(n.outputSize);
  intervalBounds(n, Float64Array.from(lo), Float64Array.from(hi), 1, low, up);
  return [Array.from(low), Array.from(up)];
}

/** Each bound is sound (on the outside of `truth`) and within EXACT_TOL of `expected`. */
function expectBounds([low, up]: [number[], number[]], expected: [number[], number[]]): void {
  low.forEach((v, j) => {
    expect(v).toBeLessThanOrEqual(expected[0][j]!);
    expect(v).toBeGreaterThan(expected[0][j]! - EXACT_TOL);
  });
  up.forEach((v, j) => {
    expect(v).toBeGreaterThanOrEqual(expected[1][j]!);
    expect(v).toBeLessThan(expected[1][j]! + EXACT_TOL);
  });
}

// relu(a + b) − relu(−a − b) = a + b
const identity2 = net(
  [
    { name: 'split', opType: 'MatMul', input: ['x', 'S'], output: ['z'] },
    { name: 'relu', opType: 'Relu', input: ['z'], output: ['h'] },
    { name: 'merge', opType: 'MatMul', input: ['h', 'M'], output: ['y'] },
  ],
  [
    { name: 'S', dims: [2, 2], values: [1, -1, 1, -1] },
    { name: 'M', dims: [2, 1], values: [1, -1] },
  ],
  2,
  1,
);

// max(a, b) = a + relu(b − a), with a carried as relu(a) − relu(−a)
const max2 = net(
  [
    { name: 'split', opType: 'MatMul', input: ['x', 'S'], output: ['z'] },
    { name: 'relu', opType: 'Relu', input: ['z'], output: ['h'] },
    { name: 'merge', opType: 'MatMul', input: ['h', 'M'], output: ['y'] },
  ],
  [
    { name: 'S', dims: [2, 3], values: [1, -1, -1, 0, 0, 1] },
    { name: 'M', dims: [3, 1], values: [1, -1, 1] },
  ],
  2,
  1,
);

describe('linear bounds, exact cases', () => {
  it('bounds relu(x) − relu(−x) = x exactly on boxes that straddle zero or not', () => {
    for (const [lo, hi] of [
      [[-1, 0], [2, 0.5]],
      [[-2, -2], [2, 2]],
      [[-3, 0], [-1, 0]],
      [[0.5, 0.25], [4, 1]],
    ] as const) {
      expectBounds(linearRange(identity2, [...lo], [...hi]), [[lo[0] + lo[1]], [hi[0] + hi[1]]]);
    }
  });

  it('bounds max(a, b) on [−1, 1]² by [−1, 2], tighter than intervals [−1, 3]', () => {
    // By hand, triangle relaxations: relu(a), relu(−a) on [−1, 1] have chords (±a + 1)/2, and
    // relu(b − a) on [−2, 2] has chord (b − a)/2 + 1. With lower lines 0: lower bound
    // 0 − (1 − a)/2 + 0 ≥ −1 (exact, at a = −1); upper bound (a + 1)/2 − 0 + (b − a)/2 + 1
    // = b/2 + 1.5 ≤ 2 (the true maximum is 1). The area rule takes relu(a) ≥ a, relu(−a) ≥ −a,
    // relu(b − a) ≥ b − a: lower a − (1 − a)/2 + b − a ≥ −2, upper a + b/2 + 1.5 ≤ 3.
    expectBounds(linearRange(max2, [-1, -1], [1, 1]), [[-1], [2]]);
    expectBounds(linearRange(max2, [-1, -1], [1, 1], { slopes: 'adaptive' }), [[-2], [3]]);
    // intervals: relu(a), relu(−a) ∈ [0, 1], relu(b − a) ∈ [0, 2]
    expectBounds(intervalRange(max2, [-1, -1], [1, 1]), [[-1], [3]]);
  });

  it('reproduces the worked example of Singh et al., "An Abstract Domain for Certifying Neural Networks" (POPL 2019, §2)', () => {
    // From memory of the paper's running example: x1, x2 ∈ [−1, 1]; x3 = x1 + x2,
    // x4 = x1 − x2; x5, x6 = relu; x7 = x5 + x6, x8 = x5 − x6; x9, x10 = relu;
    // x11 = x9 + x10 + 1, x12 = x10, with lower ReLU lines y ≥ 0. The paper's back-substitution
    // gives l11 = 1, u11 = 5.5, l12 = 0, u12 = 2, and x11 − x12 ≥ 1 > 0.
    const example = net(
      [
        { name: 'l1', opType: 'MatMul', input: ['x', 'A'], output: ['a'] },
        { name: 'r1', opType: 'Relu', input: ['a'], output: ['b'] },
        { name: 'l2', opType: 'MatMul', input: ['b', 'A'], output: ['c'] },
        { name: 'r2', opType: 'Relu', input: ['c'], output: ['e'] },
        { name: 'l3', opType: 'Gemm', input: ['e', 'C', 'bias'], output: ['y'] },
      ],
      [
        { name: 'A', dims: [2, 2], values: [1, 1, 1, -1] },
        { name: 'C', dims: [2, 2], values: [1, 0, 1, 1] },
        { name: 'bias', dims: [2], values: [1, 0] },
      ],
      2,
      2,
    );
    expectBounds(linearRange(example, [-1, -1], [1, 1], { slopes: 'zero' }), [[1, 0], [5.5, 2]]);
    const margin = marginNetwork(example, marginSpec(2, [0], 'argmax'));
    const low = linearBounds(margin, [-1, -1], [1, 1], { slopes: 'zero' }).lower[0]!;
    expect(low).toBeLessThanOrEqual(1);
    expect(low).toBeGreaterThan(1 - EXACT_TOL);
  });
});
