import type { Box } from '../prove/index.js';
import { mergeRules } from '../rules/index.js';

/**
 * The union of two closed boxes when it is itself a box, else undefined. The test is the rule
 * stage's (`mergeRules`: equal on every input but one, meeting or overlapping on that one), run
 * on two stand-in rules, so rule merging and repair agree on what a box union is.
 */
export function boxUnion(a: Box, b: Box): Box | undefined {
  const origin = { kind: 'mined' } as const;
  const merged = mergeRules([
    { id: 'a', box: a, allowed: [0], origin },
    { id: 'b', box: b, allowed: [0], origin },
  ]);
  return merged.length === 1 ? merged[0]!.box : undefined;
}
