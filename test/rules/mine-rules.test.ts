import { describe, expect, it } from 'vitest';
import { mineRules } from '../../src/rules/mine-rules.js';
import { tableLabel } from '../../src/rules/table-label.js';
import type { SampleSet } from '../../src/types.js';
import { irisSamples } from './iris.js';
import { makeInputs, makeTree } from './make-tree.js';

describe('mineRules', () => {
  it('rounds, converts and merges: the iris tree gives three readable rules with rpart fidelity', () => {
    // rpart iris tree (CHECK-VALUES.md): splits 2.45 and 1.75, 6 errors in 150 (144 agree)
    const { x, n, d, labels, inputs } = irisSamples();
    const tree = makeTree({ f: 2, t: 2.45, l: { leaf: 0 }, r: { f: 3, t: 1.75, l: { leaf: 1 }, r: { leaf: 2 } } }, 4, 3);
    const samples: SampleSet = { x, n, d, advisory: labels, margin: new Float32Array(n), seed: 0 };
    const rules = mineRules(tree, samples, inputs, { roundingTolerance: 0 });
    // 2.45 -> 2 moves no sample (setosa petal length <= 1.9, others >= 3). 1.75: 2 and 1.5 cost
    // samples; at step 0.2, 1.8 would move the twelve width-1.8 flowers (11 virginica) left;
    // 1.6 moves the two width-1.7 flowers (one versicolor, one virginica) right: net loss 0.
    expect(rules.map((r) => [r.id, r.allowed[0], r.box[2], r.box[3]])).toEqual([
      ['R1', 0, [1, 2], [0.1, 2.5]],
      ['R2', 1, [2, 6.9], [0.1, 1.6]],
      ['R3', 2, [2, 6.9], [1.6, 2.5]],
    ]);
    const table = tableLabel(rules, x, n, d);
    let agree = 0;
    for (let i = 0; i < n; i++) agree += table[i] === labels[i] ? 1 : 0;
    expect(agree).toBe(144);
  });

  it('merges leaves of one advisory that the tree split apart', () => {
    const inputs = makeInputs([[0, 10]]);
    const tree = makeTree({ f: 0, t: 4, l: { leaf: 1 }, r: { f: 0, t: 7, l: { leaf: 1 }, r: { leaf: 0 } } }, 1, 2);
    const samples: SampleSet = { x: new Float64Array([1, 5, 8]), n: 3, d: 1, advisory: new Int32Array([1, 1, 0]), margin: new Float32Array(3), seed: 0 };
    expect(mineRules(tree, samples, inputs, { round: false }).map((r) => [r.box[0], r.allowed])).toEqual([
      [[7, 10], [0]],
      [[0, 7], [1]],
    ]);
    expect(mineRules(tree, samples, inputs, { round: false, merge: false })).toHaveLength(3);
  });
});
