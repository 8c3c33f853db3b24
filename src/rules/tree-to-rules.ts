import { ToolError } from '../errors.js';
import type { InputSpec, Rule, Tree } from '../types.js';
import { sortRules } from './sort-rules.js';

export interface TreeToRulesOptions {
  /** Prefix of the generated ids (`R` gives R1, R2, …). */
  readonly idPrefix?: string;
}

/**
 * Turns each leaf of a decision tree into a rule: the leaf's region is the intersection of the
 * half-spaces on its path (`x[f] <= t` to the left, `x[f] > t` to the right) with the input
 * domain, written as a closed box; inputs the path does not test keep their full [min, max].
 * The rule allows exactly the leaf's label.
 *
 * Closed boxes: a point lying exactly on a threshold belongs to the boxes on both sides. That set
 * has zero volume; where it matters (`tableLabel`) the first rule in table order wins.
 * A leaf whose region has no volume inside the domain (a threshold at or beyond a domain edge)
 * is dropped: its points lie in the closure of the other leaves, so the boxes still cover the
 * whole domain. An input with min = max has zero width everywhere and never causes a drop.
 *
 * Order and ids: `sortRules` order (by advisory, then lower corner, then upper corner), ids
 * R1, R2, … in that order, so the result depends only on the tree's regions and labels.
 *
 * @param tree a CART tree over the scenario's inputs (tree.d = inputs.length)
 * @param inputs the scenario's inputs (domain bounds in units)
 * @throws ToolError `RULES_TREE_SHAPE` when the tree does not match the inputs
 * Cost: O(nodes · d).
 */
export function treeToRules(tree: Tree, inputs: readonly InputSpec[], options: TreeToRulesOptions = {}): Rule[] {
  const d = inputs.length;
  if (tree.d !== d) {
    throw new ToolError('RULES_TREE_SHAPE', `tree has ${tree.d} inputs, scenario has ${d}`);
  }
  const rules: Rule[] = [];
  if (tree.nodeCount === 0) return rules;
  const rootLo = new Float64Array(d);
  const rootHi = new Float64Array(d);
  for (let f = 0; f < d; f++) {
    rootLo[f] = inputs[f]!.min;
    rootHi[f] = inputs[f]!.max;
  }
  const stack: { node: number; lo: Float64Array; hi: Float64Array }[] = [{ node: 0, lo: rootLo, hi: rootHi }];
  while (stack.length > 0) {
    const { node, lo, hi } = stack.pop()!;
    const f = tree.feature[node]!;
    if (f < 0) {
      if (hasVolume(lo, hi, inputs)) {
        const box = Array.from(lo, (l, i) => [l, hi[i]!] as const);
        rules.push({ id: '', box, allowed: [tree.label[node]!], origin: { kind: 'mined' } });
      }
      continue;
    }
    if (f >= d) throw new ToolError('RULES_TREE_SHAPE', `node ${node} splits on input ${f}, scenario has ${d}`);
    const t = tree.threshold[node]!;
    const leftHi = hi.slice();
    leftHi[f] = Math.min(hi[f]!, t);
    const rightLo = lo.slice();
    rightLo[f] = Math.max(lo[f]!, t);
    // right pushed first so the left child is visited first (preorder)
    stack.push({ node: tree.right[node]!, lo: rightLo, hi });
    stack.push({ node: tree.left[node]!, lo, hi: leftHi });
  }
  const prefix = options.idPrefix ?? 'R';
  return sortRules(rules).map((r, i) => ({ ...r, id: `${prefix}${i + 1}` }));
}

/** True when every interval is non-empty and has positive width where the domain does. */
function hasVolume(lo: Float64Array, hi: Float64Array, inputs: readonly InputSpec[]): boolean {
  for (let f = 0; f < lo.length; f++) {
    if (lo[f]! > hi[f]!) return false;
    if (lo[f] === hi[f] && inputs[f]!.min < inputs[f]!.max) return false;
  }
  return true;
}
