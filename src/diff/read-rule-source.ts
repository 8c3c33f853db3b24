import { readFileSync } from 'node:fs';
import { extname } from 'node:path';
import { FileError } from '../errors.js';
import type { Evidence, Rule, Scenario } from '../types.js';
import { describeIssue, parseRuleFile } from '../rules/index.js';
import { readRulesCsv } from '../report/index.js';
import { readRulesJson } from '../report/export/index.js';
import { rulesFromRun } from './rules-from-run.js';

/** The three ways to give rules: a rule file, a run's rules.json, a run's rules.csv. */
export type RuleSourceKind = 'rule-file' | 'rules-json' | 'rules-csv';

export interface RuleSource {
  readonly kind: RuleSourceKind;
  readonly path: string;
  readonly rules: Rule[];
  /** Bounds clipped to the domain, each located by file and line (or rule index). */
  readonly warnings: readonly string[];
  /** For rules.json: the run's hashes and the evidence it holds (valid for that model and scenario only). */
  readonly run?: {
    readonly modelSha256: string;
    readonly scenarioSha256: string;
    readonly evidence: ReadonlyMap<string, Evidence>;
  };
}

/** Which kind of rule source a path is, by its extension: .json, .csv, anything else a rule file. */
export function ruleSourceKind(path: string): RuleSourceKind {
  const ext = extname(path).toLowerCase();
  return ext === '.json' ? 'rules-json' : ext === '.csv' ? 'rules-csv' : 'rule-file';
}

/**
 * Reads rules to check from a rule file (`.rules` or any other extension; syntax in
 * docs/formats.md), a run's rules.json (`.json`) or a run's rules.csv (`.csv`), against the
 * scenario's inputs and advisories. In all three, bounds past the domain are clipped to it with
 * a warning and a box missing the domain is an error.
 * @param path the file (named in messages as given)
 * @throws RuleFileError (a RuleSyntaxError) with line and column for rule files; FileError for
 *   unreadable files, rules.json and rules.csv problems (with the rule index or line)
 */
export function readRuleSource(path: string, scenario: Scenario): RuleSource {
  const kind = ruleSourceKind(path);
  if (kind === 'rules-json') {
    const { doc } = readRulesJson(path);
    const { rules, warnings } = rulesFromRun(doc, path, scenario.inputs, scenario.advisories);
    const run = {
      modelSha256: doc.manifest.model.sha256,
      scenarioSha256: doc.manifest.scenario.sha256,
      evidence: new Map(doc.rules.map((r) => [r.id, r.evidence])),
    };
    return { kind, path, rules, warnings, run };
  }
  if (kind === 'rules-csv') {
    const { rules, warnings } = readRulesCsv(path, scenario.inputs, scenario.advisories);
    return { kind, path, rules, warnings };
  }
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new FileError('RULES_UNREADABLE', `${path}: cannot read the rule file (${code === 'ENOENT' ? 'no such file' : (e as Error).message})`);
  }
  const parsed = parseRuleFile(text, scenario.inputs, scenario.advisories, path);
  if (parsed.rules.length === 0) throw new FileError('RULES_EMPTY', `${path}: no rules (only blank lines and comments)`);
  return { kind, path, rules: parsed.rules, warnings: parsed.warnings.map((w) => describeIssue(w, path)) };
}
