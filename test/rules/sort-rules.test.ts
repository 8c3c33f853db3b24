import { describe, expect, it } from 'vitest';
import { sortRules } from '../../src/rules/sort-rules.js';
import type { Rule } from '../../src/types.js';

const rule = (id: string, box: [number, number][], allowed: number[]): Rule => ({ id, box, allowed, origin: { kind: 'mined' } });

describe('sortRules', () => {
  it('orders by allowed advisories, then lower corner, then upper corner, ignoring ids', () => {
    const rules = [
      rule('a', [[0, 1], [0, 1]], [1]),
      rule('b', [[0, 1], [0, 2]], [0]),
      rule('c', [[0, 1], [0, 1]], [0]),
      rule('d', [[0, 1], [0, 1]], [0, 2]),
      rule('e', [[-1, 1], [5, 6]], [0]),
    ];
    expect(sortRules(rules).map((r) => r.id)).toEqual(['e', 'c', 'b', 'd', 'a']);
  });

  it('returns a new array and leaves the input order alone', () => {
    const rules = Object.freeze([rule('x', [[1, 2]], [1]), rule('y', [[0, 1]], [1])]);
    expect(sortRules(rules).map((r) => r.id)).toEqual(['y', 'x']);
    expect(rules.map((r) => r.id)).toEqual(['x', 'y']);
  });
});
