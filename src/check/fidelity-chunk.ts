import type { Evaluator, InputSpec, Rule } from '../types.js';
import { uniformInBox } from '../sampling/index.js';
import { createRng } from '../sampling/rng.js';
import { tableLabel } from '../rules/index.js';
import { deriveSeed } from './derive-seed.js';

/**
 * Samples per fidelity chunk: one onnxruntime batch of the model stage (16,384 rows), so a chunk
 * is one network call wherever it runs. Fixed, not derived from the number of threads: the
 * chunks, their seeds and so the figures are the same for any `--jobs`.
 */
export const FIDELITY_CHUNK = 16_384;

/** What one chunk of the fidelity sample contributes: counts only, summed over chunks. */
export interface FidelityCounts {
  readonly samples: number;
  /** Samples per advisory of the network (length k). */
  readonly total: Float64Array;
  /** Of those, the ones the table labels the same (length k). */
  readonly right: Float64Array;
  readonly agree: number;
  /** Samples no rule covers. */
  readonly uncovered: number;
}

/** Sizes of the chunks of a fidelity sample of n points: FIDELITY_CHUNK each, the last one smaller. */
export function fidelityChunkSizes(n: number): number[] {
  const sizes: number[] = [];
  for (let at = 0; at < n; at += FIDELITY_CHUNK) sizes.push(Math.min(FIDELITY_CHUNK, n - at));
  return sizes;
}

/**
 * Counts agreement between the table (first rule whose box holds the point) and the network on
 * chunk number `chunk` of the fidelity sample: `rows` points uniform over the whole domain from
 * the chunk's own seed (`deriveSeed(seed, "fidelity:<chunk>")`), so every chunk is the same
 * wherever and in whatever order it is computed.
 * @param k number of advisories
 */
export async function fidelityChunk(
  rules: readonly Rule[],
  inputs: readonly InputSpec[],
  evaluate: Evaluator,
  seed: number,
  chunk: number,
  rows: number,
  k: number,
): Promise<FidelityCounts> {
  const d = inputs.length;
  const rng = createRng(deriveSeed(seed, `fidelity:${chunk}`));
  const x = uniformInBox(
    inputs.map((s) => [s.min, s.max] as const),
    rows,
    rng,
  );
  const ev = await evaluate(x, rows);
  const table = tableLabel(rules, x, rows, d);
  const total = new Float64Array(k);
  const right = new Float64Array(k);
  let agree = 0;
  let uncovered = 0;
  for (let i = 0; i < rows; i++) {
    const a = ev.advisory[i]!;
    total[a]!++;
    if (table[i] === a) {
      agree++;
      right[a]!++;
    }
    if (table[i] === -1) uncovered++;
  }
  return { samples: rows, total, right, agree, uncovered };
}
