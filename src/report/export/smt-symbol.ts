/**
 * Words that SMT-LIB reserves or that the core and real-arithmetic theories already define
 * (SMT-LIB Standard v2.6, §3.1 and the Core and Reals theory declarations). An input named like
 * one of them is written as a quoted symbol instead.
 */
const TAKEN = new Set([
  '!', '_', 'as', 'BINARY', 'DECIMAL', 'exists', 'HEXADECIMAL', 'forall', 'let', 'match', 'NUMERAL', 'par', 'STRING',
  'true', 'false', 'not', 'and', 'or', 'xor', 'ite', 'distinct', 'abs', 'div', 'mod', 'to_real', 'to_int', 'is_int',
]);

/** A simple symbol of SMT-LIB 2.6: letters, digits and `~!@$%^&*_-+=<>.?/`, not starting with a digit. */
const SIMPLE_SYMBOL = /^[A-Za-z~!@$%^&*_\-+=<>.?/][A-Za-z0-9~!@$%^&*_\-+=<>.?/]*$/;

/**
 * A name as an SMT-LIB 2.6 symbol: as it is when it is a simple symbol that the standard does
 * not already use, otherwise quoted (`|name|`; `|` and `\` cannot appear inside quotes).
 * @throws RangeError when the name holds `|` or `\`
 */
export function smtSymbol(name: string): string {
  if (SIMPLE_SYMBOL.test(name) && !TAKEN.has(name)) return name;
  if (/[|\\]/.test(name)) throw new RangeError(`smtSymbol: "${name}" holds | or \\, which no SMT-LIB symbol can`);
  return `|${name}|`;
}
