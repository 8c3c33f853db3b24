/**
 * A finite number as an SMT-LIB 2.6 Real term: a `<decimal>` literal (digits, a point, digits;
 * no exponent, which SMT-LIB has no syntax for), wrapped as `(- d)` when negative, since
 * SMT-LIB literals carry no sign (SMT-LIB Standard v2.6, §3.1 "Lexicon").
 *
 * The decimal is the shortest one that reads back as the same float64 (ECMAScript
 * `Number::toString`), i.e. the number as rules.json prints it, with any exponent written out.
 * So `0.1` stays `0.1` — the bound the rule states — rather than the float64's exact binary
 * value 0.1000000000000000055511151231257827….
 * @param x a finite number; `-0` prints as `0.0`
 */
export function smtDecimal(x: number): string {
  if (!Number.isFinite(x)) throw new RangeError(`smtDecimal: expected a finite number, found ${x}`);
  const negative = x < 0;
  const s = String(Math.abs(x));
  const m = /^(\d+)(?:\.(\d+))?e([+-]\d+)$/.exec(s);
  let plain: string;
  if (m) {
    const intPart = m[1]!;
    const frac = m[2] ?? '';
    const digits = intPart + frac;
    const point = intPart.length + Number(m[3]);
    if (point <= 0) plain = `0.${'0'.repeat(-point)}${digits}`;
    else if (point >= digits.length) plain = `${digits}${'0'.repeat(point - digits.length)}.0`;
    else plain = `${digits.slice(0, point)}.${digits.slice(point)}`;
  } else {
    plain = s.includes('.') ? s : `${s}.0`;
  }
  return negative ? `(- ${plain})` : plain;
}
