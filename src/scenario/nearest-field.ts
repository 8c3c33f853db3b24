/**
 * Levenshtein edit distance (V. I. Levenshtein, "Binary codes capable of correcting deletions,
 * insertions and reversals", Soviet Physics Doklady 10(8):707–710, 1966), by the usual
 * two-row dynamic programme. Cost O(|a|·|b|); field names are short.
 */
function editDistance(a: string, b: string): number {
  let prev = new Array<number>(b.length + 1);
  let next = new Array<number>(b.length + 1);
  for (let j = 0; j <= b.length; j++) prev[j] = j;
  for (let i = 1; i <= a.length; i++) {
    next[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const substitute = prev[j - 1]! + (a[i - 1] === b[j - 1] ? 0 : 1);
      next[j] = Math.min(prev[j]! + 1, next[j - 1]! + 1, substitute);
    }
    [prev, next] = [next, prev];
  }
  return prev[b.length]!;
}

/**
 * A known field name close enough to an unknown one to be the likely intent (a misspelling such
 * as `advisores`, or a longer or shorter form such as `maximum` or `desc`), or undefined.
 * "Close" is at most 2 edits and less than half the name's length, so short unrelated names are
 * not suggested, or one name starting with the other, both at least 3 letters (common practice,
 * no source).
 * @param unknown the field name found
 * @param known the field names allowed at that place
 */
export function nearestField(unknown: string, known: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const name of known) {
    const d = editDistance(unknown.toLowerCase(), name.toLowerCase());
    if (d < bestDistance) {
      best = name;
      bestDistance = d;
    }
  }
  if (bestDistance <= 2 && bestDistance < unknown.length / 2) return best;
  const lower = unknown.toLowerCase();
  return known.find((name) => {
    const n = name.toLowerCase();
    return Math.min(n.length, lower.length) >= 3 && (lower.startsWith(n) || n.startsWith(lower));
  });
}
