/**
 * The sampling benchmark's fresh-process runs: run as a script (`freshChild`) in a new process
 * per measurement, started by `freshShares`. Not a benchmark (run-all skips `_` files).
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { loadModel } from '../src/model/index.js';
import { modelJobs } from '../src/pipeline/model-jobs.js';
import { sampleDomain } from '../src/sampling/index.js';
import { benchScenario, CLI, INPUTS, rawInput, rawRun, rawSession } from './_sampling-setup.js';

/** The argument that makes this file run one fresh-process measurement (`freshChild`). */
const FRESH_CHILD = '--fresh-child';
/** Fresh processes per measured size. */
export const FRESH_RUNS = 3;
/** Untimed raw batches before raw is timed in a fresh process. */
export const RAW_WARM_RUNS = 3;

/**
 * One fresh-process measurement, as a CLI run meets sampling: a new process, the model loaded
 * as the CLI loads it (its one-row probe run only), then the first `sampleDomain` call
 * (compiler cold, result arrays and onnxruntime's working memory fresh) with the CLI's default
 * boundary share in this thread; then raw on the same number of rows in a one-thread session
 * after RAW_WARM_RUNS untimed batches (raw is the steady-state reference: onnxruntime's first
 * two full batches fault in its working memory, docs/sampling.md). Prints {"sampleMs", "rawMs"}.
 */
async function freshChild(modelPath: string, samples: number): Promise<void> {
  const scenario = benchScenario(modelPath);
  const model = await loadModel(scenario, { threads: 1 });
  const raw = await rawSession(modelPath, 1);
  const input = rawInput();
  for (let w = 0; w < RAW_WARM_RUNS; w++) await raw.run({ input });
  const t0 = performance.now();
  await sampleDomain(INPUTS, modelJobs(scenario, model, 1).labeller, { seed: 1, budget: samples, boundaryShare: CLI.boundaryShare });
  const sampleMs = performance.now() - t0;
  const rawMs = await rawRun(raw, input, samples);
  process.stdout.write(JSON.stringify({ sampleMs, rawMs }) + '\n');
  await raw.release();
  await model.close();
}

if (process.argv[2] === FRESH_CHILD) await freshChild(process.argv[3]!, Number(process.argv[4]));

/** Shares raw / sampleDomain of FRESH_RUNS fresh processes (`freshChild`), in run order. */
export function freshShares(modelPath: string, samples: number): number[] {
  return Array.from({ length: FRESH_RUNS }, () => {
    const r = spawnSync(process.execPath, [...process.execArgv, fileURLToPath(import.meta.url), FRESH_CHILD, modelPath, String(samples)], { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(`fresh-process sampling run failed: ${r.stderr}`);
    const { sampleMs, rawMs } = JSON.parse(r.stdout.trim().split('\n').pop()!) as { sampleMs: number; rawMs: number };
    return rawMs / sampleMs;
  });
}
