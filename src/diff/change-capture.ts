import type { Rule } from '../types.js';
import { tableLabel } from '../rules/index.js';
import type { ChangeCapture } from './diff-result.js';
import type { ChangeSample } from './measure-change.js';
import { proportionOf } from './proportion-of.js';

/**
 * How well the change rules describe the changed region, measured on the fresh uniform sample of
 * `measureChange` (points the rules were not learned from): recall, the share of changed points
 * inside some change rule, and precision, the share of points inside the change rules that
 * changed, each with its exact two-sided Clopper–Pearson interval.
 */
export function changeCapture(rules: readonly Rule[], sample: ChangeSample, confidence: number): ChangeCapture {
  const inside = tableLabel(rules, sample.x, sample.n, sample.d);
  let changed = 0;
  let covered = 0;
  let both = 0;
  for (let i = 0; i < sample.n; i++) {
    const c = sample.changed[i] === 1;
    const r = inside[i] !== -1;
    if (c) changed++;
    if (r) covered++;
    if (c && r) both++;
  }
  return { recall: proportionOf(both, changed, confidence), precision: proportionOf(both, covered, confidence) };
}
