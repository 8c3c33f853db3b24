import { tokenizeRuleLine, type Token } from './rule-tokens.js';

/** A value with the 1-based column where it was written. */
export interface Located<T> {
  readonly value: T;
  readonly column: number;
}

/** One condition as written: bounds on a named input (a missing side is unbounded). */
export interface RawCondition {
  readonly column: number;
  readonly name: Located<string>;
  readonly lower?: Located<number>;
  readonly upper?: Located<number>;
}

/** One rule as written, names not yet checked against the scenario. */
export interface RawRule {
  readonly id?: Located<string>;
  readonly conditions: readonly RawCondition[];
  /** `expect not a and not b`: every advisory except the listed ones. */
  readonly negated: boolean;
  readonly advisories: readonly Located<string>[];
}

export type ParsedLine =
  | { readonly kind: 'blank' }
  | { readonly kind: 'rule'; readonly rule: RawRule }
  | { readonly kind: 'error'; readonly column: number; readonly message: string };

/** Thrown inside this module only, to stop at the first syntax error of a line. */
class LineError {
  constructor(readonly column: number, readonly message: string) {}
}

const KEYWORDS = new Set(['when', 'and', 'expect', 'always', 'or', 'not', 'in']);

/**
 * Parses one line of a rule file (grammar in docs/formats.md, "Rule files"):
 * `[ID:] (when COND (and COND)* | always)? expect ADV (or ADV)*` or `… expect not ADV (and not ADV)*`,
 * with COND one of `name OP number`, `number OP name`, `number OP name OP number` (both OPs the
 * same direction) and `name in [a, b]`, OP in `< <= > >=`. Strict and non-strict comparisons give
 * the same bound: rule boxes are closed. Stops at the first syntax error, reporting its column.
 * @param text one line without its line break
 */
export function parseRuleLine(text: string): ParsedLine {
  const lexed = tokenizeRuleLine(text);
  if (lexed.error !== undefined) return { kind: 'error', ...lexed.error };
  const tokens = lexed.tokens;
  if (tokens.length === 0) return { kind: 'blank' };
  const endColumn = text.replace(/\s*(#.*)?$/, '').length + 1;
  let pos = 0;
  const peek = (): Token | undefined => tokens[pos];
  const found = (): string => (peek() === undefined ? 'end of line' : `'${peek()!.text}'`);
  const fail = (expected: string): never => {
    throw new LineError(peek()?.column ?? endColumn, `expected ${expected}, found ${found()}`);
  };
  const isWord = (w: string): boolean => peek()?.kind === 'word' && peek()!.text === w;
  const take = (kind: Token['kind'], expected: string, text?: string): Token => {
    const t = peek();
    if (t === undefined || t.kind !== kind || (text !== undefined && t.text !== text)) fail(expected);
    pos++;
    return t!;
  };
  const number = (after: string): Located<number> => {
    const t = take('number', `a number after '${after}'`);
    const value = Number(t.text);
    if (!Number.isFinite(value)) throw new LineError(t.column, `number ${t.text} is out of range`);
    return { value, column: t.column };
  };
  const name = (expected: string): Located<string> => {
    const t = peek();
    if (t === undefined || t.kind !== 'word' || KEYWORDS.has(t.text)) fail(expected);
    pos++;
    return { value: t!.text, column: t!.column };
  };
  const condition = (after: string): RawCondition => {
    const column = peek()?.column ?? endColumn;
    if (peek()?.kind === 'number') {
      const first = number(after);
      const op1 = take('op', `<, <=, > or >= after '${tokens[pos - 1]!.text}'`).text;
      const input = name(`an input name after '${op1}'`);
      const up = op1.startsWith('<');
      let second: Located<number> | undefined;
      if (peek()?.kind === 'op') {
        const op2 = peek()!.text;
        if (op2.startsWith('<') !== up) fail(up ? `'<' or '<=' (a chain goes one way)` : `'>' or '>=' (a chain goes one way)`);
        pos++;
        second = number(op2);
      }
      const [lower, upper] = up ? [first, second] : [second, first];
      return { column, name: input, ...(lower && { lower }), ...(upper && { upper }) };
    }
    const input = name(`an input name or a number after '${after}'`);
    if (isWord('in')) {
      pos++;
      take('punct', `'[' after 'in'`, '[');
      const lower = number('[');
      take('punct', `',' after the lower bound`, ',');
      const upper = number(',');
      take('punct', `']' after the upper bound`, ']');
      return { column, name: input, lower, upper };
    }
    const op = take('op', `<, <=, >, >= or 'in' after '${input.value}'`).text;
    const bound = number(op);
    return op.startsWith('<') ? { column, name: input, upper: bound } : { column, name: input, lower: bound };
  };
  try {
    let id: Located<string> | undefined;
    if (tokens[1]?.kind === 'punct' && tokens[1].text === ':') {
      if (tokens[0]!.kind !== 'word') fail(`a rule id (a name such as R1) before ':'`);
      id = { value: tokens[0]!.text, column: tokens[0]!.column };
      pos = 2;
    }
    const conditions: RawCondition[] = [];
    if (isWord('always')) {
      pos++;
    } else if (isWord('when')) {
      conditions.push(condition(tokens[pos++]!.text));
      while (isWord('and')) conditions.push(condition(tokens[pos++]!.text));
    } else if (!isWord('expect')) {
      const next = tokens[1];
      if (pos === 0 && tokens[0]!.kind === 'word' && next?.kind === 'word' && ['when', 'always', 'expect'].includes(next.text)) {
        throw new LineError(next.column, `expected ':' after rule id '${tokens[0]!.text}', found '${next.text}'`);
      }
      fail(`'when', 'always' or 'expect'`);
    }
    if (!isWord('expect')) fail(conditions.length > 0 ? `'and' or 'expect'` : `'expect' after 'always'`);
    pos++;
    const negated = isWord('not');
    if (negated) pos++;
    const advisories = [name(`an advisory name after '${tokens[pos - 1]!.text}'`)];
    const joiner = negated ? 'and' : 'or';
    while (isWord(joiner)) {
      pos++;
      if (negated) take('word', `'not' after 'and'`, 'not');
      advisories.push(name(`an advisory name after '${tokens[pos - 1]!.text}'`));
    }
    if (peek() !== undefined) fail(`'${joiner}' or end of line`);
    return { kind: 'rule', rule: { ...(id && { id }), conditions, negated, advisories } };
  } catch (e) {
    if (e instanceof LineError) return { kind: 'error', column: e.column, message: e.message };
    throw e;
  }
}
