import { LearnError } from '../errors.js';
import type { LabelledData } from './labelled-data.js';

function isCount(v: number, min: number): boolean {
  return Number.isInteger(v) && v >= min;
}

/**
 * Checks that labelled data are usable by the learner: sizes agree, every value is finite,
 * labels are in range and weights are positive. Reads every value once: O(n·d).
 * @throws {LearnError} code `LEARN_BAD_DATA`, naming the field, what was found and what was expected
 */
export function checkLabelledData(data: LabelledData): void {
  const { x, n, d, labels, classes, weights } = data;
  const fail = (message: string): never => {
    throw new LearnError('LEARN_BAD_DATA', `labelled data: ${message}`);
  };
  if (!isCount(n, 1)) fail(`n is ${n}, expected an integer >= 1`);
  if (!isCount(d, 1)) fail(`d is ${d}, expected an integer >= 1`);
  if (!isCount(classes, 1)) fail(`classes is ${classes}, expected an integer >= 1`);
  if (x.length !== n * d) fail(`x has ${x.length} values, expected n × d = ${n * d}`);
  if (labels.length !== n) fail(`labels has ${labels.length} values, expected n = ${n}`);
  for (let i = 0; i < x.length; i++) {
    if (!Number.isFinite(x[i])) fail(`x[${i}] (row ${Math.floor(i / d)}, input ${i % d}) is ${x[i]}, expected a finite number`);
  }
  for (let i = 0; i < n; i++) {
    const k = labels[i];
    if (k < 0 || k >= classes) fail(`labels[${i}] is ${k}, expected 0..${classes - 1}`);
  }
  if (weights !== undefined) {
    if (weights.length !== n) fail(`weights has ${weights.length} values, expected n = ${n}`);
    for (let i = 0; i < n; i++) {
      const w = weights[i];
      if (!(w > 0 && Number.isFinite(w))) fail(`weights[${i}] is ${w}, expected a finite number > 0`);
    }
  }
}
