import type { SampleArrays } from '../sampling/index.js';

/**
 * A sample set's arrays in shared memory (SharedArrayBuffer), so worker threads read the points
 * and write the labels in place: posting them to a worker shares them, nothing is copied.
 * One buffer each (not one for all three: the learner keeps x and the advisories, and a
 * separate margin buffer can be freed on its own).
 * @param n samples
 * @param d inputs per sample
 */
export function sharedSampleArrays(n: number, d: number): SampleArrays {
  return {
    x: new Float64Array(new SharedArrayBuffer(n * d * Float64Array.BYTES_PER_ELEMENT)),
    advisory: new Int32Array(new SharedArrayBuffer(n * Int32Array.BYTES_PER_ELEMENT)),
    margin: new Float32Array(new SharedArrayBuffer(n * Float32Array.BYTES_PER_ELEMENT)),
  };
}
