import { boxUnion } from './box-union.js';
import type { ProvenPart } from './peel-and-prove.js';
import { type RepairContext, proveIn, timeLeft } from './repair-context.js';

/**
 * Merges proven parts two at a time where their union is exactly a box (as `mergeRules` decides:
 * equal on every input but one, meeting or overlapping on that one), keeping a union only when
 * proveBox proves it on exactly the union box. Pairs are tried in order (i < j); after a merge
 * the scan starts again; a union that failed is not tried again. Stops at the deadline.
 * @param parts proven parts (not changed)
 * @returns the parts after merging, merged ones in place of the earlier of the pair
 */
export async function mergeProven(ctx: RepairContext, parts: readonly ProvenPart[]): Promise<ProvenPart[]> {
  const list = [...parts];
  const failed = new Set<string>();
  let changed = true;
  while (changed && timeLeft(ctx) > 0) {
    changed = false;
    scan: for (let i = 0; i < list.length; i++) {
      for (let j = i + 1; j < list.length; j++) {
        const union = boxUnion(list[i]!.box, list[j]!.box);
        if (union === undefined) continue;
        const key = JSON.stringify(union);
        if (failed.has(key)) continue;
        if (timeLeft(ctx) <= 0) break scan;
        const proof = await proveIn(ctx, union);
        if (proof.status !== 'proven') {
          failed.add(key);
          continue;
        }
        list[i] = { box: union, proof };
        list.splice(j, 1);
        changed = true;
        break scan;
      }
    }
  }
  return list;
}
