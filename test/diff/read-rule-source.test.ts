import { describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readRuleSource, ruleSourceKind } from '../../src/diff/index.js';
import { FileError } from '../../src/errors.js';
import { RuleFileError } from '../../src/rules/index.js';
import { rulesCsvText, rulesJsonText } from '../../src/report/index.js';
import type { RuleTable, Scenario } from '../../src/types.js';
import { THRESHOLD_ADVISORIES, THRESHOLD_INPUTS } from './threshold-network.js';

const SCENARIO = { inputs: THRESHOLD_INPUTS, advisories: THRESHOLD_ADVISORIES } as unknown as Scenario;
const dir = mkdtempSync(join(tmpdir(), 'specula-source-'));
let counter = 0;

/** Writes text to a fresh file with the extension and reads it as a rule source. */
function read(ext: string, text: string) {
  const path = join(dir, `f${counter++}${ext}`);
  writeFileSync(path, text);
  return { path, source: () => readRuleSource(path, SCENARIO) };
}

/** The error of reading a source, with the file's path shown as F. */
function failure(ext: string, text: string): { name: string; code: string; message: string } {
  const { path, source } = read(ext, text);
  try {
    source();
  } catch (e) {
    if (e instanceof FileError || e instanceof RuleFileError) return { name: e.name, code: e.code, message: e.message.split(path).join('F') };
    throw e;
  }
  throw new Error('no error thrown');
}

const evidence = { status: 'sampled' as const, samples: 10, violations: 0, violationBound: 0.26, confidence: 0.95, volumeFraction: 0.4 };
const TABLE: RuleTable = {
  manifest: {
    tool: 'specula', toolVersion: '0', command: 'mine', date: '', seed: 1, settings: {}, counts: {},
    scenario: { path: 's', sha256: 'a'.repeat(64), name: 't' }, model: { path: 'm', sha256: 'b'.repeat(64) },
  },
  inputs: THRESHOLD_INPUTS,
  advisories: THRESHOLD_ADVISORIES,
  decision: 'argmax',
  rules: [
    { rule: { id: 'R1', box: [[0, 4], [0, 10]], allowed: [0], origin: { kind: 'mined' } }, evidence },
    { rule: { id: 'R2', box: [[4, 10], [0.1 + 0.2, 6]], allowed: [1, 2], origin: { kind: 'mined' } }, evidence },
  ],
};

describe('ruleSourceKind', () => {
  it('tells the three sources apart by extension, case-insensitively', () => {
    expect(['a.json', 'b.CSV', 'c.rules', 'd.txt', 'e'].map(ruleSourceKind)).toEqual(['rules-json', 'rules-csv', 'rule-file', 'rule-file', 'rule-file']);
  });
});

describe('readRuleSource', () => {
  it('reads back the boxes, advisories and ids of a rules.csv written by the report stage, exactly', () => {
    const { rules, warnings } = read('.csv', rulesCsvText(TABLE)).source();
    expect(warnings).toEqual([]);
    expect(rules.map((r) => [r.id, r.box, r.allowed])).toEqual(TABLE.rules.map(({ rule }) => [rule.id, rule.box, rule.allowed]));
  });

  it('reads a rules.json by input and advisory name, keeping the run hashes and evidence', () => {
    const { rules, run } = read('.json', rulesJsonText(TABLE)).source();
    expect(rules.map((r) => [r.id, r.box, r.allowed])).toEqual(TABLE.rules.map(({ rule }) => [rule.id, rule.box, rule.allowed]));
    expect(run?.modelSha256).toBe('b'.repeat(64));
    expect(run?.evidence.get('R2')).toEqual(evidence);
  });

  it('maps a rules.json whose inputs are listed in another order', () => {
    const doc = JSON.parse(rulesJsonText(TABLE));
    doc.inputs.reverse();
    expect(read('.json', JSON.stringify(doc)).source().rules[1]!.box).toEqual([[4, 10], [0.30000000000000004, 6]]);
  });

  it('clips csv bounds past the domain with a warning naming line and column', () => {
    const { rules, warnings } = read('.csv', 'id,advisory,x1_min,x1_max,x2_min,x2_max\nR1,A,-5,4,0,10\n').source();
    expect(rules[0]!.box).toEqual([[0, 4], [0, 10]]);
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatch(/line 2, column x1_min: x1 lower bound -5 is below the domain minimum 0, clipped to 0$/);
  });

  it('gives every csv problem at once, each with its line and column', () => {
    const text = [
      'id,advisory,x1_min,x1_max,x2_min,x2_max,status',
      'R1,A,0,4,0,10,proven',
      'R1,D,0,four,0,10,',
      'bad id,B or C,5,4,0,10,',
      'R4,A,0,4,11,12,',
    ].join('\n');
    expect(failure('.csv', text)).toMatchInlineSnapshot(`
      {
        "code": "RULES_CSV_INVALID",
        "message": "F line 3, column id: duplicate rule id 'R1', first used on line 2
      F line 3, column advisory: unknown advisory 'D', advisories are: A, B, C
      F line 3, column x1_max: expected a finite number, found 'four'
      F line 4, column id: expected a rule id (a letter or '_', then letters, digits, '_', '.', '-'), found 'bad id'
      F line 4, column x1_min: x1_min 5 > x1_max 4, the box is empty
      F line 5, column x2_min: x2 [11, 12] lies outside its domain [0, 10]",
        "name": "FileError",
      }
    `);
  });

  it('names missing columns, columns naming no input, and ragged rows', () => {
    expect(failure('.csv', 'id,advisory,x1_min,x1_max,x3_min\nR1,A,0,4,0\n')).toMatchInlineSnapshot(`
      {
        "code": "RULES_CSV_INVALID",
        "message": "F line 1: missing columns 'x2_min', 'x2_max'; expected columns: id, advisory, x1_min, x1_max, x2_min, x2_max
      F line 1: column 'x3_min' names no input of the scenario; inputs are: x1, x2",
        "name": "FileError",
      }
    `);
    expect(failure('.csv', 'id,advisory,x1_min,x1_max,x2_min,x2_max\nR1,A,0,4,0\n')).toMatchInlineSnapshot(`
      {
        "code": "CSV_INVALID",
        "message": "F line 2: 5 fields, the header has 6",
        "name": "FileError",
      }
    `);
  });

  it('names the rule and field of a bad rules.json', () => {
    const doc = JSON.parse(rulesJsonText(TABLE));
    doc.rules[1].allowed = ['B', 'Z'];
    expect(failure('.json', JSON.stringify(doc))).toMatchInlineSnapshot(`
      {
        "code": "RUN_INVALID",
        "message": "F: rules[1] ("R2"): allowed: unknown advisory "Z", advisories are: A, B, C",
        "name": "FileError",
      }
    `);
    doc.inputs[1].name = 'y';
    expect(failure('.json', JSON.stringify(doc))).toMatchInlineSnapshot(`
      {
        "code": "RUN_INVALID",
        "message": "F: the run's inputs (x1, y) differ from the scenario's (x1, x2); missing x2; unknown y",
        "name": "FileError",
      }
    `);
  });

  it('passes rule-file errors on with line and column', () => {
    expect(failure('.rules', 'R1: when x1 < 4 expect A\nR2: when x3 < 4 expect B\n')).toMatchInlineSnapshot(`
      {
        "code": "RULE_SYNTAX",
        "message": "F line 2, col 10: unknown input 'x3' (did you mean 'x1'?), inputs are: x1, x2",
        "name": "RuleFileError",
      }
    `);
  });
});
