import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  ADVISORIES, BRAKE, BRAKE_HARD, CRUISE_SPACING_POLICY_DEFAULTS, EASE_OFF, HOLD, SPEED_UP, cruiseSpacingPolicy,
} from '../../scenarios/cruise-spacing/policy.js';
import { CRUISE_SPACING_BOX, policyBoundaries } from '../../scenarios/cruise-spacing/policy-boundaries.js';
import { parseRuleFile } from '../../src/rules/index.js';
import { createRng } from '../../src/train/index.js';

const advise = (gap: number, speed: number, closing: number): string => ADVISORIES[cruiseSpacingPolicy([gap, speed, closing])]!;
/** 45 mph in m/s (1 mph = 0.44704 m/s exactly, by the international yard of 1959). */
const MPH_45 = 45 * 0.44704;
/** float64 evaluation of closed-form check values; the inputs are exact to ~1e-15. */
const CHECK_VALUE_TOLERANCE = 1e-12;

const inBox = (j: number): fc.Arbitrary<number> => fc.double({ min: CRUISE_SPACING_BOX[j]![0], max: CRUISE_SPACING_BOX[j]![1], noNaN: true });
const anyPoint = fc.tuple(inBox(0), inBox(1), inBox(2));

describe('cruiseSpacingPolicy against the published thresholds', () => {
  it('reproduces the worked example of the check values, section 5: 40 m, 25 m/s behind 15 m/s is TTC 4.0 s and time gap 1.6 s [C]', () => {
    const [gap, speed, lead] = [40, 25, 15];
    expect(Math.abs(gap / (speed - lead) - 4)).toBeLessThan(CHECK_VALUE_TOLERANCE);
    expect(Math.abs(gap / speed - 1.6)).toBeLessThan(CHECK_VALUE_TOLERANCE);
    // TTC exactly 4 s is not below the 4 s critical-following threshold, and 1.6 s is inside the
    // held band 1.5–2.2 s: hold. One metre closer the TTC is 3.9 s: ease off.
    expect(advise(gap, speed, speed - lead)).toBe('hold');
    expect(advise(gap - 1, speed, speed - lead)).toBe('ease_off');
  });

  it('NHTSA FCW test, lead vehicle stopped (LVS), subject at 45 mph: brakes before TTC 2.1 s [seen]', () => {
    const atDeadline = 2.1 * MPH_45; // the gap at which the warning is due: 42.25 m
    expect(advise(atDeadline - 0.01, MPH_45, MPH_45)).toBe('brake');
    expect(advise(atDeadline + 0.01, MPH_45, MPH_45)).toBe('ease_off'); // TTC just above 2.1 s
    expect(advise(1.5 * MPH_45 - 0.01, MPH_45, MPH_45)).toBe('brake_hard'); // serious conflict, TTC < 1.5 s
  });

  it('NHTSA FCW test, lead moving slower (LVM, 45 vs 20 mph) at TTC 2.0 s [from memory]: brakes', () => {
    const closing = (45 - 20) * 0.44704;
    expect(advise(2.0 * closing, MPH_45, closing)).toBe('brake');
  });

  it('ISO 15622 minimum time gap 0.8 s [from memory]: below it never holds or speeds up, and brakes while closing', () => {
    fc.assert(
      fc.property(anyPoint, ([gap, speed, closing]) => {
        if (!(gap < CRUISE_SPACING_POLICY_DEFAULTS.minTimeGapS * speed)) return true;
        const a = cruiseSpacingPolicy([gap, speed, closing]);
        return closing > 0 ? a === BRAKE || a === BRAKE_HARD : a === EASE_OFF;
      }),
      { seed: 15622, numRuns: 20_000 },
    );
    expect(advise(15, 20, -2)).toBe('ease_off'); // 0.75 s, the gap opening
  });

  it('TTC below 1.5 s (van der Horst 1990, from memory) brakes hard; below 2.1 s (NHTSA LVS, seen) at least brakes', () => {
    fc.assert(
      fc.property(anyPoint, ([gap, speed, closing]) => {
        const a = cruiseSpacingPolicy([gap, speed, closing]);
        if (closing > 0 && gap < 1.5 * closing) return a === BRAKE_HARD;
        if (closing > 0 && gap < 2.1 * closing) return a === BRAKE;
        return a !== BRAKE_HARD;
      }),
      { seed: 2101, numRuns: 20_000 },
    );
  });

  it('speeds up only with a time gap above 2.2 s (ISO 15622 selectable range, from memory) and the gap not shrinking', () => {
    fc.assert(
      fc.property(anyPoint, ([gap, speed, closing]) => {
        const speedsUp = cruiseSpacingPolicy([gap, speed, closing]) === SPEED_UP;
        return speedsUp === (gap > 2.2 * speed && closing <= 0);
      }),
      { seed: 22, numRuns: 20_000 },
    );
    expect(advise(40, 20, 0)).toBe('hold'); // 2.0 s, inside the band 1.5–2.2 s
    expect(advise(80, 20, 0.5)).toBe('hold'); // 4 s gap but closing slowly: TTC 160 s
  });
});

