/** A lexical token of one rule-file line; `column` is 1-based. */
export interface Token {
  readonly kind: 'word' | 'number' | 'op' | 'punct' | 'bad';
  readonly text: string;
  readonly column: number;
}

/** Result of splitting one line: tokens up to a comment, or the first character that fits nothing. */
export interface TokenizedLine {
  readonly tokens: readonly Token[];
  readonly error?: { readonly column: number; readonly message: string };
}

/** Decimal number with optional sign, fraction and exponent: `-2`, `.5`, `1.`, `6.02e23`. */
const NUMBER = /[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?/y;
/** Names (inputs, advisories, ids, keywords): a letter or `_`, then letters, digits, `_ . -`. */
const WORD = /[A-Za-z_][A-Za-z0-9_.-]*/y;
/** Characters that glue onto a number to make something that is not one (`3abc`, `1.2.3`). */
const TRAILING = /[A-Za-z0-9_.]+/y;
const OPERATORS = ['<=', '>=', '<', '>'] as const;
const PUNCTUATION = ':[],';

/**
 * Splits one line of a rule file into tokens. Spaces and tabs separate tokens; `#` starts a
 * comment that runs to the end of the line. A number run into letters (`3abc`) becomes one `bad`
 * token so the parser can say "expected a number, found '3abc'".
 * @param text the line, without its line break
 */
export function tokenizeRuleLine(text: string): TokenizedLine {
  const tokens: Token[] = [];
  let p = 0;
  while (p < text.length) {
    const ch = text[p]!;
    if (ch === ' ' || ch === '\t') {
      p++;
      continue;
    }
    if (ch === '#') break;
    const column = p + 1;
    const op = OPERATORS.find((o) => text.startsWith(o, p));
    if (op !== undefined) {
      tokens.push({ kind: 'op', text: op, column });
      p += op.length;
      continue;
    }
    if (PUNCTUATION.includes(ch)) {
      tokens.push({ kind: 'punct', text: ch, column });
      p++;
      continue;
    }
    NUMBER.lastIndex = p;
    const number = NUMBER.exec(text);
    if (number !== null) {
      p += number[0].length;
      TRAILING.lastIndex = p;
      const trailing = TRAILING.exec(text);
      if (trailing === null) {
        tokens.push({ kind: 'number', text: number[0], column });
      } else {
        p += trailing[0].length;
        tokens.push({ kind: 'bad', text: number[0] + trailing[0], column });
      }
      continue;
    }
    WORD.lastIndex = p;
    const word = WORD.exec(text);
    if (word !== null) {
      tokens.push({ kind: 'word', text: word[0], column });
      p += word[0].length;
      continue;
    }
    const hint = ch === '=' ? ', conditions use <, <=, >, >= or in [a, b]' : '';
    const shown = String.fromCodePoint(text.codePointAt(p)!);
    return { tokens, error: { column, message: `unexpected character '${shown}'${hint}` } };
  }
  return { tokens };
}
