import { describe, expect, it } from 'vitest';
import { jsonRead } from '../../src/scenario/json-read.js';

// Reference: JSON.parse (the platform's RFC 8259 reader) must agree on every valid text.
const VALID = [
  '{"a": 1, "b": [true, false, null], "c": {"d": "e\\u00e9\\n\\"q\\""}}',
  '[-0.5e-3, 12, 1E+2, 0, -0]',
  '  "just a string"  ',
  '{"x": 1e999}',
  '{}',
  '[]',
];

describe('jsonRead', () => {
  it('reads valid JSON to the same value as JSON.parse', () => {
    for (const text of VALID) {
      const r = jsonRead(text);
      expect(r.ok).toBe(true);
      if (r.ok) expect(JSON.stringify(r.value)).toBe(JSON.stringify(JSON.parse(text)));
    }
  });

  it('reads 1e999 as Infinity, as JSON.parse does, leaving the refusal to the validator', () => {
    const r = jsonRead('{"x": 1e999}');
    expect(r.ok && (r.value as { x: number }).x).toBe(Infinity);
  });

  it('gives the line and column of a missing comma, counting CRLF as one line break', () => {
    const r = jsonRead('{\r\n  "a": 1\r\n  "b": 2\r\n}');
    expect(r).toEqual({ ok: false, line: 3, column: 3, message: `expected ',' or '}' after a field value, found '"'` });
  });

  it('reports a trailing comma at the closing brace', () => {
    expect(jsonRead('{"a": 1,\n}')).toEqual({
      ok: false,
      line: 2,
      column: 1,
      message: `expected a double-quoted field name, found '}'`,
    });
  });

  it('reports the end of file when the text stops early', () => {
    const r = jsonRead('{"a": [1, 2');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toBe(`expected ',' or ']' after an array element, found end of file`);
  });

  it('refuses words that are not JSON, such as NaN, and single quotes', () => {
    expect(jsonRead('{"a": NaN}').ok).toBe(false);
    expect(jsonRead("{'a': 1}").ok).toBe(false);
  });

  it('lists a repeated key with its path and position instead of keeping the last silently', () => {
    const r = jsonRead('{"inputs": [{"min": 0,\n "min": 1}]}');
    expect(r.ok && r.duplicates).toEqual([{ path: 'inputs[0].min', line: 2, column: 2 }]);
  });

  it('treats __proto__ as an ordinary key', () => {
    const r = jsonRead('{"__proto__": 1}');
    expect(r.ok && Object.keys(r.value as object)).toEqual(['__proto__']);
  });

  it('refuses nesting deeper than 64 levels instead of overflowing the stack', () => {
    const r = jsonRead('['.repeat(100000));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toBe('nesting deeper than 64 levels');
  });
});
