/**
 * Levenshtein edit distance: the least number of single-character insertions, deletions and
 * substitutions that turn `a` into `b`. Used to suggest the name a user probably meant.
 *
 * Source: V. I. Levenshtein, "Binary codes capable of correcting deletions, insertions, and
 * reversals", Soviet Physics Doklady 10(8):707–710, 1966. Computed with the usual
 * dynamic-programming table kept to one row (Wagner & Fischer, "The string-to-string
 * correction problem", Journal of the ACM 21(1):168–173, 1974).
 *
 * @param a first string (compared by UTF-16 code unit)
 * @param b second string
 * @returns the distance, 0 when equal
 * Cost: O(|a|·|b|) time, O(|b|) memory.
 */
export function editDistance(a: string, b: string): number {
  const row = new Int32Array(b.length + 1);
  for (let j = 0; j <= b.length; j++) row[j] = j;
  for (let i = 1; i <= a.length; i++) {
    let diagonal = row[0]!;
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const above = row[j]!;
      const substitution = diagonal + (a.charCodeAt(i - 1) === b.charCodeAt(j - 1) ? 0 : 1);
      row[j] = Math.min(above + 1, row[j - 1]! + 1, substitution);
      diagonal = above;
    }
  }
  return row[b.length]!;
}
