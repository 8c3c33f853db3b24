/**
 * Training data for the tree learner: n labelled points in d inputs.
 *
 * `x` is row-major (row i holds x[i*d .. i*d+d-1]), float64, in the scenario's units.
 * `labels[i]` is the class of row i, an integer in 0..classes-1 (an advisory index).
 * `weights[i]`, when given, is the positive weight of row i; every row weighs 1 otherwise.
 */
export interface LabelledData {
  readonly x: Float64Array;
  readonly n: number;
  readonly d: number;
  readonly labels: Int32Array;
  readonly classes: number;
  readonly weights?: Float64Array;
}
