import { describe, expect, it } from 'vitest';
import { smtDecimal, smtlibRule, smtSymbol } from '../../src/report/export/index.js';
import { CAUTIONS } from '../../src/report/index.js';
import type { RuleTable } from '../../src/types.js';
import { fixtureTable } from '../browser/report-fixture.js';

type SExpr = string | SExpr[];

/**
 * A small reader for the SMT-LIB 2.6 concrete syntax used here (SMT-LIB Standard v2.6, §3.1):
 * `;` comments to the end of the line, parentheses, `|quoted symbols|`, and tokens separated by
 * white space. Returns the top-level expressions; throws on unbalanced parentheses.
 */
function readSExprs(text: string): SExpr[] {
  const stack: SExpr[][] = [[]];
  let i = 0;
  while (i < text.length) {
    const c = text[i]!;
    if (c === ';') {
      while (i < text.length && text[i] !== '\n') i++;
    } else if (c === '(') {
      stack.push([]);
      i++;
    } else if (c === ')') {
      const done = stack.pop();
      if (!done || stack.length === 0) throw new Error(`unbalanced ')' at ${i}`);
      stack[stack.length - 1]!.push(done);
      i++;
    } else if (/\s/.test(c)) {
      i++;
    } else if (c === '|') {
      const end = text.indexOf('|', i + 1);
      if (end < 0) throw new Error(`unterminated quoted symbol at ${i}`);
      stack[stack.length - 1]!.push(text.slice(i, end + 1));
      i = end + 1;
    } else {
      let j = i;
      while (j < text.length && !/[\s();|]/.test(text[j]!)) j++;
      stack[stack.length - 1]!.push(text.slice(i, j));
      i = j;
    }
  }
  if (stack.length !== 1) throw new Error('unbalanced (');
  return stack[0]!;
}

/** A Real term written by smtDecimal, read back: `d` or `(- d)`. */
function realValue(t: SExpr): number {
  if (typeof t === 'string') {
    expect(t).toMatch(/^\d+\.\d+$/); // SMT-LIB <decimal>: digits, point, digits
    return Number(t);
  }
  expect(t[0]).toBe('-');
  expect(t).toHaveLength(2);
  return -realValue(t[1]!);
}

const asserts = (e: SExpr[]): SExpr[] => e.filter((x): x is SExpr[] => Array.isArray(x) && x[0] === 'assert').map((x) => x[1]!);

/** The box a query asserts, read back per input symbol: `(and (<= lo x) (<= x hi) ...)`. */
function assertedBox(e: SExpr[], table: RuleTable): Array<[number, number]> {
  const box = asserts(e)[0] as SExpr[];
  expect(box[0]).toBe('and');
  const terms = box.slice(1) as SExpr[][];
  expect(terms).toHaveLength(2 * table.inputs.length);
  return table.inputs.map((inp, i) => {
    const lo = terms[2 * i]!;
    const hi = terms[2 * i + 1]!;
    expect([lo[0], lo[2], hi[0], hi[1]]).toEqual(['<=', inp.name, '<=', inp.name]);
    return [realValue(lo[1]!), realValue(hi[2]!)];
  });
}

describe('smtlibRule', () => {
  const table = fixtureTable();

  it('parses as balanced s-expressions with the standard commands in order', () => {
    for (let r = 0; r < table.rules.length; r++) {
      const e = readSExprs(smtlibRule(table, r));
      const heads = e.map((x) => (Array.isArray(x) ? x[0] : x));
      expect(heads).toEqual(['set-info', 'set-logic', ...new Array(6).fill('declare-const'), 'assert', 'assert', 'check-sat', 'exit']);
      expect(e[1]).toEqual(['set-logic', 'QF_LRA']);
    }
  });

  it('declares every input and every advisory score as a Real', () => {
    const e = readSExprs(smtlibRule(table, 0));
    const decls = e.filter((x): x is SExpr[] => Array.isArray(x) && x[0] === 'declare-const');
    expect(decls).toEqual([
      ['declare-const', 'range_m', 'Real'],
      ['declare-const', 'lateral_m', 'Real'],
      ['declare-const', 'climb_mps', 'Real'],
      ['declare-const', 'score.go_left', 'Real'],
      ['declare-const', 'score.go_right', 'Real'],
      ['declare-const', 'score.climb', 'Real'],
    ]);
  });

  it('asserts exactly the box of the rule table', () => {
    for (let r = 0; r < table.rules.length; r++) {
      expect(assertedBox(readSExprs(smtlibRule(table, r)), table)).toEqual(table.rules[r]!.rule.box);
    }
  });

  it('asserts the negation of argmax: some disallowed score at least every allowed one', () => {
    // R1 allows go_left only: it fails when go_right or climb scores >= go_left
    expect(asserts(readSExprs(smtlibRule(table, 0)))[1]).toEqual([
      'or',
      ['>=', 'score.go_right', 'score.go_left'],
      ['>=', 'score.climb', 'score.go_left'],
    ]);
    // R4 allows go_left or go_right: it fails when climb is >= both
    expect(asserts(readSExprs(smtlibRule(table, 3)))[1]).toEqual(['and', ['>=', 'score.climb', 'score.go_left'], ['>=', 'score.climb', 'score.go_right']]);
  });

  it('reverses the comparison for argmin', () => {
    const t = fixtureTable('argmin');
    expect(asserts(readSExprs(smtlibRule(t, 3)))[1]).toEqual(['and', ['<=', 'score.climb', 'score.go_left'], ['<=', 'score.climb', 'score.go_right']]);
  });

  it('asserts false when every advisory is allowed (the rule cannot fail)', () => {
    const base = fixtureTable();
    const t = { ...base, rules: [{ ...base.rules[0]!, rule: { ...base.rules[0]!.rule, allowed: [0, 1, 2] } }] };
    expect(asserts(readSExprs(smtlibRule(t, 0)))[1]).toBe('false');
  });

  it('carries the model hash, every caution and the note that the network is not encoded, in comments', () => {
    const text = smtlibRule(table, 1);
    const comments = text.split('\n').filter((l) => l.startsWith(';')).join('\n');
    expect(comments).toContain(`; model SHA-256: ${table.manifest.model.sha256}`);
    for (const c of CAUTIONS) expect(comments).toContain(`; - ${c}`);
    expect(comments).toContain('THE NETWORK IS NOT ENCODED IN THIS FILE');
  });
});

describe('smtDecimal', () => {
  it('writes SMT-LIB decimals that read back as the same float64', () => {
    const values = [0, 1, 0.5, 0.1, 112.5, 1e-7, 2.5e-12, 1.5e21, 123456789012345680000, 5e-324, 1.7976931348623157e308, 0.30000000000000004];
    for (const v of values) {
      const s = smtDecimal(v);
      expect(s).toMatch(/^\d+\.\d+$/);
      expect(Number(s), s).toBe(v);
      expect(realValue(readSExprs(smtDecimal(-v || -1))[0]!)).toBe(-v || -1);
    }
    expect(smtDecimal(1e-7)).toBe('0.0000001');
    expect(smtDecimal(-6)).toBe('(- 6.0)');
    expect(smtDecimal(1.5e21)).toBe('1500000000000000000000.0');
  });
});

describe('smtSymbol', () => {
  it('quotes names that SMT-LIB already uses and leaves others bare', () => {
    expect(smtSymbol('cpa_nm')).toBe('cpa_nm');
    expect(smtSymbol('abs')).toBe('|abs|');
    expect(smtSymbol('let')).toBe('|let|');
    expect(smtSymbol('2x')).toBe('|2x|');
  });
});
