import type { Layer } from './network.js';
import { type AffineDraft, affineDraft, composeAffine, finishAffine } from './affine.js';
import { FLOAT32_UNDERFLOW, gamma } from './float-error.js';

/**
 * Collects the layers of a chain network while the ONNX graph is walked: affine steps are
 * fused until an activation (or the end) flushes them.
 */
export class ChainBuilder {
  private readonly layers: Layer[] = [];
  private pending: AffineDraft | null = null;
  /** Width of the current value; undefined until known. */
  width: number | undefined;

  constructor(width: number | undefined) {
    this.width = width;
  }

  /** Appends an affine step; returns a reason when its input width does not match. */
  affine(draft: AffineDraft): string | null {
    if (this.width !== undefined && draft.inSize !== this.width) {
      return `expects ${draft.inSize} inputs, found ${this.width}`;
    }
    this.pending = this.pending ? composeAffine(this.pending, draft) : draft;
    this.width = draft.outSize;
    return null;
  }

  /** Appends an activation over the current width. */
  activation(kind: 'relu' | 'sigmoid' | 'tanh', node: string): string | null {
    if (this.width === undefined) return 'the input width is unknown before this activation';
    this.flush();
    this.layers.push({ kind, size: this.width, nodes: [node] });
    return null;
  }

  /**
   * LeakyRelu(z) = relu(z) − α·relu(−z), exact for every α. The runtime's float32 product α·z
   * errs by at most u|α||z|, charged to the affine step after the ReLU.
   */
  leakyRelu(alpha: number, node: string): string | null {
    const n = this.width;
    if (n === undefined) return 'the input width is unknown before this activation';
    const split = new Float64Array(2 * n * n);
    const merge = new Float64Array(n * 2 * n);
    for (let j = 0; j < n; j++) {
      split[j * n + j] = 1;
      split[(n + j) * n + j] = -1;
      merge[j * 2 * n + j] = 1;
      merge[j * 2 * n + n + j] = -alpha;
    }
    const zeros2n = new Float64Array(2 * n);
    this.affine(affineDraft(n, 2 * n, split, zeros2n, new Float64Array(2 * n * n), zeros2n, [node]));
    this.activation('relu', node);
    // the runtime's α·z errs by u|α||z|: charged to the relu(−z) input of each output
    const err = new Float64Array(n * 2 * n);
    for (let j = 0; j < n; j++) err[j * 2 * n + n + j] = gamma(1) * Math.abs(alpha);
    const konst = new Float64Array(n).fill(FLOAT32_UNDERFLOW);
    return this.affine(affineDraft(2 * n, n, merge, new Float64Array(n), err, konst, [node]));
  }

  /**
   * Clip(z, lo, hi) = lo + relu(z − lo) − relu(z − hi) for lo ≤ hi; one-sided forms
   * max(z, lo) = lo + relu(z − lo) and min(z, hi) = hi − relu(hi − z). Exact (Clip is exact in
   * floating point too), so no error is charged beyond the noise floor.
   */
  clip(lo: number | undefined, hi: number | undefined, node: string): string | null {
    const n = this.width;
    if (n === undefined) return 'the input width is unknown before this activation';
    if (lo === undefined && hi === undefined) return null;
    if (lo !== undefined && hi !== undefined && lo > hi) return `min ${lo} is above max ${hi}`;
    const parts: { sign: number; at: number }[] = [];
    if (lo !== undefined) parts.push({ sign: 1, at: lo });
    if (hi !== undefined) parts.push({ sign: lo === undefined ? -1 : 1, at: hi });
    const m = parts.length;
    const split = new Float64Array(m * n * n);
    const splitBias = new Float64Array(m * n);
    const merge = new Float64Array(n * m * n);
    const mergeBias = new Float64Array(n).fill(lo ?? hi!);
    parts.forEach((p, q) => {
      for (let j = 0; j < n; j++) {
        split[(q * n + j) * n + j] = p.sign;
        splitBias[q * n + j] = -p.sign * p.at;
        // first part adds, a second part (the upper kink of a two-sided clip) subtracts
        merge[j * m * n + q * n + j] = q === 0 ? p.sign : -1;
      }
    });
    this.affine(affineDraft(n, m * n, split, splitBias, new Float64Array(m * n * n), new Float64Array(m * n), [node]));
    this.activation('relu', node);
    return this.affine(affineDraft(m * n, n, merge, mergeBias, new Float64Array(n * m * n), new Float64Array(n), [node]));
  }

  private flush(): void {
    if (this.pending) this.layers.push(finishAffine(this.pending));
    this.pending = null;
  }

  /** The finished layer list. */
  finish(): Layer[] {
    this.flush();
    return [...this.layers];
  }
}
