/**
 * Atomic writes: a set of files is replaced all or nothing, no temporary is left behind, and the
 * process counts the files it has replaced (the interrupt message depends on that count).
 */
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { filesReplaced, writeFileAtomic, writeFilesAtomic } from '../../src/report/index.js';

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'specula-atomic-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

describe('writeFilesAtomic', () => {
  it('replaces every file, leaves no temporary and counts the replaced files', () => {
    writeFileSync(join(dir, 'a.txt'), 'old a');
    const before = filesReplaced();
    writeFilesAtomic([
      { path: join(dir, 'a.txt'), data: 'new a' },
      { path: join(dir, 'b.txt'), data: new Uint8Array([98]) },
    ]);
    expect(readFileSync(join(dir, 'a.txt'), 'utf8')).toBe('new a');
    expect(readFileSync(join(dir, 'b.txt'), 'utf8')).toBe('b');
    expect(readdirSync(dir).sort()).toEqual(['a.txt', 'b.txt']);
    expect(filesReplaced() - before).toBe(2);
  });

  it('leaves earlier outputs untouched and counts nothing when one file cannot be staged', () => {
    writeFileSync(join(dir, 'a.txt'), 'old a');
    writeFileSync(join(dir, 'blocker'), 'a file where a folder is needed');
    const before = filesReplaced();
    expect(() =>
      writeFilesAtomic([
        { path: join(dir, 'a.txt'), data: 'new a' },
        { path: join(dir, 'blocker', 'c.txt'), data: 'c' },
      ]),
    ).toThrow(/cannot write outputs/);
    expect(readFileSync(join(dir, 'a.txt'), 'utf8')).toBe('old a');
    expect(readdirSync(dir).sort()).toEqual(['a.txt', 'blocker']);
    expect(filesReplaced()).toBe(before);
  });

  it('writeFileAtomic counts one file', () => {
    const before = filesReplaced();
    writeFileAtomic(join(dir, 'one.txt'), 'x');
    expect(filesReplaced() - before).toBe(1);
  });
});
