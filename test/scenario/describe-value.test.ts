import { describe, expect, it } from 'vitest';
import { describeValue } from '../../src/scenario/describe-value.js';

describe('describeValue', () => {
  it('names the JSON type and shows short values', () => {
    expect([null, true, 0, '5', [1, 2], {}].map(describeValue)).toEqual([
      'null',
      'true',
      'number 0',
      'string "5"',
      'an array of 2',
      'an object',
    ]);
  });

  it('shortens long strings', () => {
    expect(describeValue('x'.repeat(100))).toBe(`string "${'x'.repeat(37)}..."`);
  });
});
