import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { forward, proveBox, readOnnxNetwork } from '../../src/prove/index.js';
import { ortAdvisor, runOrt, steppingClock } from './helpers.js';

/**
 * A PyTorch 1.13 export (test/fixtures/torch/make_fixture.py): Sub and Div for the input
 * normalisation, then Gemm(transB = 1) + Relu, with weights in raw_data at unaligned offsets.
 * torch, onnxruntime and our forward pass all compute in float32 or better; they differ by
 * float32 rounding only, measured near 1e-7 for scores of order 10 (TOOLCHAIN.md notes ~1e-7
 * between onnxruntime and torch). 1e-5 relative to the score scale guards that.
 */
const TORCH_REL_TOL = 1e-5;

const dir = fileURLToPath(new URL('../fixtures/torch/', import.meta.url));
const bytes = readFileSync(dir + 'spacing-mlp.onnx');
const fixture = JSON.parse(readFileSync(dir + 'spacing-mlp.json', 'utf8')) as {
  reference: { x: number[]; scores: number[] }[];
  advisories: string[];
};

describe('PyTorch-exported fixture', () => {
  const r = readOnnxNetwork(bytes);
  if (!r.supported) throw new Error(`${r.operator} ${r.node}: ${r.reason}`);
  const net = r.network;

  it('reads the normalisation, Gemm and Relu nodes into three fused affine layers', () => {
    expect(net.layers.map((l) => l.kind)).toEqual(['affine', 'relu', 'affine', 'relu', 'affine']);
    expect(net.layers[0]!.nodes).toEqual(['/0/Sub', '/0/Div', '/1/Gemm']);
    expect([net.inputSize, net.outputSize]).toEqual([3, fixture.advisories.length]);
  });

  it('agrees with the outputs torch computed and with onnxruntime', async () => {
    const n = fixture.reference.length;
    const x = Float64Array.from(fixture.reference.flatMap((p) => p.x));
    const ours = forward(net, x, n);
    const theirs = await runOrt(bytes, x, n, 3);
    fixture.reference.forEach((p, row) => {
      p.scores.forEach((s, j) => {
        const tol = TORCH_REL_TOL * (1 + Math.abs(s));
        expect(Math.abs(ours[row * 4 + j]! - s)).toBeLessThanOrEqual(tol);
        expect(Math.abs(theirs[row * 4 + j]! - s)).toBeLessThanOrEqual(tol);
      });
    });
  });

  it('proves "closing fast on a short gap ⇒ brake" and refutes "the whole domain ⇒ hold"', async () => {
    const ort = await ortAdvisor(bytes, 3, 'argmax');
    const brake = fixture.advisories.indexOf('brake');
    const hold = fixture.advisories.indexOf('hold');
    // gap ≤ 10 m while closing at ≥ 5 m/s: time to collision ≤ 2 s, below the policy's 3 s
    const res = await proveBox(net, [[2, 10], [10, 30], [5, 15]], [brake], 'argmax', { maxBoxes: 2000, maxSeconds: 600, now: steppingClock(1), confirm: ort.confirm });
    expect(res.status).toBe('proven');
    expect(res.provenVolumeFraction).toBe(1);
    const all = await proveBox(net, [[0, 120], [0, 30], [-10, 15]], [hold], 'argmax', { maxBoxes: 2000, maxSeconds: 600, now: steppingClock(1), confirm: ort.confirm });
    expect(all.status).toBe('refuted');
    const check = await ort.confirm(Float64Array.from(all.counterexample!.x), 1);
    expect(check[0]).not.toBe(hold);
    await ort.release();
  });
});
