import type { LabelledData } from './labelled-data.js';
import type { ResolvedLearnOptions } from './learn-options.js';
import { presort } from './presort.js';

/**
 * The working buffers of one tree growth, allocated once. A node owns one segment
 * [start, end) of every input's sorted row list in `order`; its two children own the two
 * halves of that segment after a stable partition, so every input stays sorted in every node.
 * Node arrays have room for the largest tree the options allow: at most
 * L = min(maxLeaves, floor(n / minLeaf)) leaves, so 2L - 1 nodes.
 */
export interface GrowState {
  readonly n: number;
  readonly d: number;
  readonly classes: number;
  /** Row weights, or null when every row weighs 1. */
  readonly weights: Float64Array | null;
  /** d × n sorted row lists (see presort). */
  readonly order: Int32Array;
  /** d × n: `vals[f*n + p]` is input f of row `order[f*n + p]`, so scans read memory in order. */
  readonly vals: Float64Array;
  /** d × n: `labs[f*n + p]` is the label of row `order[f*n + p]`. */
  readonly labs: Int32Array;
  /** Per row: 1 when it goes to the left child of the node being split. */
  readonly goLeft: Uint8Array;
  /** Scratch of n entries for the stable partition. */
  readonly scratchRow: Int32Array;
  readonly scratchVal: Float64Array;
  readonly scratchLab: Int32Array;
  /** Per class: running left-child weight during a scan. */
  readonly leftCounts: Float64Array;
  readonly options: ResolvedLearnOptions;
  /** Total training weight: p(t) = node weight / rootWeight. */
  readonly rootWeight: number;
  readonly start: Int32Array;
  readonly end: Int32Array;
  readonly depth: Int32Array;
  readonly feature: Int32Array;
  readonly threshold: Float64Array;
  readonly left: Int32Array;
  readonly right: Int32Array;
  /** capacity × classes class weights per node. */
  readonly counts: Float64Array;
  readonly label: Int32Array;
  /** Best split found for a node not yet split: input (-1: none), first right position, threshold, p(t)·Δi. */
  readonly candFeature: Int32Array;
  readonly candPos: Int32Array;
  readonly candThreshold: Float64Array;
  readonly candGain: Float64Array;
  nodeCount: number;
}

/**
 * Allocates the buffers and presorts every input: O(d · n).
 * @param data checked labelled data (see checkLabelledData); not changed
 */
export function createGrowState(data: LabelledData, options: ResolvedLearnOptions): GrowState {
  const { n, d, classes, x } = data;
  const cols = new Float64Array(n * d);
  for (let i = 0; i < n; i++) {
    for (let f = 0; f < d; f++) cols[f * n + i] = x[i * d + f];
  }
  const order = presort(cols, n, d);
  const vals = new Float64Array(n * d);
  const labs = new Int32Array(n * d);
  for (let p = 0; p < n * d; p++) {
    const i = order[p];
    vals[p] = cols[p - (p % n) + i];
    labs[p] = data.labels[i];
  }
  const weights = data.weights ?? null;
  let rootWeight = n;
  if (weights !== null) {
    rootWeight = 0;
    for (let i = 0; i < n; i++) rootWeight += weights[i];
  }
  const leaves = Math.max(1, Math.min(options.maxLeaves, Math.floor(n / options.minLeaf)));
  const cap = 2 * leaves - 1;
  return {
    n,
    d,
    classes,
    weights,
    order,
    vals,
    labs,
    goLeft: new Uint8Array(n),
    scratchRow: new Int32Array(n),
    scratchVal: new Float64Array(n),
    scratchLab: new Int32Array(n),
    leftCounts: new Float64Array(classes),
    options,
    rootWeight,
    start: new Int32Array(cap),
    end: new Int32Array(cap),
    depth: new Int32Array(cap),
    feature: new Int32Array(cap).fill(-1),
    threshold: new Float64Array(cap),
    left: new Int32Array(cap).fill(-1),
    right: new Int32Array(cap).fill(-1),
    counts: new Float64Array(cap * classes),
    label: new Int32Array(cap),
    candFeature: new Int32Array(cap).fill(-1),
    candPos: new Int32Array(cap),
    candThreshold: new Float64Array(cap),
    candGain: new Float64Array(cap),
    nodeCount: 0,
  };
}
