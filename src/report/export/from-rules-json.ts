import { FileError } from '../../errors.js';
import type { CheckedRule, Rule, RuleTable } from '../../types.js';
import type { RulesJsonDocument } from '../rules-json.js';

/**
 * The rule table inside a rules.json document: boxes back in input order, advisories back to
 * indices. The inverse of `toRulesJson` (the `text` and `cautions` fields are derived data and
 * are not needed to rebuild the table).
 * @param doc a parsed rules.json document
 * @param file where the document came from, named in errors
 * @throws FileError `RUN_INVALID` when a rule's box misses an input or names an unknown advisory
 */
export function fromRulesJson(doc: RulesJsonDocument, file = 'rules.json'): RuleTable {
  const advisoryIndex = new Map(doc.advisories.map((a, i) => [a, i]));
  const rules = doc.rules.map((r, k): CheckedRule => {
    const box = doc.inputs.map((inp): readonly [number, number] => {
      const iv = r.box[inp.name];
      if (!iv || iv.length !== 2 || !Number.isFinite(iv[0]) || !Number.isFinite(iv[1])) {
        throw new FileError('RUN_INVALID', `${file}: rules[${k}].box.${inp.name}: expected [min, max], found ${JSON.stringify(iv ?? null)}`);
      }
      return [iv[0], iv[1]];
    });
    const allowed = r.allowed.map((name) => {
      const a = advisoryIndex.get(name);
      if (a === undefined) {
        throw new FileError('RUN_INVALID', `${file}: rules[${k}].allowed: "${name}" is not one of ${doc.advisories.join(', ')}`);
      }
      return a;
    });
    const rule: Rule = { id: r.id, box, allowed, origin: r.origin };
    return { rule, evidence: r.evidence };
  });
  return {
    manifest: doc.manifest,
    inputs: doc.inputs,
    advisories: doc.advisories,
    decision: doc.decision,
    rules,
    ...(doc.fidelity ? { fidelity: doc.fidelity } : {}),
    ...(doc.coverage ? { coverage: doc.coverage } : {}),
    ...(doc.notes ? { notes: doc.notes } : {}),
  };
}
