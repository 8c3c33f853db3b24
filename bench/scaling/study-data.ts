import type { MeasuredPoint } from '../../src/scale/index.js';
import type { STUDY } from './sweeps.js';

/** What docs/scaling/scaling-data.json holds: the points and the conditions they were measured in. */
export interface StudyData {
  readonly date: string;
  readonly machine: string;
  /** 1-, 5- and 15-minute load averages before and after (other work on the shared machine). */
  readonly loadBefore: readonly number[];
  readonly loadAfter: readonly number[];
  readonly studySeconds: number;
  readonly settings: typeof STUDY;
  readonly points: readonly MeasuredPoint[];
}
