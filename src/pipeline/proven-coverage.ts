import type { CheckedRule, Coverage, InputSpec } from '../types.js';
import { unionVolume } from '../repair/index.js';

/**
 * Share of the input domain's volume covered by proven rules: the volume of the union of their
 * boxes (overlaps counted once, exactly, by src/repair's cell cover), in total and per advisory
 * (rules allowing exactly that one advisory), divided by the domain's volume. Inputs of zero
 * width are left out of every volume.
 */
export function provenCoverage(rules: readonly CheckedRule[], inputs: readonly InputSpec[], advisories: number): Coverage {
  const domain = inputs.map((i) => [i.min, i.max] as const);
  const domainVolume = unionVolume([domain], domain);
  const proven = rules.filter((r) => r.evidence.status === 'proven');
  const share = (boxes: ReadonlyArray<ReadonlyArray<readonly [number, number]>>): number => (boxes.length === 0 || !(domainVolume > 0) ? 0 : unionVolume(boxes as never, domain) / domainVolume);
  const perAdvisory: number[] = [];
  for (let a = 0; a < advisories; a++) {
    perAdvisory.push(share(proven.filter((r) => r.rule.allowed.length === 1 && r.rule.allowed[0] === a).map((r) => r.rule.box)));
  }
  return { total: share(proven.map((r) => r.rule.box)), perAdvisory };
}
