/**
 * An interrupted run (Ctrl-C at the terminal) exits 130, leaves no half-written or temporary
 * file, and leaves the earlier run folder byte for byte.
 *
 * The CLI runs as a real process on a pseudo-terminal (util-linux `script`), as a user runs it:
 * on a terminal it prints each stage's name to stderr, so the test waits for a stage to start
 * and then types Ctrl-C (byte 0x03), which the terminal turns into SIGINT for the process.
 * The command runs from source through tsx, so no build is needed.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { copyFileSync, mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { FAST_MINE, runCli } from './helpers/run-cli.js';

const BIN = resolve('src/cli/bin.ts');
const TSX = pathToFileURL(createRequire(import.meta.url).resolve('tsx')).href;
let dir = '';
/** The earlier run folder's files and their bytes. */
let before = new Map<string, Buffer>();

const snapshot = (folder: string): Map<string, Buffer> =>
  new Map(readdirSync(folder).sort().map((f) => [f, readFileSync(join(folder, f))] as const));

/** Every file under a folder, recursively, relative to it. */
const listing = (folder: string): string[] => (readdirSync(folder, { recursive: true }) as string[]).sort();

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'specula-interrupt-'));
  copyFileSync(resolve('scenarios/cruise-spacing/scenario.json'), join(dir, 'scenario.json'));
  copyFileSync(resolve('scenarios/cruise-spacing/model.onnx'), join(dir, 'model.onnx'));
  expect((await runCli(['mine', 'scenario.json', '--out', 'run', ...FAST_MINE.filter((a) => a !== '--no-report')], dir)).code).toBe(0);
  before = snapshot(join(dir, 'run'));
});

/**
 * Starts `specula mine` on a terminal, types Ctrl-C as soon as `stage…` appears, and resolves
 * with the exit code (as `script -e` reports the command's) and everything the terminal showed.
 */
function interruptAt(stage: string, args: readonly string[]): Promise<{ code: number | null; shown: string }> {
  const quote = (s: string): string => `'${s.replace(/'/g, `'\\''`)}'`;
  const command = [process.execPath, '--import', TSX, BIN, 'mine', 'scenario.json', '--out', 'run', ...args].map(quote).join(' ');
  const child = spawn('script', ['-qfec', command, '/dev/null'], { cwd: dir, stdio: ['pipe', 'pipe', 'pipe'] });
  let shown = '';
  let sent = false;
  child.stdout.on('data', (chunk: Buffer) => {
    shown += chunk.toString();
    if (!sent && shown.includes(`${stage}…`)) {
      sent = true;
      child.stdin.write('\x03');
    }
  });
  return new Promise((done) => child.on('close', (code) => done({ code, shown })));
}

describe('an interrupted mine', () => {
  // Budgets large enough that each stage lasts seconds, so the interrupt lands inside it.
  const cases: Array<[string, string[]]> = [
    ['sampling', ['--samples', '3000000', '--no-prove', '--no-report']],
    ['checking', ['--samples', '20000', '--check-samples', '400000', '--no-prove', '--no-report']],
    ['fidelity', ['--samples', '20000', '--check-samples', '200', '--fidelity-samples', '20000000', '--no-prove', '--no-report']],
  ];
  for (const [stage, args] of cases) {
    it(`during ${stage}: exits 130, the earlier run folder is untouched, no temporary file is left`, async () => {
      const { code, shown } = await interruptAt(stage, args);
      expect(shown).toContain(`${stage}…`);
      expect(shown).toContain('interrupted (SIGINT)');
      expect(code).toBe(130);
      const after = snapshot(join(dir, 'run'));
      expect([...after.keys()]).toEqual([...before.keys()]);
      for (const [file, bytes] of before) expect(after.get(file)!.equals(bytes), file).toBe(true);
      expect(listing(dir).filter((f) => f.includes('.tmp'))).toEqual([]);
    });
  }
});
