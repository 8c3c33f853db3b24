/**
 * A parsed rules.json without the two fields that record when and how fast a run went (the
 * manifest's `date` and each proof's `seconds`); everything else of two runs with the same seed
 * and settings must be identical.
 */
export function withoutTiming(doc: { manifest: { date?: string }; rules: Array<{ evidence: { proof?: { seconds?: number } } }> }): unknown {
  const copy = structuredClone(doc);
  delete copy.manifest.date;
  for (const r of copy.rules) if (r.evidence.proof) delete r.evidence.proof.seconds;
  return copy;
}
