/**
 * Derives an independent 32-bit seed for a named sub-task from the run's seed, so that each
 * rule's dense samples depend only on (run seed, rule id) and not on the order rules are
 * checked in (shards and worker threads then reproduce a single run exactly).
 *
 * Hash: 32-bit FNV-1a (Fowler, Noll & Vo; IETF draft-eastlake-fnv, "The FNV Non-Cryptographic
 * Hash Algorithm") over the seed's four bytes followed by the label's UTF-16 code units.
 */
export function deriveSeed(seed: number, label: string): number {
  const FNV_OFFSET = 0x811c9dc5;
  const FNV_PRIME = 0x01000193;
  let h = FNV_OFFSET;
  const s = seed >>> 0;
  for (let b = 0; b < 4; b++) {
    h ^= (s >>> (8 * b)) & 0xff;
    h = Math.imul(h, FNV_PRIME);
  }
  for (let i = 0; i < label.length; i++) {
    const c = label.charCodeAt(i);
    h ^= c & 0xff;
    h = Math.imul(h, FNV_PRIME);
    h ^= c >>> 8;
    h = Math.imul(h, FNV_PRIME);
  }
  return h >>> 0;
}
