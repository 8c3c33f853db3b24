import type { CheckedRule, Counterexample, Decision, Evaluator, InputSpec, Rule } from '../types.js';
import { boxSurfacePoints } from '../sampling/index.js';
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
  /**
   * Rows per evaluator call (default CHECK_CHUNK_ROWS). A multiple of the model's batch keeps
   * the onnxruntime calls those of evaluating the whole set at once.
   */
  readonly chunkRows?: number;
}

/**
 * Rows of a rule's dense samples made and evaluated at a time: the model stage's default batch
 * (DEFAULT_BATCH_SIZE in src/model), so the evaluator's onnxruntime calls are the ones it makes
 * for the whole set, and a rule's evidence does not depend on this constant.
 */
export const CHECK_CHUNK_ROWS = 16_384;

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
  const chunkRows = options.chunkRows ?? CHECK_CHUNK_ROWS;
  const out: CheckedRule[] = [];
  // one chunk of points, reused for every chunk of every rule: fresh memory costs a page fault
  // per 4 KiB on first touch, which dominated dense checks and does not parallelise over threads
  const chunk = new Float64Array(chunkRows * d);
  const lo = new Float64Array(d);
  const width = new Float64Array(d);
  for (let r = 0; r < rules.length; r++) {
    const rule = rules[r]!;
    const rng = createRng(deriveSeed(options.seed, `check:${rule.id}`));
    const nSurface = Math.floor(options.samplesPerRule * surfaceShare);
    const nUniform = options.samplesPerRule - nSurface;
    const n = nUniform + nSurface;
    for (let j = 0; j < d; j++) {
      lo[j] = rule.box[j]![0];
      width[j] = rule.box[j]![1] - rule.box[j]![0];
    }
    // the surface points are drawn after every uniform point (the order of the whole-set draw),
    // i.e. when the first chunk reaching them is filled
    let surface: Float64Array | undefined;
    let allowedMask: Uint8Array | undefined;
    let violations = 0;
    let worstMargin = 0;
    let counterexample: Counterexample | undefined;
    for (let start = 0; start < n; start += chunkRows) {
      const rows = Math.min(chunkRows, n - start);
      for (let i = 0; i < rows; i++) {
        const row = start + i;
        if (row < nUniform) {
          for (let j = 0; j < d; j++) chunk[i * d + j] = lo[j]! + rng() * width[j]!;
        } else {
          surface ??= boxSurfacePoints(rule.box, nSurface, rng);
          chunk.set(surface.subarray((row - nUniform) * d, (row - nUniform + 1) * d), i * d);
        }
      }
      const ev = await evaluate(chunk.subarray(0, rows * d), rows);
      const k = ev.scores.length / rows;
      if (!allowedMask) {
        allowedMask = new Uint8Array(k);
        for (const a of rule.allowed) allowedMask[a] = 1;
      }
      for (let i = 0; i < rows; i++) {
        if (allowedMask[ev.advisory[i]!] === 1) continue;
        // A tie between the winner and an allowed advisory is not a violation: the allowed
        // advisory is among the network's best answers (see docs/checking.md).
        const m = violationMargin(ev.scores, i, k, allowedMask, options.decision);
        if (!(m > 0)) continue;
        violations++;
        if (counterexample === undefined || m > worstMargin) {
          worstMargin = m;
          counterexample = {
            x: Array.from(chunk.subarray(i * d, i * d + d)),
            scores: Array.from(ev.scores.subarray(i * k, i * k + k)),
            advisory: ev.advisory[i]!,
            margin: m,
          };
        }
      }
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
