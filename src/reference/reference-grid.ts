/**
 * A reference lookup table read from CSV: the table's advisory at every point of a full grid
 * (the Cartesian product of one ascending list of values per input).
 */
export interface ReferenceGrid {
  readonly file: string;
  /** Ascending distinct grid values per input, in scenario units. */
  readonly axes: readonly (readonly number[])[];
  readonly n: number;
  readonly d: number;
  /** n × d grid points in grid order (the last input varies fastest), float64, scenario units. */
  readonly x: Float64Array;
  /** The table's advisory index per grid point. */
  readonly advisory: Int32Array;
  /** The CSV line each grid point was read from. */
  readonly line: Int32Array;
}
