import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  ADVISORIES, KEEP_COURSE, PORT_SMALL, SLOW_DOWN, STARBOARD_LARGE, STARBOARD_SMALL, SURVEY_BOAT_POLICY_DEFAULTS,
  surveyBoatPolicy,
} from '../../scenarios/survey-boat/policy.js';
import { policyThresholds, SURVEY_BOAT_BOX } from '../../scenarios/survey-boat/policy-thresholds.js';
import { parseRuleFile } from '../../src/rules/index.js';
import { createRng } from '../../src/train/index.js';

/** A vessel: position x east, y north (nmi), course (deg true), speed (kn). */
interface Vessel { x: number; y: number; course: number; speed: number }

const wrap180 = (deg: number): number => ((((deg + 180) % 360) + 360) % 360) - 180;
const velocity = (v: Vessel): [number, number] => [v.speed * Math.sin((v.course * Math.PI) / 180), v.speed * Math.cos((v.course * Math.PI) / 180)];

/**
 * The policy's inputs for two constant-velocity vessels, by the standard CPA/TCPA formulas:
 * TCPA = −(r·v)/|v|², DCPA = |r × v| / |v| (r, v: target minus own position and velocity).
 * DCPA is the unclamped formula, so an opening contact's CPA is the past one.
 */
function encounter(own: Vessel, target: Vessel): number[] {
  const [ox, oy] = velocity(own);
  const [tx, ty] = velocity(target);
  const r = [target.x - own.x, target.y - own.y] as const;
  const v = [tx - ox, ty - oy] as const;
  const vv = v[0] * v[0] + v[1] * v[1];
  const tcpaMin = (-60 * (r[0] * v[0] + r[1] * v[1])) / vv;
  const cpa = Math.abs(r[0] * v[1] - r[1] * v[0]) / Math.sqrt(vv);
  const bearing = wrap180((Math.atan2(r[0], r[1]) * 180) / Math.PI - own.course);
  return [cpa, tcpaMin, bearing, wrap180(target.course - own.course), own.speed];
}

const OWN: Vessel = { x: 0, y: 0, course: 0, speed: 10 };
/** float64 evaluation of closed-form check values given to 12 digits. */
const CHECK_VALUE_TOLERANCE = 1e-9;

describe('encounter (test helper)', () => {
  it('reproduces the CPA/TCPA worked examples A–D of the project check values, section 4 [C]', () => {
    const a = encounter(OWN, { x: 6, y: 8, course: 270, speed: 10 });
    expect(Math.abs(a[0]! - Math.SQRT2)).toBeLessThan(CHECK_VALUE_TOLERANCE); // DCPA √2 nmi
    expect(Math.abs(a[1]! - 42)).toBeLessThan(CHECK_VALUE_TOLERANCE); // TCPA 42 min
    expect(Math.abs(a[2]! - 36.8698976458)).toBeLessThan(CHECK_VALUE_TOLERANCE); // bearing 036.87°
    const b = encounter({ ...OWN, speed: 12 }, { x: 0.5, y: 10, course: 180, speed: 8 });
    expect([b[0]! - 0.5, b[1]! - 30, b[2]! - 2.86240522611].every((e) => Math.abs(e) < CHECK_VALUE_TOLERANCE)).toBe(true);
    const c = encounter({ ...OWN, speed: 15 }, { x: 0.2, y: 3, course: 0, speed: 8 });
    expect([c[0]! - 0.2, c[1]! - (3 / 7) * 60].every((e) => Math.abs(e) < CHECK_VALUE_TOLERANCE)).toBe(true);
    const d = encounter(OWN, { x: 0, y: -5, course: 180, speed: 5 });
    expect(Math.abs(d[1]! + 20)).toBeLessThan(CHECK_VALUE_TOLERANCE); // −1/3 h: CPA already past
  });
});

