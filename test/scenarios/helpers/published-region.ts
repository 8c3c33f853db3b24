/**
 * Comparing a mined rule table with a published rule that applies on one region of the input
 * box: which mined rules reach into the region's core with an advisory the published rule does
 * not allow, and how much of the region's volume the table labels with an allowed advisory.
 *
 * Learned boundaries are never exactly the published ones, so each comparison takes a boundary
 * band: `band` × each input's range on either side of the region's edges inside the domain
 * (an edge on the domain's own boundary is no decision boundary and gets no band).
 */
import type { InputSpec, Rule } from '../../../src/types.js';
import { tableLabel } from '../../../src/rules/index.js';
import { createRng } from '../../../src/train/index.js';

type Box = ReadonlyArray<readonly [number, number]>;

/**
 * Where a published rule applies: a closed box (the full range on inputs it does not
 * constrain), intersected with at most one half-space a·x ≤ b when the rule is stated through a
 * ratio of inputs (a time gap or a time to collision: gap ≤ τ·speed is a plane through the
 * origin). One linear constraint keeps the geometry below exact without linear programming.
 */
export interface PublishedRegion {
  /** What the rule says and where it comes from, e.g. "COLREGs (1972) Rule 14: head-on". */
  readonly name: string;
  readonly box: Box;
  readonly linear?: { readonly a: readonly number[]; readonly b: number };
  /** Advisories the published rule allows on the region. */
  readonly allowed: readonly number[];
}

/** A region's box: the whole domain with some inputs narrowed. */
export function regionBox(inputs: readonly InputSpec[], narrowed: Readonly<Record<string, readonly [number, number]>>): [number, number][] {
  return inputs.map((input) => [...(narrowed[input.name] ?? [input.min, input.max])] as [number, number]);
}

/** The band as slack of a·x ≤ b: the largest change of a·x over an L∞ step of band × each range. */
function linearSlack(a: readonly number[], inputs: readonly InputSpec[], band: number): number {
  return inputs.reduce((s, input, j) => s + Math.abs(a[j]!) * (input.max - input.min), 0) * band;
}

/** min of a·x over a box: each coordinate at the end its coefficient's sign picks. */
function minOver(a: readonly number[], box: Box): number {
  return box.reduce((s, [lo, hi], j) => s + a[j]! * (a[j]! > 0 ? lo : hi), 0);
}

/** The region's box narrowed by the band at its edges inside the domain. */
function coreBox(region: PublishedRegion, inputs: readonly InputSpec[], band: number): [number, number][] {
  return region.box.map(([lo, hi], j) => {
    const { min, max } = inputs[j]!;
    const w = band * (max - min);
    return [lo > min ? lo + w : lo, hi < max ? hi - w : hi];
  });
}

/** The part of `box` in the region's core box, or undefined when they do not meet. */
function clipToCore(box: Box, region: PublishedRegion, inputs: readonly InputSpec[], band: number): [number, number][] | undefined {
  const core = coreBox(region, inputs, band);
  const clipped = box.map(([lo, hi], j): [number, number] => [Math.max(lo, core[j]![0]), Math.min(hi, core[j]![1])]);
  return clipped.every(([lo, hi]) => lo <= hi) ? clipped : undefined;
}

/**
 * Whether a box meets the region's core (the region narrowed by the band). Exact: the box part
 * is interval intersection, and the linear constraint is then tested at its minimum over the
 * clipped box.
 */
function ruleMeetsCore(box: Box, region: PublishedRegion, inputs: readonly InputSpec[], band: number): boolean {
  const clipped = clipToCore(box, region, inputs, band);
  if (clipped === undefined) return false;
  if (region.linear === undefined) return true;
  const { a, b } = region.linear;
  return minOver(a, clipped) <= b - linearSlack(a, inputs, band);
}

/**
 * The ids of the rules that give an advisory the published rule does not allow somewhere in the
 * region's core: empty when, away from the region's edges, the table says only what the
 * published rule allows (in particular every rule lying in the region agrees with it).
 */
export function offendingRules(rules: readonly Rule[], region: PublishedRegion, inputs: readonly InputSpec[], band: number): string[] {
  return rules.filter((r) => r.allowed.some((a) => !region.allowed.includes(a)) && ruleMeetsCore(r.box, region, inputs, band)).map((r) => r.id);
}

/** The share of a region's volume where a rule table's label is allowed. */
export interface RegionAgreement {
  /** Points drawn uniformly in the region (or its core). */
  readonly points: number;
  /** Share whose table label is an allowed advisory. */
  readonly agree: number;
  /** Share covered by no rule. */
  readonly uncovered: number;
}

/**
 * Measures, on `n` seeded uniform points of the region's core (the region itself with band 0;
 * rejection sampling against the linear constraint), how much of it the table labels with an
 * allowed advisory: the volume-weighted agreement of the mined rules with the published rule.
 *
 * @throws Error when the core is empty or the linear constraint leaves almost none of its box
 */
export function regionAgreement(
  rules: readonly Rule[],
  region: PublishedRegion,
  inputs: readonly InputSpec[],
  options: { n: number; seed: number; band?: number },
): RegionAgreement {
  const d = inputs.length;
  const band = options.band ?? 0;
  const core = coreBox(region, inputs, band);
  if (core.some(([lo, hi]) => lo > hi)) throw new Error(`${region.name}: the core is empty with band ${band}`);
  const linear = region.linear;
  const limit = linear === undefined ? 0 : linear.b - linearSlack(linear.a, inputs, band);
  const rng = createRng(options.seed);
  const x = new Float64Array(options.n * d);
  let n = 0;
  for (let tries = 0; n < options.n; tries++) {
    if (tries > 1000 * options.n) throw new Error(`${region.name}: the core holds under 0.1 % of its box`);
    let dot = 0;
    for (let j = 0; j < d; j++) {
      const [lo, hi] = core[j]!;
      const v = lo + (hi - lo) * rng();
      x[n * d + j] = v;
      if (linear !== undefined) dot += linear.a[j]! * v;
    }
    if (linear === undefined || dot <= limit) n++;
  }
  const labels = tableLabel(rules, x, n, d);
  let agree = 0;
  let uncovered = 0;
  for (let i = 0; i < n; i++) {
    if (labels[i] === -1) uncovered++;
    else if (region.allowed.includes(labels[i]!)) agree++;
  }
  return { points: n, agree: agree / n, uncovered: uncovered / n };
}

/**
 * The volume-weighted agreement on the region's core (narrowed by `band`) and on the whole
 * region, each on `n` points of seed 1.
 */
export function coreAndWholeAgreement(
  rules: readonly Rule[],
  region: PublishedRegion,
  inputs: readonly InputSpec[],
  options: { band: number; n: number },
): { core: number; whole: number } {
  const at = (band: number): number => regionAgreement(rules, region, inputs, { n: options.n, seed: 1, band }).agree;
  return { core: at(options.band), whole: at(0) };
}