/**
 * Length of the gap interval [0, 120] m given each advisory, at fixed own and closing speed:
 * along the gap axis the policy changes only at its boundary planes, so it is constant between
 * consecutive crossings and one evaluation per piece is exact.
 */
function lengthsAlongGap(speed: number, closing: number, out: Float64Array): void {
  const [lo, hi] = CRUISE_SPACING_BOX[0]!;
  const cuts = [lo, hi];
  for (const b of policyBoundaries()) if (b.against !== -1) cuts.push(b.ratio * (b.against === 1 ? speed : closing));
  const sorted = cuts.filter((g) => g >= lo && g <= hi).sort((a, b) => a - b);
  for (let i = 0; i + 1 < sorted.length; i++) {
    const a = sorted[i]!;
    const b = sorted[i + 1]!;
    if (b > a) out[cruiseSpacingPolicy([(a + b) / 2, speed, closing])]! += b - a;
  }
}

/** Volume share of each advisory: exact along the gap, midpoint rule over (speed, closing) on m × m cells. */
function volumeShares(m: number): number[] {
  const [[g0, g1], [v0, v1], [c0, c1]] = CRUISE_SPACING_BOX as [[number, number], [number, number], [number, number]];
  const acc = new Float64Array(ADVISORIES.length);
  for (let i = 0; i < m; i++) {
    for (let k = 0; k < m; k++) lengthsAlongGap(v0 + ((i + 0.5) * (v1 - v0)) / m, c0 + ((k + 0.5) * (c1 - c0)) / m, acc);
  }
  return Array.from(acc, (l) => l / (m * m * (g1 - g0)));
}

