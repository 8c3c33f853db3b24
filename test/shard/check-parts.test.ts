import { describe, expect, it } from 'vitest';
import { checkParts, makePartial, selectShard, type PartAt } from '../../src/shard/index.js';
import type { PartialRun } from '../../src/shard/index.js';
import { FileError } from '../../src/errors.js';
import { checked, run, table } from './helpers.js';

const WHOLE = [checked('R1', 0, 4, 'proven'), checked('R2', 2, 6, 'proven'), checked('R3', 6, 10, 'refuted'), checked('R4', 1, 2, 'sampled')];
const IDS = WHOLE.map((c) => c.rule.id);

/** The n parts of the line table, as the shards would write them (optionally with another run identity). */
function parts(n: number, over: Partial<PartialRun> = {}): PartAt[] {
  return Array.from({ length: n }, (_, i) => {
    const items = selectShard(WHOLE.map((c) => c.rule), { k: i + 1, n }, () => true);
    const part = makePartial(table(items.map((it) => WHOLE[it.index]!)), run(IDS, n, over), i + 1, items);
    return { path: `parts/shard-${i + 1}-of-${n}.json`, part };
  });
}

function failure(given: PartAt[]): { code: string; message: string } {
  try {
    checkParts(given);
  } catch (e) {
    expect(e).toBeInstanceOf(FileError);
    return { code: (e as FileError).code, message: (e as Error).message };
  }
  throw new Error('accepted');
}

describe('checkParts', () => {
  it('accepts the complete set of one run in any order', () => {
    const p = parts(3);
    expect(() => checkParts([p[2]!, p[0]!, p[1]!])).not.toThrow();
  });

  it('refuses parts of runs with another seed or another model, naming the file and the field', () => {
    const [a] = parts(2);
    const [, b] = parts(2, { seed: 7 });
    expect(failure([a!, b!])).toMatchInlineSnapshot(`
      {
        "code": "SHARD_MIXED",
        "message": "parts/shard-2-of-2.json: seed 7 differs from 1 in parts/shard-1-of-2.json; the parts are not from one run",
      }
    `);
    const [, c] = parts(2, { models: { model: 'd'.repeat(64) } });
    expect(failure([a!, c!]).message).toMatchInlineSnapshot(`"parts/shard-2-of-2.json: model SHA-256 dddddddddddd… differs from bbbbbbbbbbbb… in parts/shard-1-of-2.json; the parts are not from one run"`);
    const [, d] = parts(2, { settings: { checkSamples: 200 } });
    expect(failure([a!, d!]).message).toMatch(/^parts\/shard-2-of-2\.json: setting checkSamples 200 differs from 100 in/);
    const [, e] = parts(3);
    expect(failure([a!, e!]).message).toMatch(/shard count N 3 differs from 2/);
  });

  it('refuses the same shard twice, and a work item held by two parts', () => {
    const p = parts(2);
    expect(failure([p[0]!, p[1]!, { ...p[0]!, path: 'copy/shard-1-of-2.json' }])).toEqual({
      code: 'SHARD_OVERLAP',
      message: 'copy/shard-1-of-2.json: shard 1/2 is also given as parts/shard-1-of-2.json',
    });
    const stolen = { path: p[1]!.path, part: { ...p[1]!.part, items: [...p[1]!.part.items, { index: 0, id: 'R1', results: 0 }] } };
    expect(failure([p[0]!, stolen])).toEqual({ code: 'SHARD_OVERLAP', message: 'parts/shard-2-of-2.json: work item 0 (R1) is also in parts/shard-1-of-2.json' });
  });

  it('refuses a missing shard, naming its file, and a work list that differs from the run\'s', () => {
    const p = parts(4);
    expect(failure([p[0]!, p[1]!, p[3]!])).toEqual({
      code: 'SHARD_MISSING',
      message: 'missing 1 of 4 parts: shard-3-of-4.json (given: parts/shard-1-of-4.json, parts/shard-2-of-4.json, parts/shard-4-of-4.json)',
    });
    const q = parts(2);
    const renamed = { path: q[1]!.path, part: { ...q[1]!.part, items: q[1]!.part.items.map((it) => ({ ...it, id: it.id + 'x' })) } };
    expect(failure([q[0]!, renamed]).code).toBe('SHARD_MIXED');
    const dropped = { path: q[1]!.path, part: { ...q[1]!.part, items: q[1]!.part.items.slice(1) } };
    expect(failure([q[0]!, dropped])).toMatchObject({ code: 'SHARD_MISSING', message: expect.stringMatching(/^work item 1 of 4 is in no part/) });
  });
});
