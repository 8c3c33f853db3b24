import { describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { makePartial, partialJsonText, readPartial, selectShard } from '../../src/shard/index.js';
import { checked, run, table } from './helpers.js';

const dir = mkdtempSync(join(tmpdir(), 'specula-partial-'));
function file(name: string, text: string): string {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
}
function message(path: string): string {
  try {
    readPartial(path);
  } catch (e) {
    return (e as Error).message.replace(dir + '/', '');
  }
  throw new Error('accepted');
}

describe('readPartial', () => {
  it('reads back what a shard writes', () => {
    const rules = [checked('R1', 0, 4, 'proven'), checked('R2', 4, 8, 'refuted')];
    const items = selectShard(rules.map((c) => c.rule), { k: 1, n: 1 }, () => true);
    const part = makePartial(table(rules), run(['R1', 'R2'], 1), 1, items);
    expect(readPartial(file('ok.json', partialJsonText(part)))).toEqual(JSON.parse(partialJsonText(part)));
  });

  it('names the file and the problem: missing, not JSON, another format, a broken outline', () => {
    expect(message(join(dir, 'none.json'))).toBe('none.json: cannot read the partial result (no such file)');
    expect(message(file('bad.json', '{'))).toMatch(/^bad\.json: not valid JSON/);
    expect(message(file('rules.json', JSON.stringify({ format: 'specula-rules', formatVersion: 1 })))).toBe(
      'rules.json: expected format "specula-partial" version 1, found "specula-rules" version 1',
    );
    const base = { format: 'specula-partial', formatVersion: 1, run: { shards: 2 }, shard: 3, items: [], table: { rules: [] } };
    expect(message(file('k.json', JSON.stringify(base)))).toBe('k.json: shard: expected a whole number in [1, 2], found 3');
    expect(message(file('n.json', JSON.stringify({ ...base, shard: 1, items: [{ index: 0, id: 'R1', results: 1 }] })))).toBe(
      'n.json: items hold 1 result rules, table.rules has 0',
    );
  });
});
