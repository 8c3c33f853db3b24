import type { Network } from './network.js';
import { maxWidth } from './network.js';
import { roundDown, roundUp } from './float-error.js';
import { LANES, absWeights, affineStepSingle, reluStepInPlace, setCentreRadius, smoothStepInPlace } from './interval-kernels.js';
import { type BlockWorkspace, blockWorkspace } from './block-workspace.js';
export { ACTIVATION_GUARD } from './interval-kernels.js';

/** Blocks of LANES boxes propagated together by intervalBounds (work arrays of 4 × 128 × width doubles). */
const CHUNK_BLOCKS = 16;
/** Smallest batch for which intervalBounds uses the WebAssembly kernels by default. */
const WASM_MIN_BOXES = 16;

/**
 * Interval bound propagation: interval arithmetic (R. E. Moore, Interval Analysis,
 * Prentice-Hall, 1966) pushed through the layers, in the centre/radius form used for
 * networks by S. Gowal et al., "On the Effectiveness of Interval Bound Propagation for
 * Training Verifiably Robust Models", arXiv:1810.12715, 2018: c' = W c + b, r' = |W| r.
 * Each affine layer's radius also grows by its float32 error bound e_j = s_j·M + c_j
 * (M = max |input|), so the bounds enclose what onnxruntime computes, not only the exact map.
 * Activations are monotone: [f(c − r), f(c + r)], rounded outward.
 */

/** Bounds of every layer's output for one box (used by the linear method). */
export interface IntervalTrace {
  /** Per layer: lower and upper bounds of its output as the runtime computes it. */
  readonly lower: Float64Array[];
  readonly upper: Float64Array[];
  /** Per layer: float32 error bound per output of an affine layer (empty for activations). */
  readonly noise: Float64Array[];
  /** Some bound exceeded MAX_SAFE_MAGNITUDE: float32 overflow is not excluded. */
  readonly overflow: boolean;
}

/**
 * Propagates `blocks` blocks of LANES interleaved boxes through the layers, starting from the
 * workspace's (c, r); returns the pair holding the result. `over[box]` is set when float32
 * overflow is possible.
 */
function propagateBlocks(net: Network, ws: BlockWorkspace, blocks: number, stride: number, over: Uint8Array): [Float64Array, Float64Array] {
  let cc = ws.c;
  let rr = ws.r;
  let nc = ws.tc;
  let nr = ws.tr;
  for (const layer of net.layers) {
    if (layer.kind === 'affine') {
      ws.products(layer, cc, rr, nc, nr, blocks);
      ws.noise(layer, cc, rr, nc, nr, blocks, over);
      const t1 = cc;
      cc = nc;
      nc = t1;
      const t2 = rr;
      rr = nr;
      nr = t2;
    } else if (layer.kind === 'relu') {
      ws.relu(cc, rr, blocks, layer.size * LANES);
    } else {
      smoothStepInPlace(layer.kind, cc, rr, blocks, stride * LANES, layer.size * LANES);
    }
  }
  return [cc, rr];
}

/**
 * Interval bounds of the network's outputs over many boxes, batched in typed arrays.
 *
 * @param net the network (typically a margin network, see marginNetwork)
 * @param lo n × inputSize lower corners in network-input coordinates (not changed)
 * @param hi n × inputSize upper corners
 * @param n number of boxes
 * @param lowerOut n × outputSize: receives lower bounds (−Infinity where overflow is possible)
 * @param upperOut optional n × outputSize: receives upper bounds (+Infinity likewise)
 * @param options.wasm true or false forces the WebAssembly or TypeScript kernels (same results);
 *   by default WebAssembly is used from WASM_MIN_BOXES boxes on, below which setting up its
 *   memory costs more than it saves
 */
export function intervalBounds(net: Network, lo: Float64Array, hi: Float64Array, n: number, lowerOut: Float64Array, upperOut?: Float64Array, options: { readonly wasm?: boolean } = {}): void {
  const stride = maxWidth(net);
  const d = net.inputSize;
  const k = net.outputSize;
  // chunks small enough that the four work arrays stay in cache across the layers
  const blocks = CHUNK_BLOCKS;
  const ws = blockWorkspace(net, blocks, stride, { wasm: options.wasm ?? n >= WASM_MIN_BOXES });
  const over = new Uint8Array(blocks * LANES);
  for (let first = 0; first < n; first += blocks * LANES) {
    const m = Math.min(blocks * LANES, n - first);
    const used = Math.ceil(m / LANES);
    over.fill(0);
    ws.c.fill(0, 0, used * stride * LANES);
    ws.r.fill(0, 0, used * stride * LANES);
    for (let b = 0; b < m; b++) {
      const src = (first + b) * d;
      const at = Math.floor(b / LANES) * stride * LANES + (b % LANES);
      for (let i = 0; i < d; i++) setCentreRadius(ws.c, ws.r, at + i * LANES, lo[src + i]!, hi[src + i]!);
    }
    const [c, r] = propagateBlocks(net, ws, used, stride, over);
    for (let b = 0; b < m; b++) {
      const dst = (first + b) * k;
      const at = Math.floor(b / LANES) * stride * LANES + (b % LANES);
      for (let j = 0; j < k; j++) {
        const cj = c[at + j * LANES]!;
        const rj = r[at + j * LANES]!;
        lowerOut[dst + j] = over[b] ? -Infinity : roundDown(cj - rj);
        if (upperOut) upperOut[dst + j] = over[b] ? Infinity : roundUp(cj + rj);
      }
    }
  }
}

/** Interval bounds of every layer's output for one box, with each affine layer's error bound. */
export function intervalTrace(net: Network, lo: ArrayLike<number>, hi: ArrayLike<number>): IntervalTrace {
  const stride = maxWidth(net);
  let cc = new Float64Array(stride);
  let rr = new Float64Array(stride);
  let nc = new Float64Array(stride);
  let nr = new Float64Array(stride);
  for (let i = 0; i < net.inputSize; i++) setCentreRadius(cc, rr, i, lo[i]!, hi[i]!);
  const trace = { lower: [] as Float64Array[], upper: [] as Float64Array[], noise: [] as Float64Array[] };
  let overflow = false;
  for (const layer of net.layers) {
    let size: number;
    if (layer.kind === 'affine') {
      const noise = new Float64Array(layer.outSize);
      overflow = affineStepSingle(layer, absWeights(layer), cc, rr, nc, nr, noise) || overflow;
      [cc, nc, rr, nr] = [nc, cc, nr, rr];
      trace.noise.push(noise);
      size = layer.outSize;
    } else {
      if (layer.kind === 'relu') reluStepInPlace(cc, rr, 1, stride, layer.size);
      else smoothStepInPlace(layer.kind, cc, rr, 1, stride, layer.size);
      trace.noise.push(new Float64Array(0));
      size = layer.size;
    }
    const lo2 = new Float64Array(size);
    const up2 = new Float64Array(size);
    for (let j = 0; j < size; j++) {
      lo2[j] = roundDown(cc[j]! - rr[j]!);
      up2[j] = roundUp(cc[j]! + rr[j]!);
    }
    trace.lower.push(lo2);
    trace.upper.push(up2);
  }
  return { ...trace, overflow };
}
