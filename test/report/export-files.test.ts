import { spawnSync } from 'node:child_process';
import { appendFileSync, existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import type { CliIo } from '../../src/cli/io.js';
import { exportFiles, fromRulesJson, sha256Sums } from '../../src/report/export/index.js';
import { CAUTIONS, rulesCsvText, rulesJsonText, rulesMdText, toRulesJson } from '../../src/report/index.js';
import { fixtureTable, writeFixtureRun } from '../browser/report-fixture.js';

function capture(cwd: string): { io: CliIo; out: () => string; err: () => string } {
  let out = '';
  let err = '';
  return { io: { stdout: (t) => (out += t), stderr: (t) => (err += t), isTTY: false, cwd }, out: () => out, err: () => err };
}

const hasSha256sum = spawnSync('sha256sum', ['--version']).status === 0;

describe('fromRulesJson', () => {
  it('rebuilds the table that toRulesJson wrote', () => {
    const table = fixtureTable();
    expect(fromRulesJson(toRulesJson(table))).toEqual(table);
  });
});

describe('exportFiles', () => {
  const table = fixtureTable();
  const doc = toRulesJson(table);
  const text = rulesJsonText(table);

  it('csv: rules.csv as the run writes it, and CAUTIONS.txt with every caution and the model hash', () => {
    const files = exportFiles('csv', { doc, rulesJsonText: text });
    expect(files.map((f) => f.path)).toEqual(['rules.csv', 'CAUTIONS.txt']);
    expect(files[0]!.data).toBe(rulesCsvText(table));
    const cautions = String(files[1]!.data);
    for (const c of CAUTIONS) expect(cautions).toContain(c);
    expect(cautions).toContain(table.manifest.model.sha256);
    for (const inp of table.inputs) expect(cautions).toContain(`${inp.name}_min, ${inp.name}_max`);
  });

  it('md and json: the run\'s Markdown table and its rules.json byte for byte', () => {
    expect(exportFiles('md', { doc, rulesJsonText: text })).toEqual([{ path: 'rules.md', data: rulesMdText(table) }]);
    expect(exportFiles('json', { doc, rulesJsonText: 'exact text' })).toEqual([{ path: 'rules.json', data: 'exact text' }]);
  });

  it('smtlib: one query per rule, named after the rule', () => {
    expect(exportFiles('smtlib', { doc, rulesJsonText: text }).map((f) => f.path)).toEqual(['R1.smt2', 'R2.smt2', 'R3.smt2', 'R4.smt2', 'R5.smt2', 'R6.smt2']);
  });

  it('bundle: refuses to go without report.html', () => {
    expect(() => exportFiles('bundle', { doc, rulesJsonText: text })).toThrow('export bundle: report.html is needed and was not built');
  });

  it('SHA256SUMS lines: 64 hex digits, two spaces, the path; sorted by path', () => {
    // SHA-256("abc") from FIPS 180-2, Appendix B.1
    expect(sha256Sums([{ path: 'b/x.txt', data: 'abc' }, { path: 'a.txt', data: new Uint8Array([0x61, 0x62, 0x63]) }])).toBe(
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad  a.txt\n' +
        'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad  b/x.txt\n',
    );
  });
});

describe('specula export', () => {
  it('writes the csv export with its cautions beside it', async () => {
    const run = writeFixtureRun();
    const c = capture(run.dir);
    expect(await main(['export', run.dir, '--format', 'csv'], c.io)).toBe(0);
    expect(c.out()).toBe('wrote 2 files to export-csv\n');
    const dir = join(run.dir, 'export-csv');
    expect(readdirSync(dir).sort()).toEqual(['CAUTIONS.txt', 'rules.csv']);
    expect(readFileSync(join(dir, 'rules.csv'), 'utf8')).toBe(readFileSync(join(run.dir, 'rules.csv'), 'utf8'));
  });

  it('writes one SMT-LIB query per rule into --out', async () => {
    const run = writeFixtureRun();
    const c = capture(run.dir);
    expect(await main(['export', run.dir, '--format', 'smtlib', '--out', 'smt', '--json'], c.io)).toBe(0);
    const report = JSON.parse(c.out()) as { files: string[] };
    expect(report.files.map((f) => f.slice(run.dir.length + 1))).toEqual(run.table.rules.map((r) => join('smt', `${r.rule.id}.smt2`)));
  });

  it('refuses an unknown format with exit code 2', async () => {
    const run = writeFixtureRun();
    const c = capture(run.dir);
    expect(await main(['export', run.dir, '--format', 'pdf'], c.io)).toBe(2);
    expect(c.err()).toContain('Invalid values');
  });

  it.skipIf(!hasSha256sum)(`writes a bundle that \`sha256sum -c SHA256SUMS\` verifies, and fails once a file changes${hasSha256sum ? '' : ' (skipped: sha256sum is missing)'}`, async () => {
    const run = writeFixtureRun();
    const c = capture(run.dir);
    expect(await main(['export', run.dir, '--format', 'bundle', '--grid', '8'], c.io)).toBe(0);
    const dir = join(run.dir, 'export-bundle');
    for (const f of ['rules.json', 'rules.csv', 'CAUTIONS.txt', 'rules.md', 'report.html', 'SHA256SUMS', 'smtlib/R1.smt2', 'smtlib/R6.smt2']) {
      expect(existsSync(join(dir, f)), f).toBe(true);
    }
    expect(readFileSync(join(dir, 'rules.json'), 'utf8')).toBe(readFileSync(join(run.dir, 'rules.json'), 'utf8'));
    const sums = readFileSync(join(dir, 'SHA256SUMS'), 'utf8').trimEnd().split('\n');
    expect(sums).toHaveLength(5 + run.table.rules.length);
    // GNU coreutils sha256sum (an outside implementation) checks every listed file
    const ok = spawnSync('sha256sum', ['-c', 'SHA256SUMS'], { cwd: dir, encoding: 'utf8' });
    expect(ok.status, ok.stderr).toBe(0);
    expect(ok.stdout.trimEnd().split('\n')).toEqual(sums.map((l) => `${l.slice(66)}: OK`));
    appendFileSync(join(dir, 'rules.md'), 'edited\n');
    const bad = spawnSync('sha256sum', ['-c', 'SHA256SUMS'], { cwd: dir, encoding: 'utf8' });
    expect(bad.status).not.toBe(0);
    expect(bad.stdout).toContain('rules.md: FAILED');
  });
});
