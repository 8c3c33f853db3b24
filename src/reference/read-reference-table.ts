import type { Scenario } from '../types.js';
import { readCsvTable, throwCsvIssues } from '../report/index.js';
import type { ReferenceGrid } from './reference-grid.js';

/** At most this many missing grid points are named in the error; the rest are counted. */
export const MISSING_POINTS_SHOWN = 3;

/**
 * Reads a reference lookup table (docs/checking.md, "Reference tables"): a CSV with one column per
 * scenario input, named exactly as in the scenario, and one `advisory` column; one row per grid
 * point. The grid is the Cartesian product of each input's distinct values: every combination
 * must appear exactly once. Validation collects every problem (with file and line) and throws
 * once: missing or unknown columns; values that are not numbers or lie outside the input's
 * domain; unknown advisories; a point given twice; combinations missing from the grid.
 * @param path the CSV file, named in messages as given
 * @throws FileError `CSV_UNREADABLE`, `CSV_INVALID` (quoting, ragged rows) or `REFERENCE_INVALID`
 */
export function readReferenceTable(path: string, scenario: Scenario): ReferenceGrid {
  const csv = readCsvTable(path);
  const { inputs, advisories } = scenario;
  const d = inputs.length;
  const wanted = [...inputs.map((i) => i.name), 'advisory'];
  const col = new Map(csv.fields.map((f, i) => [f, i]));
  const issues: string[] = [];
  const missing = wanted.filter((w) => !col.has(w));
  const unknown = csv.fields.filter((f) => !wanted.includes(f));
  if (missing.length > 0) issues.push(`${path} line 1: missing column${missing.length > 1 ? 's' : ''} ${missing.map((m) => `'${m}'`).join(', ')}; expected columns: ${wanted.join(', ')}`);
  if (unknown.length > 0) issues.push(`${path} line 1: unknown column${unknown.length > 1 ? 's' : ''} ${unknown.map((m) => `'${m}'`).join(', ')}; expected columns: ${wanted.join(', ')}`);
  throwCsvIssues('REFERENCE_INVALID', issues);
  if (csv.rows.length === 0) throwCsvIssues('REFERENCE_INVALID', [`${path}: no grid points, only a header`]);
  const rows = csv.rows.length;
  const values = new Float64Array(rows * d);
  const labels = new Int32Array(rows);
  for (let r = 0; r < rows; r++) {
    const { line, values: cells } = csv.rows[r]!;
    inputs.forEach(({ name, min, max, unit }, f) => {
      const text = cells[col.get(name)!]!;
      const v = Number(text);
      values[r * d + f] = v;
      if (text === '' || !Number.isFinite(v)) issues.push(`${path} line ${line}, column ${name}: expected a number, found '${text}'`);
      else if (v < min || v > max) issues.push(`${path} line ${line}, column ${name}: ${v} lies outside the domain [${min}, ${max}]${unit ? ` ${unit}` : ''}`);
    });
    const a = cells[col.get('advisory')!]!;
    labels[r] = advisories.indexOf(a);
    if (labels[r]! < 0) issues.push(`${path} line ${line}, column advisory: unknown advisory '${a}', advisories are: ${advisories.join(', ')}`);
  }
  throwCsvIssues('REFERENCE_INVALID', issues);
  const axes = inputs.map((_, f) => {
    const set = new Set<number>();
    for (let r = 0; r < rows; r++) set.add(values[r * d + f]!);
    return [...set].sort((p, q) => p - q);
  });
  const size = axes.reduce((s, a) => s * a.length, 1);
  const position = axes.map((a) => new Map(a.map((v, i) => [v, i])));
  const stride = strides(axes);
  const x = new Float64Array(size * d);
  const advisory = new Int32Array(size);
  const line = new Int32Array(size);
  for (let r = 0; r < rows; r++) {
    let at = 0;
    for (let f = 0; f < d; f++) at += position[f]!.get(values[r * d + f]!)! * stride[f]!;
    const here = csv.rows[r]!.line;
    if (line[at] !== 0) {
      issues.push(`${path} line ${here}: grid point ${pointOf(values.subarray(r * d, r * d + d), scenario)} already given on line ${line[at]}`);
      continue;
    }
    line[at] = here;
    advisory[at] = labels[r]!;
    x.set(values.subarray(r * d, r * d + d), at * d);
  }
  throwCsvIssues('REFERENCE_INVALID', issues);
  if (rows !== size) {
    const shape = inputs.map((inp, f) => `${inp.name} ${axes[f]!.length}`).join(' × ');
    const examples: string[] = [];
    for (let at = 0; at < size && examples.length < MISSING_POINTS_SHOWN; at++) {
      if (line[at] === 0) examples.push(pointOf(Float64Array.from(axes, (a, f) => a[Math.floor(at / stride[f]!) % a.length]!), scenario));
    }
    throwCsvIssues('REFERENCE_INVALID', [
      `${path}: the grid is incomplete (ragged): ${size - rows} of ${size} points of the ${shape} grid are missing, e.g. ${examples.join('; ')}`,
    ]);
  }
  return { file: path, axes, n: size, d, x, advisory, line };
}

/** Index strides of grid order: the last input varies fastest. */
export function strides(axes: readonly (readonly number[])[]): number[] {
  const s = new Array<number>(axes.length).fill(1);
  for (let f = axes.length - 2; f >= 0; f--) s[f] = s[f + 1]! * axes[f + 1]!.length;
  return s;
}

function pointOf(v: ArrayLike<number>, scenario: Scenario): string {
  return scenario.inputs.map((inp, f) => `${inp.name} = ${v[f]}`).join(', ');
}