describe('cruiseSpacingPolicy as a function of the domain', () => {
  it('gives every advisory at least 1 % of the domain volume, by quadrature and by 10^6 uniform samples', () => {
    const fine = volumeShares(800);
    const coarse = volumeShares(400);
    // The integrand is piecewise linear with kinks along a few lines; halving the cell changes
    // the shares by under 1e-5 (measured 2e-7), so the fine figures are good to that.
    const QUADRATURE_CONVERGENCE = 1e-5;
    fine.forEach((p, a) => expect(Math.abs(p - coarse[a]!), ADVISORIES[a]).toBeLessThan(QUADRATURE_CONVERGENCE));
    const n = 1_000_000;
    const counts = new Array<number>(ADVISORIES.length).fill(0);
    const rng = createRng(99);
    const x = new Float64Array(3);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < 3; j++) x[j] = CRUISE_SPACING_BOX[j]![0] + (CRUISE_SPACING_BOX[j]![1] - CRUISE_SPACING_BOX[j]![0]) * rng();
      counts[cruiseSpacingPolicy(x)]!++;
    }
    fine.forEach((p, a) => {
      // Monte Carlo share vs quadrature: binomial SE sqrt(p(1−p)/n) ≤ 5e-4; 5 SE.
      expect(Math.abs(counts[a]! / n - p), ADVISORIES[a]).toBeLessThan(5 * Math.sqrt((p * (1 - p)) / n));
      expect(p, ADVISORIES[a]).toBeGreaterThan(0.01); // design requirement of the demo
    });
    // the pieces tile [0, 120] m at every cell: the shares sum to 1 up to float64 rounding
    expect(Math.abs(fine.reduce((s, p) => s + p, 0) - 1)).toBeLessThan(CHECK_VALUE_TOLERANCE);
    // Two shares in closed form [C]: speed_up is gap > 2.2·speed with closing ≤ 0, i.e.
    // (1 − 2.2·30/(2·120)) × 10/25 = 0.725 × 0.4 = 0.29; brake_hard is gap < 1.5·closing, the
    // triangle ∫₀¹⁵ 1.5c dc = 168.75 of the 120 × 25 gap–closing rectangle, 0.05625.
    expect(Math.abs(fine[SPEED_UP]! - 0.29)).toBeLessThan(QUADRATURE_CONVERGENCE);
    expect(Math.abs(fine[BRAKE_HARD]! - 168.75 / 3000)).toBeLessThan(QUADRATURE_CONVERGENCE);
    // Measured (README): hold 45.69 %, ease_off 15.91 %, brake 3.77 %; hold stays under half.
    expect(fine[HOLD]!).toBeLessThan(0.5);
  });

  it('matches scenario.json: advisories, input ranges and a normalisation onto [-1, 1]', () => {
    const scenario = JSON.parse(readFileSync(new URL('../../scenarios/cruise-spacing/scenario.json', import.meta.url), 'utf8'));
    expect(scenario.advisories).toEqual([...ADVISORIES]);
    expect(scenario.inputs.map((i: { min: number; max: number }) => [i.min, i.max])).toEqual(CRUISE_SPACING_BOX.map((r) => [...r]));
    CRUISE_SPACING_BOX.forEach(([lo, hi], j) => {
      expect((lo - scenario.normalize.offset[j]) / scenario.normalize.scale[j]).toBe(-1);
      expect((hi - scenario.normalize.offset[j]) / scenario.normalize.scale[j]).toBe(1);
    });
  });

  it('satisfies every expert expectation in expectations.rules inside its box', () => {
    const scenario = JSON.parse(readFileSync(new URL('../../scenarios/cruise-spacing/scenario.json', import.meta.url), 'utf8'));
    const text = readFileSync(new URL('../../scenarios/cruise-spacing/expectations.rules', import.meta.url), 'utf8');
    const { rules, warnings } = parseRuleFile(text, scenario.inputs, scenario.advisories, 'expectations.rules');
    expect(warnings).toEqual([]);
    expect(rules.length).toBeGreaterThanOrEqual(6);
    // every rule line is preceded by a comment naming its source
    const lines = text.split('\n');
    lines.forEach((line, i) => {
      if (/^E\d+:/.test(line)) expect(lines[i - 1], line).toMatch(/^# .*(\[seen\]|\[from memory|no source)/);
    });
    const rng = createRng(31);
    const x = new Float64Array(3);
    for (const rule of rules) {
      let violations = 0;
      // Random interior points: the boxes are closed, the policy's inequalities strict; the
      // boundary planes have zero volume and are never drawn.
      for (let i = 0; i < 20_000; i++) {
        rule.box.forEach(([lo, hi], j) => (x[j] = lo + (hi - lo) * rng()));
        if (!rule.allowed.includes(cruiseSpacingPolicy(x))) violations++;
      }
      expect(violations, rule.id).toBe(0);
    }
  });
});
