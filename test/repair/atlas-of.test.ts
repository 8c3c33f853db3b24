import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { boxNetwork2d } from '../fixtures/box-network.js';
import { proveBox } from '../../src/prove/index.js';
import { atlasOf, unionVolume } from '../../src/repair/index.js';
import { type LoadedNet, frozenClock, loadNet } from './helpers.js';

let n: LoadedNet;
beforeAll(async () => {
  n = await loadNet(boxNetwork2d());
});
afterAll(async () => {
  await n.model.close();
});

const prove = (box: Array<[number, number]>, allowed: number[]) =>
  proveBox(n.network, box, allowed, 'argmax', { maxBoxes: 5000, maxSeconds: 1e6, now: frozenClock, confirm: n.confirm });

describe('atlasOf', () => {
  it('lists the proven pieces of each proof with its advisories; a proven box is tiled exactly', async () => {
    // B holds for x1 >= 4, x2 < 6 (construction): [4.5, 10] × [0, 5.5] is proven
    const a = await prove([[4.5, 10], [0, 5.5]], [1]);
    // A or C on the right half: refuted at some point with B, after proving some pieces
    const b = await prove([[4.5, 10], [0, 10]], [2]);
    expect(a.status).toBe('proven');
    const atlas = atlasOf([{ allowed: [1], proof: a }, { allowed: [2], proof: b }]);
    expect(atlas.boxes).toHaveLength(a.provenBoxes.length + b.provenBoxes.length);
    const mine = atlas.boxes.filter((x) => x.advisory[0] === 1).map((x) => x.box);
    const area = mine.reduce((t, bx) => t + (bx[0]![1] - bx[0]![0]) * (bx[1]![1] - bx[1]![0]), 0);
    // pieces are halvings of the box: they tile it exactly (sums of binary fractions of 5.5·5.5)
    expect(area).toBe(5.5 * 5.5);
    expect(unionVolume(mine, [[0, 10], [0, 10]])).toBe(area);
    for (const x of atlas.boxes.filter((y) => y.advisory[0] === 2)) expect(x.box[1]![0]).toBeGreaterThanOrEqual(6);
  });
});
