import { describe, expect, it } from 'vitest';
import { decideInPlace } from '../../src/model/decide-in-place.js';

function decide(scores: number[], k: number, decision: 'argmax' | 'argmin', outRow = 0) {
  const rows = scores.length / k;
  const advisory = new Int32Array(rows + outRow).fill(-7);
  const margin = new Float32Array(rows + outRow).fill(-7);
  const input = Float32Array.from(scores);
  const bad = decideInPlace(input, rows, k, decision, advisory, margin, outRow);
  return { bad, advisory: Array.from(advisory), margin: Array.from(margin), unchanged: Array.from(input).every((v, i) => Object.is(v, Math.fround(scores[i]!))) };
}

describe('decideInPlace', () => {
  // values are dyadic rationals, exact in float32: margins compare exactly
  it('picks the largest score with ties to the lowest index, margin best − second', () => {
    expect(decide([0.5, 2, 1.5, 4, 4, -1, -3, -2, -2.5], 3, 'argmax')).toMatchObject({ bad: -1, advisory: [1, 0, 1], margin: [0.5, 0, 0.5] });
  });

  it('picks the smallest score with ties to the lowest index, margin second − best', () => {
    expect(decide([0.5, 2, 1.5, -1, 4, -1, -3, -2, -2.5], 3, 'argmin')).toMatchObject({ bad: -1, advisory: [0, 0, 0], margin: [1, 0, 0.5] });
  });

  it('writes from the given output row on and leaves the scores alone', () => {
    expect(decide([1, 0], 2, 'argmax', 2)).toEqual({ bad: -1, advisory: [-7, -7, 0], margin: [-7, -7, 1], unchanged: true });
  });

  it('returns the first row holding NaN or an infinity, in any position', () => {
    expect(decide([1, 0, 0, NaN, 1, 2], 2, 'argmax').bad).toBe(1);
    expect(decide([1, 0, -Infinity, 0], 2, 'argmin').bad).toBe(1);
    expect(decide([Infinity, 0], 2, 'argmax').bad).toBe(0);
  });
});