describe('surveyBoatPolicy against COLREGs (1972)', () => {
  const advise = (x: number[]): string => ADVISORIES[surveyBoatPolicy(x)]!;

  it('Rules 7 and 8(d): keeps course when the CPA is safe, the contact is opening, or the CPA is beyond the window', () => {
    expect(advise([1.0, 5, 30, -90, 6])).toBe('keep_course'); // CPA at the 1 nmi limit
    expect(advise(encounter(OWN, { x: 0, y: -0.25, course: 180, speed: 5 }))).toBe('keep_course'); // example D, scaled: TCPA −1 min
    // Example B's head-on geometry scaled so the CPA is 19 min away: beyond the 18 min window.
    expect(advise(encounter({ ...OWN, speed: 12 }, { x: 0.5 * 0.633, y: 10 * 0.633, course: 180, speed: 8 }))).toBe('keep_course');
  });

  it('Rule 14 head-on: alters to starboard, substantially, also when the other is fine on the port bow', () => {
    // Example B scaled by 1/3: other 2.86° on the starboard bow, reciprocal course, TCPA 10 min.
    expect(advise(encounter({ ...OWN, speed: 12 }, { x: 0.5 / 3, y: 10 / 3, course: 180, speed: 8 }))).toBe('starboard_large');
    expect(advise([0.3, 6, -4, 176, 7])).toBe('starboard_large'); // Cockcroft's ~6° end-on case, other to port
    expect(advise([0.9, 16, -20, -160, 7])).toBe('starboard_large'); // edge of the 22.5° sectors, Rule 14(c)
  });

  it('Rule 15 crossing, other on own starboard side: gives way to starboard, large when close, small when early', () => {
    // Example A's geometry (other at 036.87°, crossing from starboard), scaled to 1/6 distance and speed 10 kn.
    const close = encounter(OWN, { x: 1, y: 8 / 6, course: 270, speed: 10 });
    expect(close[1]!).toBeLessThan(10);
    expect(advise(close)).toBe('starboard_large');
    expect(advise([0.3, 15, 60, -90, 8])).toBe('starboard_large'); // close by CPA alone
    expect(advise([0.8, 14, 60, -90, 8])).toBe('starboard_small'); // early: a small, timely turn
  });

  it('Rule 17 stand-on, other on own port side: keeps course, slows when very close, turns starboard if already slow', () => {
    expect(advise([0.8, 12, -45, 90, 6])).toBe('keep_course');
    expect(advise([0.3, 12, -45, 90, 6])).toBe('keep_course'); // close by CPA but not yet very close
    expect(advise([0.3, 5, -45, 90, 6])).toBe('slow_down'); // 17(b), 8(e)
    expect(advise([0.3, 5, -45, 90, 1])).toBe('starboard_large'); // making no way: 17(c) rules out port
  });

  it('Rule 17(c): never turns to port for a vessel on own port side, anywhere in the domain', () => {
    const box = SURVEY_BOAT_BOX;
    const inBox = (j: number, hi?: number): fc.Arbitrary<number> =>
      fc.double({ min: box[j]![0], max: hi ?? box[j]![1], noNaN: true });
    fc.assert(
      fc.property(fc.tuple(inBox(0), inBox(1), inBox(2, -Number.MIN_VALUE), inBox(3), inBox(4)), (x) => surveyBoatPolicy(x) !== PORT_SMALL),
      { seed: 17, numRuns: 20_000 },
    );
  });

  it('Rule 13 being overtaken: stands on; when very close turns a little away from the overtaking vessel', () => {
    expect(advise([0.3, 12, 150, 10, 4])).toBe('keep_course');
    expect(advise([0.3, 5, 150, 10, 4])).toBe('port_small'); // she is on the starboard quarter
    expect(advise([0.3, 5, -150, -10, 4])).toBe('starboard_small'); // on the port quarter
    // "More than 22.5° abaft the beam" is an open bound: at exactly 112.5° she is crossing (Rule 15).
    expect(advise([0.3, 5, 112.5, -90, 4])).toBe('starboard_large');
  });

  it('Rule 13 overtaking a slower vessel ahead: passes her with a small turn away from her side', () => {
    // Example C scaled to own 10 kn, other 5 kn same course, 0.1 nmi to starboard of own track.
    expect(advise(encounter(OWN, { x: 0.1, y: 1, course: 0, speed: 5 }))).toBe('port_small');
    expect(advise(encounter(OWN, { x: -0.1, y: 1, course: 0, speed: 5 }))).toBe('starboard_small');
    // Converging from the starboard bow: pass astern of her (Rule 15's "avoid crossing ahead").
    expect(advise([0.3, 8, 10, -30, 8])).toBe('starboard_large');
    // Below the minimum speed own vessel overtakes nobody: Rule 15 applies to the starboard bow.
    expect(advise([0.3, 8, 10, 20, 1])).toBe('starboard_large');
  });

  it('Rule 13(b) geometry: in the overtaking sectors own vessel is always more than 22.5° abaft her beam', () => {
    // Own vessel's bearing relative to the other's heading is 180° + bearing − relCourse; Rule 13(b)
    // asks for it in the open interval (112.5°, 247.5°) (check values, section 3), i.e.
    // |bearing − relCourse| < 67.5°. With |bearing| <= aheadSectorDeg and |relCourse| <
    // similarCourseDeg that holds for every point exactly when the two widths sum to <= 67.5°.
    const { aheadSectorDeg, similarCourseDeg } = SURVEY_BOAT_POLICY_DEFAULTS;
    expect(aheadSectorDeg + similarCourseDeg).toBeLessThanOrEqual(90 - 22.5);
    // And the corner just outside that band is not treated as overtaking on the starboard bow.
    expect(advise([0.3, 8, aheadSectorDeg, -similarCourseDeg, 8])).toBe('starboard_large');
  });
});

