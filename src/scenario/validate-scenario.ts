import { dirname, resolve } from 'node:path';
import type { Issue } from '../errors.js';
import type { Decision, Scenario } from '../types.js';
import { describeValue } from './describe-value.js';
import { FieldReader, isJsonObject } from './field-reader.js';
import type { DuplicateKey } from './json-read.js';
import { SCENARIO_NAME } from './names.js';
import { validateAdvisories } from './validate-advisories.js';
import { validateInputs } from './validate-inputs.js';
import { validateNormalize } from './validate-normalize.js';

/** Every top-level field of scenario.json (docs/formats.md). */
export const SCENARIO_FIELDS = ['name', 'title', 'model', 'decision', 'inputs', 'advisories', 'normalize'] as const;

const DECISIONS: readonly Decision[] = ['argmax', 'argmin'];

/** Where the scenario came from: its path (as given) and the SHA-256 of its bytes. */
export interface ScenarioSource {
  readonly path: string;
  readonly sha256: string;
}

/**
 * Checks a parsed scenario.json value against the format in docs/formats.md and builds the
 * Scenario. Every problem is collected; nothing is thrown.
 * @param value the parsed JSON
 * @param duplicates repeated keys found while reading the JSON (each is an issue)
 * @param source the file's path (the model path is resolved against its folder) and SHA-256
 * @returns the scenario, or the non-empty list of issues
 */
export function validateScenario(
  value: unknown,
  duplicates: readonly DuplicateKey[],
  source: ScenarioSource,
): { readonly scenario: Scenario; readonly issues: readonly [] } | { readonly scenario?: undefined; readonly issues: readonly Issue[] } {
  const issues: Issue[] = duplicates.map((d) => ({
    path: d.path,
    message: `field appears twice (again at line ${d.line}, column ${d.column}); keep one`,
  }));
  if (!isJsonObject(value)) {
    issues.push({ path: '', message: `expected a JSON object at the top level, found ${describeValue(value)}` });
    return { issues };
  }
  const fields = new FieldReader(value, '', issues);
  fields.unknownFields(SCENARIO_FIELDS);

  const name = fields.string('name', { nonEmpty: true });
  if (name !== undefined && !SCENARIO_NAME.test(name)) {
    issues.push({
      path: 'name',
      message: `expected 1–64 letters, digits, '.', '_' or '-' starting with a letter or digit (it names run folders), found ${JSON.stringify(name)}`,
    });
  }
  const title = fields.string('title', name !== undefined ? { fallback: name } : {});
  const model = fields.string('model', { nonEmpty: true });

  let decision: Decision | undefined;
  const rawDecision = fields.value('decision', '"argmax" or "argmin"');
  if (rawDecision !== undefined) {
    if (DECISIONS.includes(rawDecision as Decision)) decision = rawDecision as Decision;
    else issues.push({ path: 'decision', message: `expected "argmax" or "argmin", found ${JSON.stringify(rawDecision)}` });
  }

  const rawInputs = value['inputs'];
  const inputs = validateInputs(rawInputs, issues);
  const advisories = validateAdvisories(value['advisories'], issues);
  if (inputs !== undefined && advisories !== undefined) {
    advisories.forEach((a, i) => {
      const clash = inputs.findIndex((input) => input.name === a);
      if (clash >= 0) {
        issues.push({ path: `advisories[${i}]`, message: `"${a}" is also the name of inputs[${clash}]; rule text needs distinct names` });
      }
    });
  }
  const width = Array.isArray(rawInputs) ? rawInputs.length : undefined;
  const normalize = validateNormalize(value['normalize'], width, inputs, issues);

  if (issues.length > 0) return { issues };
  const scenarioPath = resolve(source.path);
  const scenario: Scenario = {
    name: name!,
    title: title!,
    scenarioPath,
    scenarioSha256: source.sha256,
    modelPath: resolve(dirname(scenarioPath), model!),
    decision: decision!,
    inputs: inputs!,
    advisories: advisories!,
    ...(normalize !== undefined ? { normalize } : {}),
  };
  return { scenario, issues: [] };
}
