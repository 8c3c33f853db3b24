import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatRules } from '../../src/rules/format-rules.js';
import { parseRules } from '../../src/rules/parse-rules.js';
import type { InputSpec, Rule } from '../../src/types.js';
import { BOAT_ADVISORIES, BOAT_INPUTS } from './survey-boat.js';

/** -0 prints as 0 (the same point), so generated bounds use +0. */
const noNegativeZero = (v: number): number => (v === 0 ? 0 : v);

/** A scenario with 1–5 inputs on domains of any scale, and 1–6 advisories. */
const scenario = fc
  .record({
    domains: fc.array(
      fc.record({ scale: fc.integer({ min: -12, max: 12 }), a: fc.double({ min: -1, max: 1, noNaN: true }), b: fc.double({ min: -1, max: 1, noNaN: true }) }),
      { minLength: 1, maxLength: 5 },
    ),
    advisoryCount: fc.integer({ min: 1, max: 6 }),
  })
  .filter(({ domains }) => domains.every(({ a, b }) => a !== b))
  .map(({ domains, advisoryCount }) => ({
    inputs: domains.map(({ scale, a, b }, f): InputSpec => ({
      name: `in_${f}`,
      unit: '',
      min: noNegativeZero(Math.min(a, b) * 10 ** scale),
      max: noNegativeZero(Math.max(a, b) * 10 ** scale),
      description: '',
    })),
    advisories: Array.from({ length: advisoryCount }, (_, k) => `adv_${k}`),
  }));

/** Rules with random ids, boxes (each side either the domain bound or a value inside) and allowed sets. */
const rulesFor = (inputs: readonly InputSpec[], advisories: readonly string[]): fc.Arbitrary<Rule[]> => {
  const interval = (i: InputSpec) =>
    fc.tuple(fc.boolean(), fc.boolean(), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })).map(([cutLo, cutHi, u, v]) => {
      const inside = (w: number): number => noNegativeZero(Math.min(i.max, Math.max(i.min, i.min + w * (i.max - i.min))));
      const [p, q] = [inside(Math.min(u, v)), inside(Math.max(u, v))];
      return [cutLo ? p : i.min, cutHi ? q : i.max] as const;
    });
  const rule = fc.record({
    box: fc.tuple(...inputs.map(interval)),
    allowed: fc.subarray(advisories.map((_, k) => k), { minLength: 1 }),
  });
  const id = fc.stringMatching(/^[A-Za-z_][A-Za-z0-9_]{0,5}$/);
  return fc
    .uniqueArray(id, { maxLength: 8 })
    .chain((ids) => fc.tuple(...ids.map(() => rule)).map((rs) => rs.map((r, k): Rule => ({ id: ids[k]!, ...r, origin: { kind: 'mined' } }))));
};

describe('parseRules', () => {
  it('reads back what formatRules wrote: same ids, boxes and allowed sets', () => {
    fc.assert(
      fc.property(
        scenario.chain((s) => rulesFor(s.inputs, s.advisories).map((rules) => ({ ...s, rules }))),
        ({ inputs, advisories, rules }) => {
          const back = parseRules(formatRules(rules, inputs, advisories), inputs, advisories);
          const content = (rs: readonly Rule[]) => rs.map(({ id, box, allowed }) => ({ id, box, allowed }));
          expect(content(back)).toEqual(content(rules));
        },
      ),
      { seed: 1859, numRuns: 400 },
    );
  });

  it('returns only the rules, dropping clipping warnings', () => {
    const rules = parseRules('R1: when cpa_nm < 9 expect keep_course', BOAT_INPUTS, BOAT_ADVISORIES);
    expect(rules.map((r) => [r.id, r.box[0], r.allowed])).toEqual([['R1', [0, 1.5], [0]]]);
  });
});
