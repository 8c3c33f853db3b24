/**
 * A JSON reader that says where a file is wrong.
 *
 * `JSON.parse` in Node 20 reports a character offset for some syntax errors and none for others
 * ("Unexpected end of JSON input"), and silently keeps the last of two equal keys. Scenario
 * files are written by hand, so this reader gives every syntax error a line and column and lists
 * repeated keys for the validator to report. It follows the JSON grammar of RFC 8259
 * (T. Bray, "The JavaScript Object Notation (JSON) Data Interchange Format", IETF, 2017) and
 * converts numbers with `Number()`, exactly as `JSON.parse` does (so `1e999` reads as Infinity
 * and is left to the validator to reject).
 */

/** A repeated key inside one JSON object. */
export interface DuplicateKey {
  /** Field path of the repeated key, such as `inputs[0].min`. */
  readonly path: string;
  readonly line: number;
  readonly column: number;
}

export type JsonReadResult =
  | { readonly ok: true; readonly value: unknown; readonly duplicates: readonly DuplicateKey[] }
  | { readonly ok: false; readonly line: number; readonly column: number; readonly message: string };

class JsonSyntax extends Error {
  constructor(
    readonly offset: number,
    message: string,
  ) {
    super(message);
  }
}

const NUMBER = /-?(?:0|[1-9][0-9]*)(?:\.[0-9]+)?(?:[eE][+-]?[0-9]+)?/y;
/** Deeper nesting than this is refused instead of overflowing the call stack; scenario files need 3. */
const MAX_DEPTH = 64;
const ESCAPES: Readonly<Record<string, string>> = { '"': '"', '\\': '\\', '/': '/', b: '\b', f: '\f', n: '\n', r: '\r', t: '\t' };

/** Joins a field path and a key the way issues print them: `inputs[0].min`. */
export function childPath(path: string, key: string | number): string {
  if (typeof key === 'number') return `${path}[${key}]`;
  return path === '' ? key : `${path}.${key}`;
}

function shown(text: string, at: number): string {
  if (at >= text.length) return 'end of file';
  const ch = text[at]!;
  if (ch === '\n' || ch === '\r') return 'end of line';
  return `'${ch}'`;
}

/**
 * Reads JSON text. Objects come back as prototype-free records, so a key such as `__proto__`
 * is an ordinary field.
 * @param text the file's text (a leading byte-order mark must already be removed)
 * @returns the value and any repeated keys, or the first syntax error with its 1-based line and
 *   column (columns count UTF-16 code units; a CR before LF is not counted as a line)
 */
export function jsonRead(text: string): JsonReadResult {
  let pos = 0;
  const duplicates: DuplicateKey[] = [];

  const skipSpace = (): void => {
    while (pos < text.length) {
      const c = text.charCodeAt(pos);
      if (c === 0x20 || c === 0x09 || c === 0x0a || c === 0x0d) pos++;
      else break;
    }
  };

  const readString = (): string => {
    const start = pos;
    pos++; // opening quote
    let out = '';
    for (;;) {
      if (pos >= text.length) throw new JsonSyntax(start, 'string is not closed (missing \'"\')');
      const ch = text[pos]!;
      if (ch === '"') {
        pos++;
        return out;
      }
      if (ch === '\\') {
        const esc = text[pos + 1];
        if (esc === 'u') {
          const hex = text.slice(pos + 2, pos + 6);
          if (!/^[0-9a-fA-F]{4}$/.test(hex)) throw new JsonSyntax(pos, 'expected 4 hex digits after \\u');
          out += String.fromCharCode(parseInt(hex, 16));
          pos += 6;
        } else if (esc !== undefined && ESCAPES[esc] !== undefined) {
          out += ESCAPES[esc];
          pos += 2;
        } else {
          throw new JsonSyntax(pos, `unknown escape '\\${esc ?? ''}' in string`);
        }
      } else if (ch.charCodeAt(0) < 0x20) {
        throw new JsonSyntax(pos, 'control character or line break inside a string (write it as \\n, \\t, …)');
      } else {
        out += ch;
        pos++;
      }
    }
  };

  let depth = 0;
  const readValue = (path: string): unknown => {
    skipSpace();
    const ch = text[pos];
    if ((ch === '{' || ch === '[') && depth >= MAX_DEPTH) {
      throw new JsonSyntax(pos, `nesting deeper than ${MAX_DEPTH} levels`);
    }
    if (ch === '{') return readObject(path);
    if (ch === '[') return readArray(path);
    if (ch === '"') return readString();
    for (const [word, value] of [['true', true], ['false', false], ['null', null]] as const) {
      if (text.startsWith(word, pos)) {
        pos += word.length;
        return value;
      }
    }
    NUMBER.lastIndex = pos;
    const m = NUMBER.exec(text);
    if (m !== null && m[0] !== '-') {
      pos += m[0].length;
      return Number(m[0]);
    }
    throw new JsonSyntax(pos, `expected a value, found ${shown(text, pos)}`);
  };

  const readArray = (path: string): unknown[] => {
    pos++;
    depth++;
    const out: unknown[] = [];
    skipSpace();
    if (text[pos] === ']') {
      pos++;
      depth--;
      return out;
    }
    for (;;) {
      out.push(readValue(childPath(path, out.length)));
      skipSpace();
      if (text[pos] === ',') pos++;
      else if (text[pos] === ']') {
        pos++;
        depth--;
        return out;
      } else throw new JsonSyntax(pos, `expected ',' or ']' after an array element, found ${shown(text, pos)}`);
    }
  };

  const readObject = (path: string): Record<string, unknown> => {
    pos++;
    depth++;
    const out: Record<string, unknown> = Object.create(null) as Record<string, unknown>;
    skipSpace();
    if (text[pos] === '}') {
      pos++;
      depth--;
      return out;
    }
    for (;;) {
      skipSpace();
      if (text[pos] !== '"') throw new JsonSyntax(pos, `expected a double-quoted field name, found ${shown(text, pos)}`);
      const keyAt = pos;
      const key = readString();
      skipSpace();
      if (text[pos] !== ':') throw new JsonSyntax(pos, `expected ':' after field name "${key}", found ${shown(text, pos)}`);
      pos++;
      const here = childPath(path, key);
      if (Object.prototype.hasOwnProperty.call(out, key)) duplicates.push({ path: here, ...lineColumn(text, keyAt) });
      out[key] = readValue(here);
      skipSpace();
      if (text[pos] === ',') pos++;
      else if (text[pos] === '}') {
        pos++;
        depth--;
        return out;
      } else throw new JsonSyntax(pos, `expected ',' or '}' after a field value, found ${shown(text, pos)}`);
    }
  };

  try {
    const value = readValue('');
    skipSpace();
    if (pos < text.length) throw new JsonSyntax(pos, `unexpected ${shown(text, pos)} after the end of the JSON value`);
    return { ok: true, value, duplicates };
  } catch (e) {
    if (!(e instanceof JsonSyntax)) throw e;
    return { ok: false, ...lineColumn(text, e.offset), message: e.message };
  }
}

/** 1-based line and column of a character offset. */
function lineColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < offset && i < text.length; i++) {
    if (text.charCodeAt(i) === 0x0a) {
      line++;
      lineStart = i + 1;
    }
  }
  return { line, column: offset - lineStart + 1 };
}
