import { readFileSync } from 'node:fs';
import { FileError } from '../../errors.js';
import { RULES_JSON_FORMAT, RULES_JSON_VERSION, type RulesJsonDocument } from '../rules-json.js';

/** A run's rules.json: the parsed document and the exact text (exports copy it unchanged). */
export interface RunRules {
  readonly doc: RulesJsonDocument;
  readonly text: string;
}

function describe(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (Array.isArray(v)) return 'an array';
  return v === null ? 'null' : typeof v;
}

/**
 * Reads a run folder's rules.json and checks its outline: the format name and version, and the
 * fields the report and the exports use (manifest, inputs, advisories, decision, rules).
 * Rule boxes are checked where they are used (`fromRulesJson`).
 * @returns the document and the file's text
 * @param path the rules.json path
 * @throws FileError `RUN_UNREADABLE` (missing or unreadable), `RUN_JSON` (not JSON) or
 *   `RUN_INVALID` (another format or a missing field)
 */
export function readRulesJson(path: string): RunRules {
  let text: string;
  try {
    // A byte-order mark, as Windows editors save UTF-8, is not part of the JSON text.
    text = readFileSync(path, 'utf8').replace(/^\uFEFF/, '');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new FileError('RUN_UNREADABLE', `${path}: cannot read the run's rule table (${code === 'ENOENT' ? 'no such file' : (e as Error).message})`);
  }
  let doc: Record<string, unknown>;
  try {
    doc = JSON.parse(text) as Record<string, unknown>;
  } catch (e) {
    throw new FileError('RUN_JSON', `${path}: not valid JSON (${(e as Error).message})`);
  }
  if (doc === null || typeof doc !== 'object' || Array.isArray(doc)) {
    throw new FileError('RUN_INVALID', `${path}: expected a JSON object, found ${describe(doc)}`);
  }
  if (doc['format'] !== RULES_JSON_FORMAT || doc['formatVersion'] !== RULES_JSON_VERSION) {
    throw new FileError(
      'RUN_INVALID',
      `${path}: expected format "${RULES_JSON_FORMAT}" version ${RULES_JSON_VERSION}, found ${JSON.stringify(doc['format'] ?? null)} version ${JSON.stringify(doc['formatVersion'] ?? null)}`,
    );
  }
  const expected: Array<[string, 'object' | 'array' | 'string']> = [
    ['manifest', 'object'],
    ['inputs', 'array'],
    ['advisories', 'array'],
    ['decision', 'string'],
    ['rules', 'array'],
  ];
  for (const [field, kind] of expected) {
    const v = doc[field];
    const ok = kind === 'array' ? Array.isArray(v) : typeof v === kind && v !== null && !Array.isArray(v);
    if (!ok) throw new FileError('RUN_INVALID', `${path}: ${field}: expected ${kind === 'array' ? 'an array' : `a ${kind}`}, found ${describe(v)}`);
  }
  return { doc: doc as unknown as RulesJsonDocument, text };
}
