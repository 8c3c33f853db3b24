import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ToolError } from '../../src/errors.js';
import { repairRule } from '../../src/repair/index.js';
import type { Rule } from '../../src/types.js';
import { type LoadedNet, frozenClock, loadNet, pocketNetwork } from './helpers.js';

let n: LoadedNet;
beforeAll(async () => {
  n = await loadNet(pocketNetwork());
});
afterAll(async () => {
  await n.model.close();
});

const rule = (box: Array<[number, number]>, allowed: number[]): Rule => ({ id: 'R9', box, allowed, origin: { kind: 'mined' } });
const base = () => ({ confirm: n.confirm, now: frozenClock, maxSeconds: 10, maxBoxesPerProof: 100 });
async function failure(run: () => Promise<unknown>): Promise<ToolError> {
  try {
    await run();
  } catch (error) {
    if (error instanceof ToolError) return error;
    throw error;
  }
  throw new Error('expected a ToolError');
}

describe('checkRepairInput (through repairRule)', () => {
  it('names the rule and what was found for a box of the wrong width', async () => {
    const e = await failure(() => repairRule(n.network, rule([[0, 1]], [0]), n.scenario, base()));
    expect(e.code).toBe('REPAIR_RULE');
    expect(e.message).toMatchInlineSnapshot(`"rule R9: expected 2 input ranges (scenario) for a network of 2 inputs, found 1"`);
  });

  it('refuses inverted ranges and unknown advisories', async () => {
    const inverted = await failure(() => repairRule(n.network, rule([[0, 1], [5, 4]], [0]), n.scenario, base()));
    expect(inverted.message).toMatchInlineSnapshot(`"rule R9: x2: expected finite min <= max, found [5, 4]"`);
    const advisory = await failure(() => repairRule(n.network, rule([[0, 1], [0, 1]], [2]), n.scenario, base()));
    expect(advisory.message).toMatchInlineSnapshot(`"rule R9: allowed advisories must be indices in 0..1, found [2]"`);
  });

  it('refuses budgets and shares out of range', async () => {
    const r = rule([[0, 1], [0, 1]], [0]);
    const boxes = await failure(() => repairRule(n.network, r, n.scenario, { ...base(), maxBoxesPerProof: 0 }));
    expect(boxes.code).toBe('REPAIR_OPTION');
    expect(boxes.message).toMatchInlineSnapshot(`"repair of R9: maxBoxesPerProof: expected a whole number >= 1, found 0"`);
    const share = await failure(() => repairRule(n.network, r, n.scenario, { ...base(), minVolumeShare: 1.5 }));
    expect(share.message).toMatchInlineSnapshot(`"repair of R9: minVolumeShare: expected a share in [0, 1], found 1.5"`);
  });
});
