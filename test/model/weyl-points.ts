/**
 * n points spread over a box by the additive recurrence x_k = frac(k·α) per axis, with α the
 * fractional parts of √2, √3, √5, … (H. Weyl, "Über die Gleichverteilung von Zahlen mod. Eins",
 * Math. Ann. 77:313–352, 1916): deterministic, no random generator needed.
 */
export function weylPoints(box: ReadonlyArray<readonly [number, number]>, n: number): Float64Array {
  const roots = [2, 3, 5, 7, 11, 13, 17, 19].map((p) => Math.sqrt(p) % 1);
  const d = box.length;
  const x = new Float64Array(n * d);
  for (let k = 0; k < n; k++) {
    for (let j = 0; j < d; j++) {
      const [lo, hi] = box[j]!;
      x[k * d + j] = lo + (((k + 1) * roots[j]!) % 1) * (hi - lo);
    }
  }
  return x;
}