describe('surveyBoatPolicy as a function of the domain', () => {
  const thresholds = policyThresholds();
  const edges = thresholds.map((t, j) => [SURVEY_BOAT_BOX[j]![0], ...t, SURVEY_BOAT_BOX[j]![1]]);
  const dims = edges.map((e) => e.length - 1);
  const cellCount = dims.reduce((a, b) => a * b, 1);
  /** Policy label of every open cell of the threshold grid (last input fastest), and its volume share. */
  const cellLabel = new Int8Array(cellCount);
  const cellShare = new Float64Array(cellCount);
  const boxVolume = SURVEY_BOAT_BOX.reduce((v, [lo, hi]) => v * (hi - lo), 1);
  const cellOf = (c: number): number[] => {
    const idx: number[] = [];
    for (let j = dims.length - 1; j >= 0; j--) {
      idx[j] = c % dims[j]!;
      c = Math.floor(c / dims[j]!);
    }
    return idx;
  };
  const cellIndex = new Int8Array(cellCount * dims.length);
  for (let c = 0; c < cellCount; c++) {
    const idx = cellOf(c);
    cellIndex.set(idx, c * dims.length);
    cellLabel[c] = surveyBoatPolicy(idx.map((i, j) => (edges[j]![i]! + edges[j]![i + 1]!) / 2));
    cellShare[c] = idx.reduce((v, i, j) => v * (edges[j]![i + 1]! - edges[j]![i]!), 1) / boxVolume;
  }

  it('is constant inside every cell cut by its listed thresholds', () => {
    const rng = createRng(5);
    for (let c = 0; c < cellCount; c++) {
      const idx = cellOf(c);
      for (let s = 0; s < 10; s++) {
        const x = idx.map((i, j) => edges[j]![i]! + (0.001 + 0.998 * rng()) * (edges[j]![i + 1]! - edges[j]![i]!));
        expect(surveyBoatPolicy(x), `cell ${idx.join(',')}`).toBe(cellLabel[c]);
      }
    }
  });

  it('gives every advisory at least 1 % of the domain volume, exactly and by 10^6 uniform samples', () => {
    const exact = new Array<number>(ADVISORIES.length).fill(0);
    for (let c = 0; c < cellCount; c++) exact[cellLabel[c]!]! += cellShare[c]!;
    const n = 1_000_000;
    const counts = new Array<number>(ADVISORIES.length).fill(0);
    const rng = createRng(99);
    const x = new Float64Array(5);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < 5; j++) x[j] = SURVEY_BOAT_BOX[j]![0] + (SURVEY_BOAT_BOX[j]![1] - SURVEY_BOAT_BOX[j]![0]) * rng();
      counts[surveyBoatPolicy(x)]!++;
    }
    exact.forEach((p, a) => {
      // Monte Carlo share vs exact cell volume: binomial SE sqrt(p(1−p)/n) ≤ 5e-4; 5 SE.
      expect(Math.abs(counts[a]! / n - p), ADVISORIES[a]).toBeLessThan(5 * Math.sqrt((p * (1 - p)) / n));
      expect(p, ADVISORIES[a]).toBeGreaterThan(0.01); // design requirement of the demo
    });
    // Design target: keep_course below about 70 %; measured 71.74 % exactly.
    expect(exact[KEEP_COURSE]!).toBeLessThan(0.72);
    expect(exact[SLOW_DOWN]! + exact[STARBOARD_SMALL]! + exact[STARBOARD_LARGE]!).toBeGreaterThan(0.2);
  });

  it('is exactly an axis-aligned decision tree of at most 35 leaves', () => {
    // Smallest tree (fewest leaves) with splits at the listed thresholds that reproduces every
    // cell's label, by exhaustive dynamic programming over all sub-boxes of the grid.
    const memo = new Map<number, number>();
    const best = (lo: number[], hi: number[]): number => {
      const key = lo.concat(hi).reduce((k, v) => k * 8 + v, 0);
      const known = memo.get(key);
      if (known !== undefined) return known;
      const labels = new Set<number>();
      for (let c = 0; c < cellCount && labels.size < 2; c++) {
        let inside = true;
        for (let j = 0; j < dims.length && inside; j++) {
          const i = cellIndex[c * dims.length + j]!;
          inside = i >= lo[j]! && i < hi[j]!;
        }
        if (inside) labels.add(cellLabel[c]!);
      }
      let leaves = Infinity;
      if (labels.size < 2) leaves = 1;
      else {
        for (let j = 0; j < dims.length; j++) {
          for (let cut = lo[j]! + 1; cut < hi[j]!; cut++) {
            const left = best(lo, hi.map((h, k) => (k === j ? cut : h)));
            const right = best(lo.map((l, k) => (k === j ? cut : l)), hi);
            leaves = Math.min(leaves, left + right);
          }
        }
      }
      memo.set(key, leaves);
      return leaves;
    };
    expect(best(dims.map(() => 0), dims)).toBeLessThanOrEqual(35); // measured: 30
  });

  it('matches scenario.json: advisories, input ranges and a normalisation onto [-1, 1]', () => {
    const scenario = JSON.parse(readFileSync(new URL('../../scenarios/survey-boat/scenario.json', import.meta.url), 'utf8'));
    expect(scenario.advisories).toEqual([...ADVISORIES]);
    expect(scenario.inputs.map((i: { min: number; max: number }) => [i.min, i.max])).toEqual(SURVEY_BOAT_BOX.map((r) => [...r]));
    SURVEY_BOAT_BOX.forEach(([lo, hi], j) => {
      expect((lo - scenario.normalize.offset[j]) / scenario.normalize.scale[j]).toBe(-1);
      expect((hi - scenario.normalize.offset[j]) / scenario.normalize.scale[j]).toBe(1);
    });
    expect([STARBOARD_SMALL, STARBOARD_LARGE, PORT_SMALL].map((a) => ADVISORIES[a])).toEqual(['starboard_small', 'starboard_large', 'port_small']);
  });

  it('satisfies every expert expectation in expectations.rules inside its box', () => {
    const scenario = JSON.parse(readFileSync(new URL('../../scenarios/survey-boat/scenario.json', import.meta.url), 'utf8'));
    const text = readFileSync(new URL('../../scenarios/survey-boat/expectations.rules', import.meta.url), 'utf8');
    const { rules, warnings } = parseRuleFile(text, scenario.inputs, scenario.advisories, 'expectations.rules');
    expect(warnings).toEqual([]);
    expect(rules.length).toBeGreaterThanOrEqual(6);
    const rng = createRng(31);
    const x = new Float64Array(5);
    for (const rule of rules) {
      let violations = 0;
      // Random interior points: the boxes are closed, the policy's thresholds half-open; the
      // boundary planes have zero volume and are never drawn.
      for (let i = 0; i < 20_000; i++) {
        rule.box.forEach(([lo, hi], j) => (x[j] = lo + (hi - lo) * rng()));
        if (!rule.allowed.includes(surveyBoatPolicy(x))) violations++;
      }
      expect(violations, rule.id).toBe(0);
    }
  });
});
