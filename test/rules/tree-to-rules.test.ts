import { describe, expect, it } from 'vitest';
import { tableLabel } from '../../src/rules/table-label.js';
import { treeToRules } from '../../src/rules/tree-to-rules.js';
import { irisSamples } from './iris.js';
import { cloneTree, makeInputs, makeTree } from './make-tree.js';

describe('treeToRules', () => {
  const inputs = makeInputs([
    [0, 10],
    [0, 4],
  ]);
  // x0 <= 3 -> 0; else x1 <= 1 -> 1; else 2
  const tree = makeTree({ f: 0, t: 3, l: { leaf: 0 }, r: { f: 1, t: 1, l: { leaf: 1 }, r: { leaf: 2 } } }, 2, 3);

  it('turns each leaf into the closed box of its path, untested inputs at full range', () => {
    expect(treeToRules(tree, inputs)).toEqual([
      { id: 'R1', box: [[0, 3], [0, 4]], allowed: [0], origin: { kind: 'mined' } },
      { id: 'R2', box: [[3, 10], [0, 1]], allowed: [1], origin: { kind: 'mined' } },
      { id: 'R3', box: [[3, 10], [1, 4]], allowed: [2], origin: { kind: 'mined' } },
    ]);
  });

  it('orders by advisory, then by lower corner, whatever the tree order', () => {
    // leaves in tree order: [5,10]x[0,4] (label 1), [0,5]x[2,4] (label 0), [0,5]x[0,2] (label 1)
    const t = makeTree({ f: 0, t: 5, l: { f: 1, t: 2, l: { leaf: 1 }, r: { leaf: 0 } }, r: { leaf: 1 } }, 2, 2);
    expect(treeToRules(t, inputs).map((r) => [r.id, r.allowed[0], r.box])).toEqual([
      ['R1', 0, [[0, 5], [2, 4]]],
      ['R2', 1, [[0, 5], [0, 2]]],
      ['R3', 1, [[5, 10], [0, 4]]],
    ]);
  });

  it('tightens an interval tested twice on one path', () => {
    const t = makeTree({ f: 0, t: 8, l: { f: 0, t: 2, l: { leaf: 0 }, r: { leaf: 1 } }, r: { leaf: 0 } }, 2, 2);
    const boxes = treeToRules(t, inputs).map((r) => r.box[0]);
    expect(boxes).toEqual([[0, 2], [8, 10], [2, 8]]);
  });

  it('drops a leaf with no volume inside the domain', () => {
    // threshold at the domain minimum: the left leaf is the plane x0 = 0; one beyond the maximum
    const t = makeTree({ f: 0, t: 0, l: { leaf: 1 }, r: { f: 1, t: 9, l: { leaf: 0 }, r: { leaf: 1 } } }, 2, 2);
    expect(treeToRules(t, inputs)).toEqual([{ id: 'R1', box: [[0, 10], [0, 4]], allowed: [0], origin: { kind: 'mined' } }]);
  });

  it('keeps leaves on an input whose domain is a single value', () => {
    const flat = makeInputs([
      [0, 10],
      [2, 2],
    ]);
    expect(treeToRules(tree, flat).map((r) => r.box)).toEqual([
      [[0, 3], [2, 2]],
      [[3, 10], [2, 2]],
    ]);
  });

  it('gives a single-leaf tree one unconditional rule', () => {
    expect(treeToRules(makeTree({ leaf: 2 }, 2, 3), inputs)).toEqual([
      { id: 'R1', box: [[0, 10], [0, 4]], allowed: [2], origin: { kind: 'mined' } },
    ]);
  });

  it('uses the id prefix given', () => {
    expect(treeToRules(tree, inputs, { idPrefix: 'M' }).map((r) => r.id)).toEqual(['M1', 'M2', 'M3']);
  });

  it('leaves the tree unchanged', () => {
    const before = cloneTree(tree);
    treeToRules(tree, inputs);
    expect(tree).toEqual(before);
  });

  it('refuses a tree over a different number of inputs', () => {
    expect(() => treeToRules(tree, makeInputs([[0, 1]]))).toThrowErrorMatchingInlineSnapshot(`[ToolError: tree has 2 inputs, scenario has 1]`);
  });

  it('reproduces the published rpart iris tree: 6 errors in 150', () => {
    // rpart on iris (CHECK-VALUES.md, "rpart ... on iris"): Petal.Length < 2.45 -> setosa (50, 0 errors);
    // else Petal.Width < 1.75 -> versicolor (54 cases, 5 errors), else virginica (46 cases, 1 error).
    // No iris value equals 2.45 or 1.75 (data have one decimal), so < and <= split alike.
    const { x, n, d, labels, inputs: irisInputs } = irisSamples();
    const t = makeTree({ f: 2, t: 2.45, l: { leaf: 0 }, r: { f: 3, t: 1.75, l: { leaf: 1 }, r: { leaf: 2 } } }, 4, 3);
    const rules = treeToRules(t, irisInputs);
    const table = tableLabel(rules, x, n, d);
    const cases = [0, 0, 0];
    const errors = [0, 0, 0];
    for (let i = 0; i < n; i++) {
      cases[table[i]!]!++;
      if (table[i] !== labels[i]) errors[table[i]!]!++;
    }
    expect(cases).toEqual([50, 54, 46]);
    expect(errors).toEqual([0, 5, 1]);
  });
});
