import { describe, expect, it } from 'vitest';
import { formatNumber } from '../../src/rules/format-number.js';

describe('formatNumber', () => {
  it('prints the shortest decimal that reads back as the same double', () => {
    // ECMA-262 Number::toString: shortest digits that round-trip; 0.1 + 0.2 is not the double 0.3
    expect(formatNumber(0.5)).toBe('0.5');
    expect(formatNumber(112.5)).toBe('112.5');
    expect(formatNumber(0.1 + 0.2)).toBe('0.30000000000000004');
    expect(Number(formatNumber(0.1 + 0.2))).toBe(0.1 + 0.2);
  });

  it('uses exponent form for very small and very large magnitudes', () => {
    // ECMA-262: exponent form below 1e-6 and from 1e21
    expect(formatNumber(1e-7)).toBe('1e-7');
    expect(formatNumber(-2.5e21)).toBe('-2.5e+21');
    expect(formatNumber(0.000001)).toBe('0.000001');
  });

  it('prints negative zero as 0', () => {
    expect(formatNumber(-0)).toBe('0');
  });
});
