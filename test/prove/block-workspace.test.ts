import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { writeMlpOnnx } from '../../src/model/onnx-write.js';
import { intervalBounds, readOnnxNetwork } from '../../src/prove/index.js';
import { blockWorkspace } from '../../src/prove/block-workspace.js';
import { AFFINE_KERNEL_SOURCE_SHA256 } from '../../src/prove/wasm/affine-kernel-bytes.js';
import { mulberry32, randomMlp } from './helpers.js';

describe('WebAssembly interval kernels', () => {
  it('are built from the committed .wat source', () => {
    const wat = readFileSync(fileURLToPath(new URL('../../src/prove/wasm/affine-kernel.wat', import.meta.url)));
    expect(createHash('sha256').update(wat).digest('hex')).toBe(AFFINE_KERNEL_SOURCE_SHA256);
  });

  it('are used under Node 20 (WebAssembly SIMD available)', () => {
    const r = readOnnxNetwork(writeMlpOnnx(randomMlp(mulberry32(1), [2, 3, 2])));
    if (!r.supported) throw new Error(r.reason);
    expect(blockWorkspace(r.network, 2, 3).kind).toBe('wasm');
    expect(blockWorkspace(r.network, 2, 3, { wasm: false }).kind).toBe('typescript');
  });

  it('give the same bits as the TypeScript kernels on random networks and boxes', () => {
    const rng = mulberry32(2024);
    for (let t = 0; t < 60; t++) {
      const d = 1 + Math.floor(rng() * 5);
      const hidden = Array.from({ length: Math.floor(rng() * 4) }, () => 1 + Math.floor(rng() * 40));
      const k = 1 + Math.floor(rng() * 5);
      const r = readOnnxNetwork(writeMlpOnnx(randomMlp(rng, [d, ...hidden, k], 0.5 + 3 * rng())));
      if (!r.supported) throw new Error(r.reason);
      // a batch size that is not a multiple of the 8-box blocks nor of the 128-box chunks
      const n = 1 + Math.floor(rng() * 300);
      const lo = new Float64Array(n * d);
      const hi = new Float64Array(n * d);
      for (let i = 0; i < n * d; i++) {
        lo[i] = -2 + 4 * rng();
        hi[i] = lo[i]! + (rng() < 0.2 ? 0 : rng() ** 3);
      }
      const out = (wasm: boolean): [Float64Array, Float64Array] => {
        const low = new Float64Array(n * k);
        const up = new Float64Array(n * k);
        intervalBounds(r.network, lo, hi, n, low, up, { wasm });
        return [low, up];
      };
      const [a, b] = [out(true), out(false)];
      for (let i = 0; i < n * k; i++) {
        expect(a[0][i]).toBe(b[0][i]);
        expect(a[1][i]).toBe(b[1][i]);
      }
    }
  });
});
