import { describe, expect, it } from 'vitest';
import { checkBox, checkCount, checkRoom } from '../../src/sampling/check-box.js';

describe('checkBox, checkCount, checkRoom', () => {
  it('accept good boxes, counts and output ranges', () => {
    expect(() => checkBox([[0, 1], [2, 2]], 'here')).not.toThrow();
    expect(() => checkCount(0, 'here')).not.toThrow();
    expect(() => checkRoom(new Float64Array(6), 1, 2, 2, 'here')).not.toThrow();
  });

  it('name the place, what was found and what was expected', () => {
    expect(() => checkBox([], 'here')).toThrowErrorMatchingInlineSnapshot(`[ToolError: here: expected a box with at least one axis, found none]`);
    expect(() => checkBox([[0, Number.NaN]], 'here')).toThrowErrorMatchingInlineSnapshot(`[ToolError: here: box[0]: expected finite min <= max, found [0, NaN]]`);
    expect(() => checkCount(-1, 'here')).toThrowErrorMatchingInlineSnapshot(`[ToolError: here: expected a whole number of points >= 0, found -1]`);
    expect(() => checkRoom(new Float64Array(6), 2, 2, 2, 'here')).toThrowErrorMatchingInlineSnapshot(`[ToolError: here: expected room for 2 rows from row 2, found 3 rows]`);
  });
});
