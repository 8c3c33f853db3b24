import type { Evaluation, Evaluator } from '../types.js';
import { CHANGED } from './diff-result.js';

/**
 * An evaluator of the change predicate, so that the sampler and the tree learner of the mining
 * pipeline can be pointed at "where do two models disagree": label CHANGED where the two
 * advisories differ, SAME elsewhere. Scores are one-hot over the two labels; the margin is the
 * smaller of the two models' decision margins, so the sampler's refinement looks closer where
 * either model is near one of its own boundaries (which is where the change region's edges lie).
 */
export function changeEvaluator(before: Evaluator, after: Evaluator): Evaluator {
  return async (x: Float64Array, n: number): Promise<Evaluation> => {
    const a = await before(x, n);
    const b = await after(x, n);
    const scores = new Float32Array(2 * n);
    const advisory = new Int32Array(n);
    const margin = new Float32Array(n);
    for (let i = 0; i < n; i++) {
      const label = a.advisory[i] === b.advisory[i] ? 0 : CHANGED;
      advisory[i] = label;
      scores[2 * i + label] = 1;
      margin[i] = Math.min(a.margin[i]!, b.margin[i]!);
    }
    return { scores, advisory, margin };
  };
}
