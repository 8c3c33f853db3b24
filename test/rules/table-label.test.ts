import { describe, expect, it } from 'vitest';
import { tableLabel } from '../../src/rules/table-label.js';
import type { Rule } from '../../src/types.js';

const rule = (box: [number, number][], allowed: number[]): Rule => ({ id: 'r', box, allowed, origin: { kind: 'mined' } });

describe('tableLabel', () => {
  const rules = [rule([[0, 1], [0, 1]], [2]), rule([[0.5, 2], [0, 1]], [0, 1]), rule([[0, 2], [1, 2]], [3])];
  const points = (...p: number[][]): Float64Array => Float64Array.from(p.flat());

  it('gives the first containing rule in table order, its lowest allowed advisory', () => {
    // (0.7, 0.5) lies in rules 1 and 2: the first wins; (1.5, 0.5) only in rule 2, allowed [0, 1] -> 0
    expect(Array.from(tableLabel(rules, points([0.7, 0.5], [1.5, 0.5], [0.2, 1.5]), 3, 2))).toEqual([2, 0, 3]);
  });

  it('treats boxes as closed', () => {
    // corners and edges belong to the box: (1, 1) is in rule 1; (2, 2) is in rule 3
    expect(Array.from(tableLabel(rules, points([1, 1], [2, 2], [0, 0]), 3, 2))).toEqual([2, 3, 2]);
  });

  it('gives -1 outside every rule and for NaN coordinates', () => {
    expect(Array.from(tableLabel(rules, points([2.5, 0], [-0.1, 0.5], [NaN, 0.5]), 3, 2))).toEqual([-1, -1, -1]);
  });

  it('gives -1 everywhere for an empty table', () => {
    expect(Array.from(tableLabel([], points([0, 0]), 1, 2))).toEqual([-1]);
  });
});
