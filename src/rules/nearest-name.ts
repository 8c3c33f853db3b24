import { editDistance } from './edit-distance.js';

/**
 * The known name a mistyped word most likely meant, or `undefined` when none is close.
 *
 * A name is close when its edit distance to the word (ignoring case) is at most
 * max(2, ⌊length/3⌋) — about one slip per three characters, common practice for "did you mean"
 * hints, no source — or when one is a prefix of the other (`bearing` for `bearing_deg`: people
 * drop unit suffixes). Among close names the smallest distance wins; ties go to the earlier name,
 * so the answer is deterministic.
 *
 * @param word what the user wrote
 * @param names the valid names, in their canonical order
 */
export function nearestName(word: string, names: readonly string[]): string | undefined {
  const w = word.toLowerCase();
  const limit = Math.max(2, Math.floor(w.length / 3));
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const name of names) {
    const n = name.toLowerCase();
    const distance = editDistance(w, n);
    const prefix = w.length > 0 && (n.startsWith(w) || w.startsWith(n));
    if ((distance <= limit || prefix) && distance < bestDistance) {
      best = name;
      bestDistance = distance;
    }
  }
  return best;
}
