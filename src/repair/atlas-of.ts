import type { Box, ProveResult } from '../prove/index.js';

/** One proven piece: every input in the box gives an advisory in `advisory` (indices). */
export interface AtlasBox {
  readonly advisory: number[];
  readonly box: [number, number][];
}

/** The content of atlas.json: the proven pieces of a run's proofs. */
export interface Atlas {
  readonly boxes: AtlasBox[];
}

/** A proof with the allowed advisories it was run for (ProveResult does not record them). */
export interface AtlasProof {
  readonly allowed: readonly number[];
  readonly proof: ProveResult;
}

/**
 * The fine partition of proven pieces behind a set of proofs, for atlas.json: every box in the
 * proofs' `provenBoxes`, with the advisories its proof allowed, in the order given. A proof that
 * ended refuted or unknown still contributes the pieces it did prove (each is proven on its own).
 * Pieces of one proof do not overlap; pieces of different proofs do when their boxes do (the
 * proofs of one repair's sub-rules do not).
 * @param proofs (not changed)
 */
export function atlasOf(proofs: readonly AtlasProof[]): Atlas {
  const boxes: AtlasBox[] = [];
  for (const { allowed, proof } of proofs) {
    for (const b of proof.provenBoxes as readonly Box[]) boxes.push({ advisory: [...allowed], box: b.map(([lo, hi]) => [lo, hi]) });
  }
  return { boxes };
}
