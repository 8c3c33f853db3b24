/**
 * The median of the first m values (the middle value, or the mean of the two middle values; 0
 * when m = 0), found by selection instead of sorting: Hoare's FIND (C. A. R. Hoare,
 * "Algorithm 65: Find", Communications of the ACM 4(7):321–322, 1961) in the form of N. Wirth,
 * *Algorithms + Data Structures = Programs*, Prentice-Hall, 1976, §2.3.4, with the middle
 * element as pivot. O(m) expected time, against O(m log m) for a sort: the refinement takes
 * several medians of a few thousand margins per round.
 *
 * Reorders values[0 .. m) in place. The values must not be NaN.
 * @param values the values; the first m are read and reordered
 * @param m how many values
 */
export function medianInPlace(values: Float32Array, m: number): number {
  if (m === 0) return 0;
  const k = (m - 1) >> 1;
  selectInPlace(values, m, k);
  if (m % 2 === 1) return values[k]!;
  // the other middle value is the smallest of those after position k
  let next = values[k + 1]!;
  for (let i = k + 2; i < m; i++) if (values[i]! < next) next = values[i]!;
  return 0.5 * (values[k]! + next);
}

/** Moves the k-th smallest of v[0 .. m) to position k, smaller ones before it, larger after. */
function selectInPlace(v: Float32Array, m: number, k: number): void {
  let lo = 0;
  let hi = m - 1;
  while (lo < hi) {
    const pivot = v[(lo + hi) >> 1]!;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (v[i]! < pivot) i++;
      while (v[j]! > pivot) j--;
      if (i <= j) {
        const t = v[i]!;
        v[i] = v[j]!;
        v[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return;
  }
}
