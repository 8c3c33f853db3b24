import { FileError } from '../errors.js';
import type { InputSpec, Rule } from '../types.js';
import type { RulesJsonDocument } from '../report/index.js';
import { clipToDomain } from './clip-to-domain.js';

/** Rules of a run's rules.json mapped onto a scenario, with the bounds clipped to its domain. */
export interface RulesFromRun {
  readonly rules: Rule[];
  readonly warnings: readonly string[];
}

/**
 * The rules of a run's rules.json, mapped onto a scenario by input and advisory name (so a run
 * whose inputs were listed in another order still fits). Every input of the scenario must have
 * an interval in every rule, and every allowed advisory must be one of the scenario's; bounds
 * past the domain are clipped with a warning, as the rule-file parser does.
 * @param doc the parsed rules.json (outline already checked by `readRulesJson`)
 * @param file the path, named in messages
 * @throws FileError `RUN_INVALID` listing the first problem found, with the rule's index and id
 */
export function rulesFromRun(doc: RulesJsonDocument, file: string, inputs: readonly InputSpec[], advisories: readonly string[]): RulesFromRun {
  const runInputs = new Set(doc.inputs.map((i) => i.name));
  const missing = inputs.filter((i) => !runInputs.has(i.name)).map((i) => i.name);
  const extra = [...runInputs].filter((n) => !inputs.some((i) => i.name === n));
  if (missing.length > 0 || extra.length > 0) {
    throw new FileError(
      'RUN_INVALID',
      `${file}: the run's inputs (${[...runInputs].join(', ')}) differ from the scenario's (${inputs.map((i) => i.name).join(', ')})` +
        `${missing.length > 0 ? `; missing ${missing.join(', ')}` : ''}${extra.length > 0 ? `; unknown ${extra.join(', ')}` : ''}`,
    );
  }
  const warnings: string[] = [];
  const rules = doc.rules.map((r, k): Rule => {
    const where = `${file}: rules[${k}] (${JSON.stringify(r.id)})`;
    if (typeof r.id !== 'string' || r.id === '') throw new FileError('RUN_INVALID', `${where}: id: expected a non-empty string`);
    const raw = inputs.map((inp): [number, number] => {
      const iv = r.box?.[inp.name];
      if (!Array.isArray(iv) || iv.length !== 2 || !Number.isFinite(iv[0]) || !Number.isFinite(iv[1]) || iv[0] > iv[1]) {
        throw new FileError('RUN_INVALID', `${where}: box.${inp.name}: expected [min, max] with min <= max, found ${JSON.stringify(iv ?? null)}`);
      }
      return [iv[0], iv[1]];
    });
    const clipped = clipToDomain(raw, inputs, `${where} box`);
    if (clipped.error !== undefined) throw new FileError('RUN_INVALID', clipped.error);
    warnings.push(...clipped.warnings);
    if (!Array.isArray(r.allowed) || r.allowed.length === 0) throw new FileError('RUN_INVALID', `${where}: allowed: expected a non-empty list of advisories`);
    const allowed = r.allowed.map((name) => {
      const a = advisories.indexOf(name);
      if (a < 0) throw new FileError('RUN_INVALID', `${where}: allowed: unknown advisory "${name}", advisories are: ${advisories.join(', ')}`);
      return a;
    });
    return { id: r.id, box: clipped.box, allowed: [...new Set(allowed)].sort((a, b) => a - b), origin: r.origin ?? { kind: 'mined' } };
  });
  const ids = new Set<string>();
  for (const r of rules) {
    if (ids.has(r.id)) throw new FileError('RUN_INVALID', `${file}: duplicate rule id "${r.id}"`);
    ids.add(r.id);
  }
  return { rules, warnings };
}
