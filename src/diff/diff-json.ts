import { formatRule } from '../rules/index.js';
import { CAUTIONS } from '../report/index.js';
import { CHANGE_LABELS, REGRESSION_VERDICTS, type DiffResult } from './diff-result.js';
import type { GateOutcome } from './fail-on.js';

/** Identifies diff.json and its layout version. */
export const DIFF_JSON_FORMAT = 'specula-diff';
export const DIFF_JSON_VERSION = 1;

/** Cautions particular to a comparison of two models, shown after the general ones. */
export const DIFF_CAUTIONS: readonly string[] = [
  'The changed share is estimated from uniform samples; a changed region much smaller than one sample in the stated count can be missed entirely.',
  'Change rules describe where the two models were seen to disagree; they are not proofs. The changed region can reach outside them (see recall) and they can hold unchanged points (see precision).',
];

/** The canonical JSON document of a diff (what diff.json holds), with the gates' outcomes. */
export function diffJson(result: DiffResult, gates: readonly GateOutcome[]) {
  const { inputs, advisories } = result;
  const box = (b: ReadonlyArray<readonly [number, number]>) => Object.fromEntries(inputs.map((inp, i) => [inp.name, [b[i]![0], b[i]![1]]]));
  const verdicts = Object.fromEntries(REGRESSION_VERDICTS.map((v) => [v, result.rules.filter((r) => r.verdict === v).length]));
  return {
    format: DIFF_JSON_FORMAT,
    formatVersion: DIFF_JSON_VERSION,
    cautions: [...CAUTIONS, ...DIFF_CAUTIONS],
    manifest: result.manifest,
    decision: result.decision,
    inputs,
    advisories,
    rulesSource: result.rulesSource,
    verdicts,
    rules: result.rules.map((r) => ({
      id: r.rule.id,
      text: formatRule(r.rule, inputs, advisories),
      verdict: r.verdict,
      allowed: r.rule.allowed.map((a) => advisories[a]!),
      box: box(r.rule.box),
      before: r.before,
      after: r.after,
    })),
    changed: { ...result.changed, confidence: result.manifest.settings['confidence'] },
    confusion: { rowsAre: 'before', columnsAre: 'after', advisories, counts: result.confusion },
    changeRules: result.changeRules.map((c) => ({
      id: c.rule.id,
      text: formatRule(c.rule, inputs, CHANGE_LABELS),
      box: box(c.rule.box),
      volumeFraction: c.volumeFraction,
      changed: c.changed,
      transitions: c.transitions.map((t) => ({ before: advisories[t.before]!, after: advisories[t.after]!, count: t.count })),
    })),
    capture: result.capture,
    gates,
    notes: result.notes,
  };
}

/** diff.json text, two-space indentation. */
export function diffJsonText(result: DiffResult, gates: readonly GateOutcome[]): string {
  return JSON.stringify(diffJson(result, gates), null, 2) + '\n';
}
