import type { Proportion } from '../types.js';
import { CHANGE_MIN_SHARE_DEFAULT } from './mine-change-rules.js';
import { pct } from './format-figures.js';

/**
 * Why a diff has no change rules: either no sample changed at all, or the changed samples lie
 * in bands so thin that no readable box explains the smallest share a change rule must
 * (CHANGE_MIN_SHARE_DEFAULT of the domain per rule); the two must not read alike.
 * @param changed the changed share of the domain, from the fresh uniform sample
 */
export function noChangeRulesText(changed: Proportion): string {
  if (changed.value === 0) return 'the samples of both models showed no region where the advisory changed';
  return `the changed samples lie in bands too thin for a readable box: none explains ${pct(CHANGE_MIN_SHARE_DEFAULT, 2)} of the domain`;
}
