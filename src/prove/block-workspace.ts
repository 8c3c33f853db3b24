import type { AffineLayer, Network } from './network.js';
import { LANES, absWeights, addNoiseBlocksInPlace, affineProductBlocks, reluStepInPlace } from './interval-kernels.js';
import { MAX_SAFE_MAGNITUDE, NOISE_INFLATION } from './float-error.js';
import { AFFINE_KERNEL_WASM_BASE64 } from './wasm/affine-kernel-bytes.js';

/**
 * Work arrays for batched interval propagation, and the steps over them (affine products,
 * float32 error terms, ReLU): computed by the WebAssembly SIMD kernels (wasm/affine-kernel.wat)
 * when the runtime supports them, which gives the same bits as the TypeScript kernels in
 * interval-kernels.ts (same operations in the same order) and is 2–3× faster, else by those. With WebAssembly, the arrays and a copy of the weights live in the
 * module's memory.
 */
export interface BlockWorkspace {
  readonly kind: 'wasm' | 'typescript';
  /** Centre and radius of `blocks` blocks of LANES boxes, and a second pair to write into. */
  readonly c: Float64Array;
  readonly r: Float64Array;
  readonly tc: Float64Array;
  readonly tr: Float64Array;
  /** c' = W c + b and r' = |W| r from (cc, rr) into (nc, nr), all four arrays of this workspace. */
  products(layer: AffineLayer, cc: Float64Array, rr: Float64Array, nc: Float64Array, nr: Float64Array, blocks: number): void;
  /** The layer's float32 error bound added to nr, and overflow marked (addNoiseBlocksInPlace). */
  noise(layer: AffineLayer, cc: Float64Array, rr: Float64Array, nc: Float64Array, nr: Float64Array, blocks: number, over: Uint8Array): void;
  /** ReLU on the first `count` values of each block (reluStepInPlace). */
  relu(cc: Float64Array, rr: Float64Array, blocks: number, count: number): void;
}

interface KernelExports {
  affine(w: number, aw: number, bias: number, cc: number, rr: number, nc: number, nr: number, inSize: number, outSize: number, blocks: number, bstride: number): void;
  noise(cc: number, rr: number, nc: number, nr: number, scale: number, konst: number, peak: number, inSize: number, outSize: number, blocks: number, bstride: number, inflation: number): void;
  relu(cc: number, rr: number, count: number, blocks: number, bstride: number): void;
}

let compiled: WebAssembly.Module | null | undefined;

/** The compiled kernel, or null where WebAssembly SIMD is unavailable. */
function kernelModule(): WebAssembly.Module | null {
  if (compiled === undefined) {
    try {
      compiled = new WebAssembly.Module(Buffer.from(AFFINE_KERNEL_WASM_BASE64, 'base64'));
    } catch {
      compiled = null;
    }
  }
  return compiled;
}

/** Offsets rounded up to 16 bytes keep the SIMD loads aligned. */
const align = (bytes: number): number => Math.ceil(bytes / 16) * 16;

function typescriptWorkspace(size: number, stride: number): BlockWorkspace {
  return {
    kind: 'typescript',
    c: new Float64Array(size),
    r: new Float64Array(size),
    tc: new Float64Array(size),
    tr: new Float64Array(size),
    products: (layer, cc, rr, nc, nr, blocks) => affineProductBlocks(layer, absWeights(layer), cc, rr, nc, nr, blocks, stride),
    noise: (layer, cc, rr, nc, nr, blocks, over) => addNoiseBlocksInPlace(layer, cc, rr, nc, nr, blocks, stride, over),
    relu: (cc, rr, blocks, count) => reluStepInPlace(cc, rr, blocks, stride * LANES, count),
  };
}

function wasmWorkspace(mod: WebAssembly.Module, net: Network, size: number, stride: number): BlockWorkspace {
  const affine = net.layers.filter((l): l is AffineLayer => l.kind === 'affine');
  let bytes = 0;
  for (const l of affine) bytes += align(8 * l.weights.length) * 2 + 3 * align(8 * l.outSize);
  bytes += 4 * align(8 * size) + align(8 * size / stride);
  const memory = new WebAssembly.Memory({ initial: Math.ceil(bytes / 65536) });
  const kernel = new WebAssembly.Instance(mod, { env: { memory } }).exports as unknown as KernelExports;
  const bstride = stride * LANES * 8;
  let at = 0;
  const take = (n: number): Float64Array => {
    const view = new Float64Array(memory.buffer, at, n);
    at += align(8 * n);
    return view;
  };
  const offsets = new Map<AffineLayer, [number, number, number, number, number]>();
  for (const l of affine) {
    const parts = [l.weights, absWeights(l), l.bias, l.errorScale, l.errorConst].map((a) => {
      const view = take(a.length);
      view.set(a);
      return view.byteOffset;
    });
    offsets.set(l, parts as [number, number, number, number, number]);
  }
  const [c, r, tc, tr] = [take(size), take(size), take(size), take(size)];
  const peak = take(size / stride);
  return {
    kind: 'wasm',
    c,
    r,
    tc,
    tr,
    products: (layer, cc, rr, nc, nr, blocks) => {
      const [w, aw, b] = offsets.get(layer)!;
      kernel.affine(w, aw, b, cc.byteOffset, rr.byteOffset, nc.byteOffset, nr.byteOffset, layer.inSize, layer.outSize, blocks, bstride);
    },
    noise: (layer, cc, rr, nc, nr, blocks, over) => {
      const o = offsets.get(layer)!;
      kernel.noise(cc.byteOffset, rr.byteOffset, nc.byteOffset, nr.byteOffset, o[3], o[4], peak.byteOffset, layer.inSize, layer.outSize, blocks, bstride, NOISE_INFLATION);
      for (let b = 0; b < blocks * LANES; b++) if (peak[b]! > MAX_SAFE_MAGNITUDE) over[b] = 1;
    },
    relu: (cc, rr, blocks, count) => kernel.relu(cc.byteOffset, rr.byteOffset, count, blocks, bstride),
  };
}

const cache = new WeakMap<Network, Map<string, BlockWorkspace>>();

/**
 * The workspace for `blocks` blocks of `stride`-wide boxes of this network (cached per
 * network; interval propagation is synchronous, so one workspace is never used twice at once).
 * @param options.wasm false forces the TypeScript kernel (default: WebAssembly when available)
 */
export function blockWorkspace(net: Network, blocks: number, stride: number, options: { readonly wasm?: boolean } = {}): BlockWorkspace {
  const useWasm = options.wasm !== false && kernelModule() !== null;
  const key = `${useWasm}:${blocks}:${stride}`;
  let perNet = cache.get(net);
  if (!perNet) cache.set(net, (perNet = new Map()));
  let ws = perNet.get(key);
  if (!ws) {
    const size = blocks * stride * LANES;
    ws = useWasm ? wasmWorkspace(kernelModule()!, net, size, stride) : typescriptWorkspace(size, stride);
    perNet.set(key, ws);
  }
  return ws;
}
