/**
 * Files saved by Windows editors are read: scenario.json and rule files (.rules, rules.json,
 * rules.csv) with CRLF line ends and a UTF-8 byte-order mark give the same results as the plain
 * files. (Notepad and Excel write both; a BOM is U+FEFF encoded as EF BB BF.)
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { copyFileSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { FAST_MINE, runCli } from './helpers/run-cli.js';

const BOM = Buffer.from([0xef, 0xbb, 0xbf]);
/** The file's bytes as a Windows editor saves them: CRLF line ends and a byte-order mark. */
const windows = (file: string): Buffer => Buffer.concat([BOM, Buffer.from(readFileSync(file, 'utf8').replace(/\r?\n/g, '\r\n'))]);
const CHECK = ['--check-samples', '300', '--no-prove', '--no-report', '--json'];

/** What a run concluded, without the parts that name the files read or the time. */
function conclusions(stdout: string): unknown {
  const doc = JSON.parse(stdout) as { rules: Array<{ id: string; text: string; evidence: { status: string; violations: number } }> };
  return doc.rules.map((r) => [r.id, r.text, r.evidence.status, r.evidence.violations]);
}

let dir = '';

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'specula-crlf-'));
  copyFileSync(resolve('scenarios/cruise-spacing/scenario.json'), join(dir, 'scenario.json'));
  copyFileSync(resolve('scenarios/cruise-spacing/model.onnx'), join(dir, 'model.onnx'));
  copyFileSync(resolve('scenarios/cruise-spacing/expectations.rules'), join(dir, 'expectations.rules'));
  expect((await runCli(['mine', 'scenario.json', '--out', 'run', ...FAST_MINE], dir)).code).toBe(0);
});

async function sameAsPlain(command: string, plain: string, saved: string, extra: readonly string[]): Promise<void> {
  const a = await runCli([command, ...(command === 'mine' ? [plain] : ['scenario.json', plain]), '--out', 'plain', ...extra], dir);
  const b = await runCli([command, ...(command === 'mine' ? [saved] : ['scenario.json', saved]), '--out', 'saved', ...extra], dir);
  expect(b.err).toBe('');
  expect(b.code).toBe(a.code);
  expect(conclusions(b.out)).toEqual(conclusions(a.out));
}

describe('files with CRLF line ends and a UTF-8 byte-order mark', () => {
  it('scenario.json: mine gives the same rules', async () => {
    writeFileSync(join(dir, 'windows.json'), windows(join(dir, 'scenario.json')));
    await sameAsPlain('mine', 'scenario.json', 'windows.json', [...FAST_MINE, '--json']);
  });

  it('a .rules file: check gives the same results', async () => {
    writeFileSync(join(dir, 'windows.rules'), windows(join(dir, 'expectations.rules')));
    await sameAsPlain('check', 'expectations.rules', 'windows.rules', CHECK);
  });

  it('a .rules file with old Mac line ends (CR only): check gives the same results', async () => {
    writeFileSync(join(dir, 'mac.rules'), readFileSync(join(dir, 'expectations.rules'), 'utf8').replace(/\n/g, '\r'));
    await sameAsPlain('check', 'expectations.rules', 'mac.rules', CHECK);
  });

  it('a run\'s rules.csv, as a spreadsheet saves it: check gives the same results', async () => {
    writeFileSync(join(dir, 'windows.csv'), windows(join(dir, 'run', 'rules.csv')));
    await sameAsPlain('check', join('run', 'rules.csv'), 'windows.csv', CHECK);
  });

  it('a run\'s rules.json, as a Windows editor saves it: check gives the same results', async () => {
    writeFileSync(join(dir, 'windows-rules.json'), windows(join(dir, 'run', 'rules.json')));
    await sameAsPlain('check', join('run', 'rules.json'), 'windows-rules.json', CHECK);
  });
});
