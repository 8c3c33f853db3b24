import type { CheckedRule, Counterexample, Decision, Evaluator, InputSpec, Rule } from '../types.js';
import { boxSurfacePoints, uniformInBox } from '../sampling/index.js';
import { createRng } from '../sampling/rng.js';
import { clopperPearsonUpper } from './clopper-pearson.js';
import { boxVolumeFraction } from './box-volume.js';
import { deriveSeed } from './derive-seed.js';
import { violationMargin } from './violation.js';

export interface CheckOptions {
  readonly seed: number;
  /** Dense samples per rule (uniform in the box plus faces and corners). */
  readonly samplesPerRule: number;
  /** Share of each rule's samples put on the faces and corners of its box. */
  readonly surfaceShare?: number;
  /** Confidence of the one-sided Clopper–Pearson upper bound, e.g. 0.95. */
  readonly confidence: number;
  readonly decision: Decision;
  readonly onProgress?: (done: number, total: number) => void;
}

/**
 * Default share of a rule's dense samples on the faces and corners of its box: boundaries are
 * where neighbouring regions meet, so violations concentrate there. Common practice, no source.
 */
export const SURFACE_SHARE_DEFAULT = 0.1;

/**
 * Checks each rule on fresh dense samples inside its box: counts the samples where the network
 * (run by the given evaluator) gives an advisory the rule does not allow, strictly ahead of
 * every allowed advisory (exact ties, which occur on shared faces of constructed networks,
 * are not violations), states the exact
 * one-sided upper confidence bound on the violation rate (Clopper & Pearson, "The use of
 * confidence or fiducial limits illustrated in the case of the binomial", Biometrika 26(4),
 * 1934), and keeps the worst counterexample (largest score margin of a wrong advisory over
 * the best allowed one). Status `refuted` when any violation was seen, else `sampled`.
 *
 * Each rule's samples depend only on (seed, rule id), not on the order of the rules.
 */
export async function checkRules(
  rules: readonly Rule[],
  inputs: readonly InputSpec[],
  evaluate: Evaluator,
  options: CheckOptions,
): Promise<CheckedRule[]> {
  const d = inputs.length;
  const surfaceShare = options.surfaceShare ?? SURFACE_SHARE_DEFAULT;
  const out: CheckedRule[] = [];
  for (let r = 0; r < rules.length; r++) {
    const rule = rules[r]!;
    const rng = createRng(deriveSeed(options.seed, `check:${rule.id}`));
    const nSurface = Math.floor(options.samplesPerRule * surfaceShare);
    const nUniform = options.samplesPerRule - nSurface;
    const inside = uniformInBox(rule.box, nUniform, rng);
    const surface = boxSurfacePoints(rule.box, nSurface, rng);
    const n = nUniform + nSurface;
    const x = new Float64Array(n * d);
    x.set(inside, 0);
    x.set(surface.subarray(0, nSurface * d), nUniform * d);
    const ev = await evaluate(x, n);
    const k = ev.scores.length / n;
    const allowedMask = new Uint8Array(k);
    for (const a of rule.allowed) allowedMask[a] = 1;
    let violations = 0;
    let worstRow = -1;
    let worstMargin = 0;
    for (let i = 0; i < n; i++) {
      if (allowedMask[ev.advisory[i]!] === 1) continue;
      // A tie between the winner and an allowed advisory is not a violation: the allowed
      // advisory is among the network's best answers (see docs/checking.md).
      const m = violationMargin(ev.scores, i, k, allowedMask, options.decision);
      if (!(m > 0)) continue;
      violations++;
      if (worstRow < 0 || m > worstMargin) {
        worstRow = i;
        worstMargin = m;
      }
    }
    let counterexample: Counterexample | undefined;
    if (worstRow >= 0) {
      counterexample = {
        x: Array.from(x.subarray(worstRow * d, worstRow * d + d)),
        scores: Array.from(ev.scores.subarray(worstRow * k, worstRow * k + k)),
        advisory: ev.advisory[worstRow]!,
        margin: worstMargin,
      };
    }
    out.push({
      rule,
      evidence: {
        status: violations > 0 ? 'refuted' : 'sampled',
        samples: n,
        violations,
        violationBound: clopperPearsonUpper(violations, n, options.confidence),
        confidence: options.confidence,
        volumeFraction: boxVolumeFraction(rule.box, inputs),
        ...(counterexample ? { counterexample } : {}),
      },
    });
    options.onProgress?.(r + 1, rules.length);
  }
  return out;
}
