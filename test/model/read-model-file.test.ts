import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ModelError } from '../../src/errors.js';
import { readModelFile } from '../../src/model/read-model-file.js';

describe('readModelFile', () => {
  it('returns the bytes and their SHA-256 as coreutils sha256sum computes it', () => {
    const path = join(mkdtempSync(join(tmpdir(), 'specula-model-')), 'model.onnx');
    writeFileSync(path, Uint8Array.from([8, 7, 18, 0, 1, 2, 3]));
    const r = readModelFile(path);
    // independent implementation: GNU coreutils sha256sum
    expect(r.sha256).toBe(execFileSync('sha256sum', [path], { encoding: 'utf8' }).split(' ')[0]);
    expect(Array.from(r.bytes)).toEqual([8, 7, 18, 0, 1, 2, 3]);
  });

  it('gives MODEL_UNREADABLE for a folder', () => {
    const dir = mkdtempSync(join(tmpdir(), 'specula-model-'));
    expect(() => readModelFile(dir)).toThrow(new ModelError('MODEL_UNREADABLE', `${dir}: cannot read the model file (it is a folder, not a file)`));
  });
});
