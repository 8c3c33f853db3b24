import type { InputSpec, Tree } from '../../src/types.js';

/** A tree written as nested literals: a split `{ f, t, l, r }` or a leaf `{ leaf: label }`. */
export type TreeSpec = { readonly f: number; readonly t: number; readonly l: TreeSpec; readonly r: TreeSpec } | { readonly leaf: number };

/**
 * Builds a `Tree` from a literal, numbering nodes in preorder (root 0). Counts are left at zero
 * except that each leaf counts one sample of its label, so labels are the majority as documented.
 */
export function makeTree(spec: TreeSpec, d: number, classes: number): Tree {
  const feature: number[] = [];
  const threshold: number[] = [];
  const left: number[] = [];
  const right: number[] = [];
  const label: number[] = [];
  const visit = (s: TreeSpec): number => {
    const i = feature.length;
    feature.push(-1);
    threshold.push(0);
    left.push(-1);
    right.push(-1);
    label.push(0);
    if ('leaf' in s) {
      label[i] = s.leaf;
      return i;
    }
    feature[i] = s.f;
    threshold[i] = s.t;
    left[i] = visit(s.l);
    right[i] = visit(s.r);
    label[i] = label[left[i]!]!;
    return i;
  };
  visit(spec);
  const counts = new Float64Array(feature.length * classes);
  feature.forEach((f, i) => {
    if (f < 0) counts[i * classes + label[i]!] = 1;
  });
  return {
    d,
    classes,
    nodeCount: feature.length,
    feature: Int32Array.from(feature),
    threshold: Float64Array.from(threshold),
    left: Int32Array.from(left),
    right: Int32Array.from(right),
    counts,
    label: Int32Array.from(label),
  };
}

/** Inputs named x0, x1, … with the given [min, max] ranges and no unit. */
export function makeInputs(ranges: readonly (readonly [number, number])[]): InputSpec[] {
  return ranges.map(([min, max], i) => ({ name: `x${i}`, unit: '', min, max, description: '' }));
}

/** The leaf label the tree gives each row of x (plain routing, for reference checks). */
export function predict(tree: Tree, x: Float64Array, n: number): Int32Array {
  const out = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    let node = 0;
    while (tree.feature[node]! >= 0) {
      node = x[i * tree.d + tree.feature[node]!]! <= tree.threshold[node]! ? tree.left[node]! : tree.right[node]!;
    }
    out[i] = tree.label[node]!;
  }
  return out;
}

/** A deep copy of a tree's arrays, to show a function left its input unchanged. */
export function cloneTree(tree: Tree): Tree {
  return {
    ...tree,
    feature: tree.feature.slice(),
    threshold: tree.threshold.slice(),
    left: tree.left.slice(),
    right: tree.right.slice(),
    counts: tree.counts.slice(),
    label: tree.label.slice(),
  };
}
