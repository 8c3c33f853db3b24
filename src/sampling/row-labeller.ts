import { ToolError } from '../errors.js';
import type { Evaluator } from '../types.js';

/** The arrays of a sample set: x row-major n × d (scenario units), one advisory and margin a row. */
export interface SampleArrays {
  readonly x: Float64Array;
  readonly advisory: Int32Array;
  readonly margin: Float32Array;
}

/**
 * How the sampler gets its points labelled: the arrays of the sample set come from the
 * labeller (worker threads need them in shared memory), and the labeller writes the advisory
 * and margin of a range of rows into them in place. Calls may overlap (up to `concurrency` at
 * once); each writes only its own rows.
 */
export interface RowLabeller {
  /** Useful number of labelling calls at once (1: one after the other). */
  readonly concurrency: number;
  /** Zeroed arrays for n samples of d inputs. */
  allocate(n: number, d: number): SampleArrays;
  /** Writes advisory and margin of rows [from, from + rows), computed from those rows of x. */
  labelInPlace(arrays: SampleArrays, from: number, rows: number): Promise<void>;
}

/**
 * A labeller over a plain evaluator: ordinary arrays, one call at a time, each call's
 * decisions and margins copied into the sample set.
 * @param evaluate the controller
 * @param d inputs per row
 * @throws (from labelInPlace) ToolError `SAMPLING_EVALUATOR` when the evaluator returns fewer
 *   rows than asked for
 */
export function evaluatorLabeller(evaluate: Evaluator, d: number): RowLabeller {
  return {
    concurrency: 1,
    allocate: (n) => ({ x: new Float64Array(n * d), advisory: new Int32Array(n), margin: new Float32Array(n) }),
    async labelInPlace({ x, advisory, margin }, from, rows) {
      const ev = await evaluate(x.subarray(from * d, (from + rows) * d), rows);
      if (ev.advisory.length < rows || ev.margin.length < rows) {
        throw new ToolError('SAMPLING_EVALUATOR', `sampleDomain: evaluator returned ${ev.advisory.length} advisories and ${ev.margin.length} margins for ${rows} rows`);
      }
      advisory.set(ev.advisory.length === rows ? ev.advisory : ev.advisory.subarray(0, rows), from);
      margin.set(ev.margin.length === rows ? ev.margin : ev.margin.subarray(0, rows), from);
    },
  };
}
