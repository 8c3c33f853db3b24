/**
 * What a reference-table comparison does and does not check, printed with every comparison
 * (terminal, reference.md, reference.json) so that agreement at grid points is not read as
 * agreement everywhere.
 * @param points number of grid points compared
 */
export function referenceScope(points: number): { checked: string[]; notChecked: string[] } {
  return {
    checked: [
      `the network's advisory (onnxruntime, on the model file) at each of the ${points.toLocaleString('en-US')} grid points of the table, against the table's advisory there`,
    ],
    notChecked: [
      'any input between grid points: how the table is meant to be read between its points (nearest point, interpolation, cell corner) is not known here, and the network can change its advisory between two neighbouring grid points that both agree with the table',
      'shares of the domain: agreement is counted over grid points, which are not a random sample of the domain, so no confidence interval is stated',
      'to check a region between grid points, write it as a rule and run `specula check SCENARIO RULES` (dense samples, and proofs where the graph is supported)',
    ],
  };
}
