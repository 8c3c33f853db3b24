/**
 * The mine settings the benchmarks start from: the CLI's defaults, seed 1, no proofs and no
 * repair (the benchmarks time those themselves). Not a benchmark (run-all skips `_` files).
 */
import type { MineSettings } from '../src/pipeline/mine.js';
import { MINE_DEFAULTS } from '../src/cli/commands/mine.js';

/** The CLI's default mine settings without proofs, on `jobs` threads. */
export function benchMineSettings(jobs: number): MineSettings {
  return {
    seed: 1,
    budget: MINE_DEFAULTS.samples,
    boundaryShare: MINE_DEFAULTS.boundaryShare,
    maxRules: MINE_DEFAULTS.maxRules,
    minLeaf: MINE_DEFAULTS.minLeaf,
    roundTolerance: MINE_DEFAULTS.roundTolerance,
    checkSamples: MINE_DEFAULTS.checkSamples,
    fidelitySamples: MINE_DEFAULTS.fidelitySamples,
    confidence: 0.95,
    prove: false,
    proveBoxes: MINE_DEFAULTS.proveBoxes,
    proveSeconds: MINE_DEFAULTS.proveSeconds,
    jobs,
    repair: false,
  };
}
