/**
 * A binary max-heap of node indices keyed by `key[node]`; equal keys pop the lowest node index
 * first, so best-first growth is deterministic. Fixed capacity, no allocation after creation.
 */
export class NodeHeap {
  private readonly heap: Int32Array;
  private readonly key: Float64Array;
  private size = 0;

  constructor(capacity: number, key: Float64Array) {
    this.heap = new Int32Array(Math.max(1, capacity));
    this.key = key;
  }

  get length(): number {
    return this.size;
  }

  private before(a: number, b: number): boolean {
    const ka = this.key[a]!;
    const kb = this.key[b]!;
    return ka > kb || (ka === kb && a < b);
  }

  push(node: number): void {
    const h = this.heap;
    let i = this.size++;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (!this.before(node, h[parent]!)) break;
      h[i] = h[parent]!;
      i = parent;
    }
    h[i] = node;
  }

  /** Removes and returns the node with the largest key; -1 when empty. */
  pop(): number {
    const h = this.heap;
    if (this.size === 0) return -1;
    const top = h[0]!;
    const last = h[--this.size]!;
    let i = 0;
    for (;;) {
      let c = 2 * i + 1;
      if (c >= this.size) break;
      if (c + 1 < this.size && this.before(h[c + 1]!, h[c]!)) c++;
      if (!this.before(h[c]!, last)) break;
      h[i] = h[c]!;
      i = c;
    }
    h[i] = last;
    return top;
  }
}
